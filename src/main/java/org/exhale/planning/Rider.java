package org.exhale.planning;

import java.util.ArrayList;
import java.util.List;

import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeStepper;
import org.exhale.simulation.GasRegime;
import org.exhale.simulation.SimulationSettings;

/**
 * The closed-loop rider, the planner's backbone (MODEL.md §9). From the simulated state of every
 * corner (each with its own conversions, gas under the cap and wafer lag), it takes at each
 * instant the highest setpoint that keeps every instantaneous limit, no faster than the tool.
 *
 * <p><b>Admissible.</b> A segment to a setpoint is admissible when the bake, integrated over it at
 * every corner with the gas equations the proof will use, keeps every limit with the margin asked,
 * and when, after it, the bake still has a safe continuation over a look-ahead of three times the
 * wafer lag plus the gas relaxation time: holding the setpoint, or cooling at the fastest rate.
 * Without the look-ahead the lag and the stored gas would carry the bake over a limit after the
 * rider stops climbing. Where the admissible temperature falls faster than that look-ahead sees (a
 * rate that rises with conversion), a ride can still cross a limit: it says so
 * ({@link Ride#admissibleThroughout}), and the planner then rides again looking four times as far.
 *
 * <p><b>The ride</b> ({@link #ride}) applies this on a fine control interval with unlimited steps:
 * its time to the residue target is the benchmark a recipe with few steps is measured against
 * ({@code ride_s}). <b>The recipe</b> ({@link #build}) places the tool's few steps along the ride:
 * each segment's end is the highest admissible setpoint on the tool's grid over the segment, from
 * where the recipe so far really leaves the bake; a segment that can reach the cap snaps to it, as
 * fast as admissible; the final hold lasts until the target is met at every corner.
 */
final class Rider {
    private final BakeCase bake;
    private final Tool tool;
    private final double capK;
    private final double startK;
    private final GasRegime regime;
    private final double gasScale;
    private final SimulationSettings settings;
    private final double lagS;
    private final double residue;
    /** Whether a continuation that cools at the fastest rate counts as safe (only when no hold is). */
    private boolean coolAllowed;
    /** A guess whose margin is within this (log) band above the one asked is taken without search. */
    private static final double BAND = 5e-4;
    /** The smallest margin every segment must keep. */
    private double margin = 1.001;
    /** The look-ahead, in units of the wafer lag plus the gas relaxation time. */
    private double lookAhead = LOOK_AHEAD;
    static final double LOOK_AHEAD = 3;
    private int trials;

    Rider(BakeCase bake, Tool tool, double capK, GasRegime regime, double gasScale) {
        this.bake = bake;
        this.tool = tool;
        this.capK = capK;
        this.startK = bake.recipeStartK();
        this.regime = regime;
        this.gasScale = gasScale;
        this.settings = SimulationSettings.defaults().withSampleInterval(0).withStiffTolerance(1e-4);
        this.lagS = bake.wafer().lagS();
        this.residue = bake.limits().residue();
    }

    void setMargin(double m) {
        this.margin = m;
    }

    void setLookAhead(double units) {
        this.lookAhead = units;
    }

    double lookAhead() {
        return lookAhead;
    }

    double margin() {
        return margin;
    }

    int trials() {
        return trials;
    }

    /** A ride: its time to the target (NaN when it never gets there) and its setpoint path. */
    record Ride(double timeToTargetS, double[] timesS, double[] setpointsK, double[] unconverted,
                boolean admissibleThroughout, double reachesCapS) {
    }

    /** A recipe built along the ride, with its predicted time to target at the end of the final hold. */
    record Built(Recipe recipe, double holdEndS, boolean admissibleThroughout) {
    }

    BakeStepper start() {
        return BakeStepper.start(bake, regime, gasScale, settings);
    }

