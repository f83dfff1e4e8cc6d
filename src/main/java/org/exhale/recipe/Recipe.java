package org.exhale.recipe;

import java.util.ArrayList;
import java.util.List;

/**
 * A bake recipe: a start setpoint and an ordered list of ramps and holds. The setpoint program is
 * piecewise linear; {@link #segments()} gives one linear piece per step.
 */
public record Recipe(double startK, List<Step> steps) {
    public Recipe {
        if (!(startK > 0 && startK <= 3000)) {
            throw new IllegalArgumentException("recipe start must be a temperature in (−273.15 C, 3000 K]");
        }
        if (steps == null || steps.isEmpty()) {
            throw new IllegalArgumentException("recipe needs at least one step");
        }
        steps = List.copyOf(steps);
        double t = startK;
        for (int i = 0; i < steps.size(); i++) {
            if (steps.get(i) instanceof Step.Ramp r) {
                if (Math.abs(r.targetK() - t) < 1e-9) {
                    throw new IllegalArgumentException("step " + (i + 1) + " ramps to the temperature it starts at ("
                            + (t - 273.15) + " C); use a hold");
                }
                t = r.targetK();
            }
        }
    }

    /** The linear pieces of the setpoint program, one per step. */
    public List<Segment> segments() {
        List<Segment> out = new ArrayList<>(steps.size());
        double t = 0;
        double temp = startK;
        for (int i = 0; i < steps.size(); i++) {
            Step s = steps.get(i);
            if (s instanceof Step.Ramp r) {
                double d = Math.abs(r.targetK() - temp) / r.rateKPerS();
                out.add(new Segment(i, t, t + d, temp, r.targetK()));
                t += d;
                temp = r.targetK();
            } else if (s instanceof Step.Hold h) {
                out.add(new Segment(i, t, t + h.durationS(), temp, temp));
                t += h.durationS();
            }
        }
        return out;
    }

    public double durationS() {
        List<Segment> seg = segments();
        return seg.get(seg.size() - 1).endTimeS();
    }

    /** Where the residue target applies: the end of the final hold (see {@link ResidueCheckpoint}). */
    public ResidueCheckpoint residueCheckpoint() {
        return ResidueCheckpoint.of(this);
    }

    /** Highest setpoint of the program [K]. */
    public double maxSetpointK() {
        double m = startK;
        for (Step s : steps) {
            if (s instanceof Step.Ramp r) {
                m = Math.max(m, r.targetK());
            }
        }
        return m;
    }

    /** The final setpoint [K]. */
    public double endK() {
        double t = startK;
        for (Step s : steps) {
            if (s instanceof Step.Ramp r) {
                t = r.targetK();
            }
        }
        return t;
    }

    /** A copy with the given step appended. */
    public Recipe then(Step step) {
        List<Step> list = new ArrayList<>(steps);
        list.add(step);
        return new Recipe(startK, list);
    }
}