    /** The ride with unlimited steps on a control interval of {@code controlS}, until the target or {@code horizonS}. */
    Ride ride(double controlS, double horizonS) {
        BakeStepper st = start();
        List<double[]> path = new ArrayList<>();
        path.add(new double[]{0, startK, st.unconverted()});
        boolean ok = true;
        double lastIncrement = tool.maxRampUpKPerS() * controlS;
        double reachesCap = Double.NaN;
        while (st.timeS() < horizonS) {
            double sp = st.setpointK();
            double hi = Math.min(capK, sp + tool.maxRampUpKPerS() * controlS);
            double lo = Math.max(startK, sp - tool.maxRampDownKPerS() * controlS);
            double next = highest(st, controlS, lo, hi, sp + lastIncrement, 0.1);
            if (Double.isNaN(next)) {
                // no setpoint can hold afterwards: cool as the limits allow
                coolAllowed = true;
                next = highest(st, controlS, lo, hi, lo, 0.1);
                coolAllowed = false;
                if (Double.isNaN(next)) {
                    ok = false;
                    next = lo;
                }
            }
            lastIncrement = next - sp;
            BakeStepper before = st.copy();
            st.advance(next, controlS);
            path.add(new double[]{st.timeS(), next, st.unconverted()});
            if (Double.isNaN(reachesCap) && next >= capK - 1e-9) {
                reachesCap = st.timeS();
            }
            if (st.unconverted() <= residue) {
                double tx = crossing(before, next, controlS);
                return new Ride(tx, column(path, 0), column(path, 1), column(path, 2), ok, reachesCap);
            }
        }
        return new Ride(Double.NaN, column(path, 0), column(path, 1), column(path, 2), ok, reachesCap);
    }

    /**
     * How a recipe is built along the ride. The ride's own times serve when the recipe keeps pace with
     * the ride; where the setpoint grid rounds ramp ends down, the recipe falls behind, and ramps timed
     * on the ride's clock then end before the recipe has got as far, so its last ramp ends short of the
     * ride's final climb and a long hold at a low setpoint follows. Measuring each ramp from where the
     * recipe's progress stands on the ride keeps the knots at the same progress.
     */
    enum Rule {
        /** Knots at the ride's times; a ramp whose end the grid rounded down is made as short as admissible. */
        RIDE_TIMES_SHORTENED,
        /** Knots at the ride's times, each ramp as long as the ride's interval. */
        RIDE_TIMES,
        /**
         * Each ramp lasts as long as the ride took from the recipe's present progress (its unconverted
         * fraction) to the knot; a ramp whose end the grid rounded below the ride's setpoint there is
         * raised one grid step when a ramp up to half again as long reaches it admissibly.
         */
        PROGRESS
    }

    /**
     * A recipe along the ride: ramps ending at the ride's times {@code knotTimesS} (after the start),
     * each to the highest admissible setpoint on the tool's grid, then the final hold and the
     * cool-down. At most {@code maxRamps} ramps, the last one to the cap when the knots end below it.
     * The {@link Rule} sets how long each ramp lasts. Shortening a ramp whose end the grid rounded
     * down gains time, but can leave the bake nearer a limit that tightens under a hold (autocatalytic
     * kinetics); no rule is best on every case, so the planner builds by each and keeps the shortest.
     */
    Built build(Ride ride, double[] knotTimesS, int maxRamps, Rule rule) {
        BakeStepper st = start();
        List<Step> steps = new ArrayList<>();
        double ts = Math.max(tool.timeStepS(), 1e-3);
        double minStep = Math.max(tool.minStepS(), ts);
        boolean ok = true;
        boolean progress = rule == Rule.PROGRESS;
        boolean shorten = rule == Rule.RIDE_TIMES_SHORTENED;
        double prev = 0;
        int used = 0;
        double lastStartK = Double.NaN;
        for (int i = 0; i < knotTimesS.length && used < maxRamps; i++) {
            double sp = st.setpointK();
            if (sp >= capK - 1e-9) {
                break;
            }
            double from = progress ? rideTimeAt(ride, st.unconverted()) : prev;
            if (progress && knotTimesS[i] - from < minStep && i < knotTimesS.length - 1) {
                continue;   // the recipe is already as far as the ride was at this knot
            }
            double d = Math.max(Planner.ceilTo(knotTimesS[i] - from, ts), minStep);
            prev = knotTimesS[i];
            boolean lastRamp = used == maxRamps - 1;
            double hiK = Math.min(capK, Planner.floorSetpoint(sp + tool.maxRampUpKPerS() * d, tool.setpointStepK()));
            double end;
            {
                double loK = Math.max(startK, sp - tool.maxRampDownKPerS() * d);
                end = highestOnGrid(st, d, loK, hiK, interpolate(ride, knotTimesS[i]));
                if (Double.isNaN(end)) {
                    ok = false;
                    end = Math.max(startK, Planner.ceilTo(loK - org.exhale.PhysicalConstants.ZERO_CELSIUS_K,
                            Math.max(tool.setpointStepK(), 0)) + org.exhale.PhysicalConstants.ZERO_CELSIUS_K);
                } else if (progress && end < capK - 1e-9 && tool.setpointStepK() > 0
                        && Planner.floorSetpoint(interpolate(ride, knotTimesS[i]), tool.setpointStepK()) > end + 1e-9) {
                    // the grid rounded the end below the ride's setpoint there: reach the next grid value a little later
                    double up = Math.min(capK, end + tool.setpointStepK());
                    double later = shortestTo(st, up, d, Planner.ceilTo(1.5 * d, ts), ts);
                    if (!Double.isNaN(later)) {
                        d = later;
                        end = up;
                    }
                } else if (end > sp && end < capK - 1e-9 && shorten) {
                    // the grid rounded the end down: get there sooner, as fast as is admissible
                    double fastest = Math.max(Planner.ceilTo((end - sp) / tool.maxRampUpKPerS(), ts), minStep);
                    double shorter = shortestTo(st, end, Math.min(fastest, d), d, ts);
                    if (!Double.isNaN(shorter)) {
                        prev -= d - shorter;
                        d = shorter;
                    }
                }
            }
            if (end >= capK - 1e-9) {
                // snap to the cap: the shortest admissible duration of a ramp to it
                end = capK;
                double fastest = Math.max(Planner.ceilTo((capK - sp) / tool.maxRampUpKPerS(), ts), minStep);
                d = shortestTo(st, capK, fastest, lastRamp ? Math.max(d, fastest) * 64 : Math.max(d, fastest), ts);
                if (Double.isNaN(d)) {
                    ok = false;
                    d = Math.max(fastest, Planner.ceilTo(knotTimesS[Math.min(i, knotTimesS.length - 1)], ts));
                }
            }
            if (end > sp && end < capK - 1e-9 && (lastRamp || i == knotTimesS.length - 1)) {
                // the final ramp: a longer one may end higher and shorten the hold after it by more than it adds
                double[] better = longerFinalRamp(st, end, d, ts, minStep);
                end = better[0];
                d = better[1];
            }
            Step step = Math.abs(end - sp) < 1e-9 ? new Step.Hold(d) : new Step.Ramp(end, Math.abs(end - sp) / d);
            st.advance(end, d);
            if (!steps.isEmpty() && continues(lastStartK, steps.get(steps.size() - 1), step)) {
                // the same ramp goes on at the same rate (typically the fastest): one step, which leaves a step for later
                Step.Ramp prevRamp = (Step.Ramp) steps.get(steps.size() - 1);
                steps.set(steps.size() - 1, new Step.Ramp(end, prevRamp.rateKPerS()));
                continue;
            }
            steps.add(step);
            lastStartK = sp;
            used++;
        }
        return finish(st, steps, used, maxRamps, ts, minStep, ok);
    }

    /**
     * Whether {@code next} (which starts where {@code last} ends) continues the ramp {@code last}, which started at
     * {@code lastStartK}, at the same rate in the same direction: then the two are one step of the tool with the same
     * setpoint path.
     */
    static boolean continues(double lastStartK, Step last, Step next) {
        if (!(last instanceof Step.Ramp a) || !(next instanceof Step.Ramp b)) {
            return false;
        }
        boolean upA = a.targetK() > lastStartK;
        boolean upB = b.targetK() > a.targetK();
        return upA == upB && Math.abs(a.rateKPerS() - b.rateKPerS()) <= 1e-9 * Math.max(a.rateKPerS(), b.rateKPerS());
    }

    /**
     * The final ramp to {@code endK} over {@code d}, or a longer one (1.5, 2, 3 times) to the highest
     * admissible grid setpoint over its duration, whichever meets the target sooner with the hold after it:
     * {end, duration}.
     */
    private double[] longerFinalRamp(BakeStepper st, double endK, double d, double ts, double minStep) {
        double sp = st.setpointK();
        double[] best = {endK, d};
        double bestS = finishS(st, endK, d, ts, minStep);
        for (double f : new double[]{1.5, 2, 3}) {
            double dl = Planner.ceilTo(f * d, ts);
            double hiK = Math.min(capK, Planner.floorSetpoint(sp + tool.maxRampUpKPerS() * dl, tool.setpointStepK()));
            if (hiK <= best[0] + 1e-9) {
                continue;
            }
            double e = highestOnGrid(st, dl, best[0], hiK, best[0]);
            if (Double.isNaN(e) || e <= best[0] + 1e-9) {
                continue;
            }
            double total = finishS(st, e, dl, ts, minStep);
            if (total < bestS) {
                bestS = total;
                best = new double[]{e, dl};
            }
        }
        return best;
    }

    /** The ramp's duration plus the hold after it that takes every corner to the target (infinite if none). */
    private double finishS(BakeStepper st, double endK, double d, double ts, double minStep) {
        BakeStepper s = st.copy();
        s.advance(endK, d);
        double hold = holdToTarget(s, ts, minStep);
        return Double.isNaN(hold) ? Double.POSITIVE_INFINITY : d + hold;
    }

    /** One more ramp to the cap when the target is far, then the final hold and the cool-down. */
    private Built finish(BakeStepper st, List<Step> steps, int used, int maxRamps, double ts, double minStep, boolean ok) {
        if (st.setpointK() < capK - 1e-9 && used < maxRamps && holdToTarget(st, ts, minStep) > 3600) {
            // the knots ended well short of the target: one more ramp to the cap, as fast as admissible
            double sp = st.setpointK();
            double fastest = Math.max(Planner.ceilTo((capK - sp) / tool.maxRampUpKPerS(), ts), minStep);
            double d = shortestTo(st, capK, fastest, fastest * 64, ts);
            if (Double.isNaN(d)) {
                ok = false;
                d = fastest * 64;
            }
            steps.add(new Step.Ramp(capK, (capK - sp) / d));
            st.advance(capK, d);
        }
        // the final hold at the last setpoint until every corner meets the target
        double hold = holdToTarget(st, ts, minStep);
        if (Double.isNaN(hold)) {
            return null;
        }
        steps.add(new Step.Hold(hold));
        double holdEnd = st.timeS() + hold;
        double top = st.setpointK();
        if (tool.hasUnload() && tool.unloadK() < top) {
            double dr = Planner.ceilTo(Math.max((top - tool.unloadK()) / tool.maxRampDownKPerS(), tool.minStepS()), ts);
            steps.add(new Step.Ramp(tool.unloadK(), (top - tool.unloadK()) / dr));
        }
        return new Built(new Recipe(startK, steps), holdEnd, ok);
    }

    /** The hold at the current setpoint that takes every corner to the target, on the tool's time grid; NaN if a day is not enough. */
    private double holdToTarget(BakeStepper st, double ts, double minStep) {
        double sp = st.setpointK();
        double chunk = Math.max(60, minStep);
        BakeStepper s = st.copy();
        double elapsed = 0;
        while (s.unconverted() > residue) {
            if (elapsed > 24 * 3600) {
                return Double.NaN;
            }
            BakeStepper before = s.copy();
            s.advance(sp, chunk);
            if (s.unconverted() <= residue) {
                double tx = crossing(before, sp, chunk) - st.timeS();
                return Math.max(Planner.ceilTo(tx, ts), minStep);
            }
            elapsed += chunk;
            chunk = Math.min(chunk * 1.5, 1800);
        }
        return minStep;
    }

    /** When the bake, from {@code before} along a segment to endK over d, first meets the target (bisection, 0.1 s). */
    private double crossing(BakeStepper before, double endK, double d) {
        double lo = 0;
        double hi = d;
        double rate = (endK - before.setpointK()) / d;
        while (hi - lo > 0.1) {
            double mid = 0.5 * (lo + hi);
            BakeStepper s = before.copy();
            s.advance(before.setpointK() + rate * mid, mid);
            if (s.unconverted() <= residue) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return before.timeS() + hi;
    }

    /**
     * The shortest duration in [fastest, slowest] on the time grid of an admissible ramp to endK; NaN
     * if none. Regula falsi (Illinois) on the margin between the two ends, to 0.5 % of the duration.
     */
    private double shortestTo(BakeStepper st, double endK, double fastest, double slowest, double ts) {
        double fa = f(st, endK, fastest);
        if (fa >= 0) {
            return fastest;
        }
        double fb = f(st, endK, slowest);
        if (fb < 0) {
            return Double.NaN;
        }
        double a = fastest;    // fails
        double b = slowest;    // passes
        int side = 0;
        while (b - a > Math.max(ts, 0.005 * b)) {
            double m;
            if (Double.isFinite(fa) && Double.isFinite(fb) && fb != fa) {
                m = b - fb * (b - a) / (fb - fa);
                m = Math.min(Math.max(m, a + 0.1 * (b - a)), b - 0.1 * (b - a));
            } else {
                m = 0.5 * (a + b);
            }
            m = Planner.ceilTo(m, ts);
            if (m >= b || m <= a) {
                break;
            }
            double fm = f(st, endK, m);
            if (fm >= 0) {
                b = m;
                fb = fm;
                if (side == 1) {
                    fa *= 0.5;
                }
                side = 1;
            } else {
                a = m;
                fa = fm;
                if (side == -1) {
                    fb *= 0.5;
                }
                side = -1;
            }
        }
        return b;
    }

    /**
     * The highest admissible end setpoint on the tool's setpoint grid in [lo, hi]; NaN if none. Starts
     * at the grid point nearest {@code guessK} (the ride's setpoint there) and steps away from it
     * with doubling steps until the boundary is bracketed, then bisects.
     */
    private double highestOnGrid(BakeStepper st, double d, double lo, double hi, double guessK) {
        double step = tool.setpointStepK();
        if (step <= 0) {
            return highest(st, d, lo, hi, guessK, 0.01);
        }
        double c0 = org.exhale.PhysicalConstants.ZERO_CELSIUS_K;
        long a = (long) Math.ceil((lo - c0) / step - 1e-9);
        long b = (long) Math.floor((hi - c0) / step + 1e-9);
        if (b < a) {
            return Double.NaN;
        }
        long g = Math.min(Math.max(Math.round((guessK - c0) / step), a), b);
        long pass;
        long fail;
        if (admissible(st, c0 + g * step, d)) {
            pass = g;
            long w = 1;
            while (true) {
                if (pass == b) {
                    return c0 + b * step;
                }
                long up = Math.min(b, pass + w);
                if (admissible(st, c0 + up * step, d)) {
                    pass = up;
                    w *= 2;
                } else {
                    fail = up;
                    break;
                }
            }
        } else {
            fail = g;
            long w = 1;
            while (true) {
                if (fail == a) {
                    return Double.NaN;
                }
                long down = Math.max(a, fail - w);
                if (admissible(st, c0 + down * step, d)) {
                    pass = down;
                    break;
                }
                fail = down;
                w *= 2;
            }
        }
        while (fail - pass > 1) {
            long m = (pass + fail) / 2;
            if (admissible(st, c0 + m * step, d)) {
                pass = m;
            } else {
                fail = m;
            }
        }
        return c0 + pass * step;
    }

    /** The time at which the ride had converted as far as {@code u} (linear between its points). */
    static double rideTimeAt(Ride ride, double u) {
        double[] ts = ride.timesS();
        double[] us = ride.unconverted();
        if (u >= us[0]) {
            return 0;
        }
        for (int i = 1; i < ts.length; i++) {
            if (us[i] <= u) {
                double f = (us[i - 1] - u) / (us[i - 1] - us[i]);
                return ts[i - 1] + f * (ts[i] - ts[i - 1]);
            }
        }
        return ts[ts.length - 1];
    }

    private static double interpolate(Ride ride, double t) {
        double[] ts = ride.timesS();
        double[] sp = ride.setpointsK();
        for (int i = 1; i < ts.length; i++) {
            if (t <= ts[i]) {
                double f = (t - ts[i - 1]) / (ts[i] - ts[i - 1]);
                return sp[i - 1] + f * (sp[i] - sp[i - 1]);
            }
        }
        return sp[sp.length - 1];
    }

    /**
     * The highest admissible end setpoint in [lo, hi] to within tol; NaN if none. The search works on
     * the margin itself, f(T) = ln(score(T)/margin), which is smooth in T: it starts from
     * {@code guess} (where last interval's boundary was), accepts it outright when its margin is
     * within 0.3 % above the one asked, and otherwise brackets the boundary and closes in by
     * regula falsi (Illinois), so a smoothly moving boundary costs one or two trials.
     */
    private double highest(BakeStepper st, double d, double lo, double hi, double guess, double tol) {
        double g = Math.min(Math.max(guess, lo), hi);
        double fg = f(st, g, d);
        if (fg >= 0 && (fg <= BAND || g >= hi)) {
            return g;
        }
        double a;
        double fa;
        double b;
        double fb;
        if (fg >= 0) {
            a = g;
            fa = fg;
            double fh = f(st, hi, d);
            if (fh >= 0) {
                return hi;
            }
            b = hi;
            fb = fh;
        } else {
            b = g;
            fb = fg;
            double w = Math.max(tol, 0.02 * (hi - lo));
            while (true) {
                double down = Math.max(lo, b - w);
                double fd = f(st, down, d);
                if (fd >= 0) {
                    a = down;
                    fa = fd;
                    break;
                }
                b = down;
                fb = fd;
                if (down <= lo) {
                    return Double.NaN;
                }
                w *= 4;
            }
        }
        int side = 0;
        while (b - a > tol) {
            double m;
            if (Double.isFinite(fa) && Double.isFinite(fb) && fa != fb) {
                m = a + fa * (b - a) / (fa - fb);
                m = Math.min(Math.max(m, a + 0.25 * tol), b - 0.25 * tol);
            } else {
                m = 0.5 * (a + b);
            }
            double fm = f(st, m, d);
            if (fm >= 0) {
                if (fm <= BAND) {
                    return m;
                }
                a = m;
                fa = fm;
                if (side == 1) {
                    fb *= 0.5;
                }
                side = 1;
            } else {
                b = m;
                fb = fm;
                if (side == -1) {
                    fa *= 0.5;
                }
                side = -1;
            }
        }
        return a;
    }

    /** ln(score/margin): non-negative exactly when the segment is admissible. */
    private double f(BakeStepper st, double endK, double d) {
        double sc = score(st, endK, d);
        return sc == Double.POSITIVE_INFINITY ? Double.POSITIVE_INFINITY : sc <= 0 ? -50 : Math.log(sc / margin);
    }

    /** Whether a segment to endK over d keeps every limit and leaves a safe continuation (see the class comment). */
    boolean admissible(BakeStepper st, double endK, double d) {
        return score(st, endK, d) >= margin;
    }

    /**
     * The smallest margin over a segment to endK over d and its best safe continuation (holding; or,
     * when {@link #coolAllowed}, cooling at the fastest rate): admissible when at least the margin asked.
     */
    double score(BakeStepper st, double endK, double d) {
        trials++;
        BakeStepper s = st.copy();
        double m = s.advance(endK, d);
        if (m < margin) {
            return m;
        }
        double look = lookAhead * (lagS + s.relaxationTimeS());
        if (look < 1e-3 * d || !Double.isFinite(look)) {
            return m;
        }
        look = Math.min(look, 4 * 3600);
        BakeStepper hold = s.copy();
        double mh = Math.min(m, hold.advance(endK, look));
        if (mh >= margin || !coolAllowed) {
            return mh;
        }
        BakeStepper cool = s.copy();
        double down = Math.max(Math.min(startK, endK), endK - tool.maxRampDownKPerS() * look);
        trials++;
        return Math.max(mh, Math.min(m, cool.advance(down, look)));
    }

    private static double[] column(List<double[]> rows, int c) {
        double[] out = new double[rows.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = rows.get(i)[c];
        }
        return out;
    }
}
