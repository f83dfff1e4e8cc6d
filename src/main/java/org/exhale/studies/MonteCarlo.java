package org.exhale.studies;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Polymer;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.Chamber;
import org.exhale.simulation.Margin;
import org.exhale.simulation.SimulationSettings;
import org.exhale.simulation.Wafer;
import org.exhale.transport.CapFilm;

/**
 * Monte Carlo sampling of an {@link Uncertainty} around a nominal case.
 *
 * <p>Each parameter is normal with the case's value as its mean and the given standard deviation,
 * truncated to its physical range by rejection (a draw outside the range is drawn again, so the
 * shape inside the range is kept; no value is ever clamped). A component's activation energy and
 * ln A are drawn as a correlated pair. Sample {@code i} draws every parameter from its own stream,
 * a {@link SplittableRandom} seeded from (seed, i, parameter) by the SplitMix64 finaliser, so a
 * sample does not depend on the thread that runs it, on the number of threads, nor on which other
 * parameters are uncertain.
 *
 * <p>Ranges: porosity (0, 0.999); pore radius (0, 100 µm); thickness (0, 1 mm) and below the span's
 * own limit of the cap structure; tortuosity [1, 1000); spread [0, 200) K; lag [0, 1e5) s; purge
 * (0, 1000) mol/s; density (10, 30 000) kg/m³; activation energy (0, 1000) kJ/mol; A (0, 1e40) 1/s.
 */
public final class MonteCarlo {
    /** Draws tried before a truncation is declared to leave (almost) nothing. */
    static final int MAX_TRIES = 10_000;
    /** The settings of every sample's simulation: no history rows (margins need none). */
    public static final SimulationSettings SETTINGS = SimulationSettings.defaults().withSampleInterval(0);

    private MonteCarlo() {
    }

    /** What a sampled value is. */
    public enum Kind { EA, LN_A, POROSITY, PORE_RADIUS, THICKNESS, TORTUOSITY, SPREAD, LAG, PURGE, DENSITY }

    /**
     * One uncertain parameter.
     *
     * @param name      column name (with its display unit)
     * @param kind      what it is
     * @param component index of the component (EA, LN_A), else −1
     * @param nominal   mean, SI
     * @param sd        standard deviation, SI
     * @param lo        lower end of the physical range (open or closed as {@link #inside} says)
     * @param hi        upper end
     * @param scale     display value = SI / scale (kJ/mol, nm, ...; temperature differences in K)
     */
    public record Parameter(String name, Kind kind, int component, double nominal, double sd, double lo, double hi,
                            double scale, double correlation) {
        boolean inside(double v) {
            return switch (kind) {
                case SPREAD, LAG -> v >= lo && v < hi;
                case TORTUOSITY -> v >= lo && v < hi;
                default -> v > lo && v < hi;
            };
        }

        public double display(double si) {
            return si / scale;
        }
    }

    /** The uncertain parameters of a case, in a fixed order (kinetics by component first). */
    public static List<Parameter> parameters(BakeCase b, Uncertainty u) {
        List<Parameter> ps = new ArrayList<>();
        List<Component> comps = b.polymer().components();
        for (int j = 0; j < comps.size(); j++) {
            Component c = comps.get(j);
            Uncertainty.Kinetics k = u.kineticsOf(c.name());
            if (k.eaSdJPerMol() > 0) {
                ps.add(new Parameter("Ea[" + c.name() + "]_kJ_per_mol", Kind.EA, j, c.activationEnergyJPerMol(),
                        k.eaSdJPerMol(), 0, 1e6, 1e3, k.correlation()));
            }
            if (k.lnASd() > 0) {
                ps.add(new Parameter("lnA[" + c.name() + "]", Kind.LN_A, j, Math.log(c.preExponentialPerS()), k.lnASd(),
                        Double.NEGATIVE_INFINITY, Math.log(1e40), 1, k.correlation()));
            }
        }
        CapFilm cap = b.cap();
        if (u.porositySd() > 0) {
            ps.add(new Parameter("porosity", Kind.POROSITY, -1, cap.porosity(), u.porositySd(), 0, 0.999, 1, 0));
        }
        if (u.poreRadiusSdM() > 0) {
            ps.add(new Parameter("pore_radius_nm", Kind.PORE_RADIUS, -1, cap.poreRadiusM(), u.poreRadiusSdM(), 0, 1e-4, 1e-9, 0));
        }
        if (u.thicknessSdM() > 0) {
            // The cap structure allows at most a hundredth of the span; keep samples inside that too.
            double hi = Math.min(1e-3, b.cavity().widthM() * 100);
            ps.add(new Parameter("thickness_nm", Kind.THICKNESS, -1, cap.thicknessM(), u.thicknessSdM(), 0, hi, 1e-9, 0));
        }
        if (u.tortuositySd() > 0) {
            ps.add(new Parameter("tortuosity", Kind.TORTUOSITY, -1, cap.effectiveTortuosity(), u.tortuositySd(), 1, 1000, 1, 0));
        }
        if (u.spreadSdK() > 0) {
            ps.add(new Parameter("spread_K", Kind.SPREAD, -1, b.wafer().spreadK(), u.spreadSdK(), 0, 200, 1, 0));
        }
        if (u.lagSdS() > 0) {
            ps.add(new Parameter("lag_s", Kind.LAG, -1, b.wafer().lagS(), u.lagSdS(), 0, 1e5, 1, 0));
        }
        if (u.purgeSdRelative() > 0) {
            double f = b.chamber().purgeMolPerS();
            ps.add(new Parameter("purge_slm", Kind.PURGE, -1, f, u.purgeSdRelative() * f, 0, 1e3,
                    1e3 * PhysicalConstants.MOL_PER_S_PER_SCCM, 0));
        }
        if (u.densitySdKgPerM3() > 0) {
            ps.add(new Parameter("density_g_per_cm3", Kind.DENSITY, -1, b.polymer().densityKgPerM3(), u.densitySdKgPerM3(),
                    10, 30_000, 1e3, 0));
        }
        return ps;
    }

    /** SplitMix64's finaliser (Steele, Lea and Flood 2014): a bijective 64-bit mix. */
    static long mix64(long z) {
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /** The stream of one parameter (slot) of sample {@code index}. */
    static SplittableRandom stream(long seed, long index, int slot) {
        long s = mix64(seed + 0x9E3779B97F4A7C15L * (index + 1));
        s = mix64(s + 0xD1B54A32D192ED03L * (slot + 1));
        return new SplittableRandom(s);
    }

    /** The SI values of sample {@code index}, aligned with {@code ps}. */
    public static double[] draw(List<Parameter> ps, long seed, long index) {
        double[] v = new double[ps.size()];
        for (int p = 0; p < ps.size(); p++) {
            Parameter a = ps.get(p);
            if (a.kind() == Kind.LN_A && p > 0 && ps.get(p - 1).kind() == Kind.EA && ps.get(p - 1).component() == a.component()) {
                continue; // drawn with its activation energy
            }
            if (a.kind() == Kind.EA) {
                Parameter b = p + 1 < ps.size() && ps.get(p + 1).kind() == Kind.LN_A && ps.get(p + 1).component() == a.component()
                        ? ps.get(p + 1) : null;
                SplittableRandom r = stream(seed, index, 1000 + a.component());
                for (int t = 0; ; t++) {
                    double z1 = r.nextGaussian();
                    double z2 = r.nextGaussian();
                    double e = a.nominal() + a.sd() * z1;
                    double l = b == null ? 0 : b.nominal() + b.sd() * (a.correlation() * z1
                            + Math.sqrt(1 - a.correlation() * a.correlation()) * z2);
                    if (a.inside(e) && (b == null || b.inside(l))) {
                        v[p] = e;
                        if (b != null) {
                            v[p + 1] = l;
                        }
                        break;
                    }
                    check(t, a);
                }
                continue;
            }
            int slot = a.kind() == Kind.LN_A ? 2000 + a.component() : a.kind().ordinal();
            SplittableRandom r = stream(seed, index, slot);
            for (int t = 0; ; t++) {
                double x = a.nominal() + a.sd() * r.nextGaussian();
                if (a.inside(x)) {
                    v[p] = x;
                    break;
                }
                check(t, a);
            }
        }
        return v;
    }

    private static void check(int tries, Parameter a) {
        if (tries >= MAX_TRIES) {
            throw new IllegalArgumentException("the physical range of " + a.name() + " leaves almost none of its "
                    + "distribution (nominal " + a.nominal() + ", sd " + a.sd() + ")");
        }
    }

    /** The nominal case with the sampled values put in. */
    public static BakeCase apply(BakeCase b, List<Parameter> ps, double[] v) {
        List<Component> comps = new ArrayList<>(b.polymer().components());
        CapFilm cap = b.cap();
        Wafer w = b.wafer();
        Polymer poly = b.polymer();
        Chamber ch = b.chamber();
        double tortuosity = cap.tortuosity();
        for (int p = 0; p < ps.size(); p++) {
            Parameter a = ps.get(p);
            double x = v[p];
            switch (a.kind()) {
                case EA -> comps.set(a.component(), comps.get(a.component())
                        .withArrhenius(comps.get(a.component()).preExponentialPerS(), x));
                case LN_A -> comps.set(a.component(), comps.get(a.component())
                        .withArrhenius(Math.exp(x), comps.get(a.component()).activationEnergyJPerMol()));
                case POROSITY -> cap = cap.withPorosity(x);
                case PORE_RADIUS -> cap = cap.withPoreRadius(x);
                case THICKNESS -> cap = cap.withThickness(x);
                case TORTUOSITY -> tortuosity = x;
                case SPREAD -> w = new Wafer(w.lagS(), x);
                case LAG -> w = new Wafer(x, w.spreadK());
                case PURGE -> ch = new Chamber(ch.wafers(), ch.waferDiameterM(), ch.patternFraction(), ch.cavityFraction(),
                        ch.volumeM3(), ch.temperatureK(), ch.pressurePa(), x, ch.limitFraction(), ch.limitLabel());
                case DENSITY -> poly = new Polymer(x, poly.freeVolumeFraction(), poly.components(), poly.seedConversion());
                default -> throw new IllegalStateException();
            }
        }
        cap = new CapFilm(cap.thicknessM(), cap.porosity(), cap.poreRadiusM(), tortuosity, cap.permeabilityPi0(),
                cap.permeationActivationJPerMol());
        poly = poly.withComponents(comps);
        BakeCase out = b.withCap(cap).withWafer(w).withPolymer(poly);
        return ch == null ? out : out.withChamber(ch);
    }

    /**
     * The outcome of one sample.
     *
     * @param index          sample index
     * @param values         the sampled values, SI, aligned with the parameters
     * @param timeToTargetS  time to the residue target at the slowest corner (NaN: not reached)
     * @param margins        per limit (aligned with the study's limit names): the ratio margin, or the
     *                       ceiling headroom [K]; NaN when the sample has no such margin
     * @param holds          per limit, whether it holds
     * @param slack          per ratio limit, ln(allowed / actual): 0 at the limit, below 0 violated;
     *                       NaN for the ceiling, which is followed on its own as headroom in K
     */
    public record Outcome(int index, double[] values, double timeToTargetS, double[] margins, boolean[] holds,
                          double[] slack) {
        public boolean feasible() {
            for (boolean h : holds) {
                if (!h) {
                    return false;
                }
            }
            return true;
        }

        /** The tightest limit: the smallest ratio margin (allowed/actual), as an index, or −1. */
        public int tightest() {
            int best = -1;
            for (int i = 0; i < slack.length; i++) {
                if (!Double.isNaN(slack[i]) && (best < 0 || slack[i] < slack[best])) {
                    best = i;
                }
            }
            return best;
        }

        public double smallestSlack() {
            int t = tightest();
            return t < 0 ? Double.POSITIVE_INFINITY : slack[t];
        }

        /** The smallest ratio margin allowed/actual (the tightest limit's), +∞ when none is loaded. */
        public double smallestMargin() {
            return Math.exp(smallestSlack());
        }
    }

    /** Simulates one sample of the case (which carries the recipe). */
    public static Outcome run(BakeCase nominal, List<Parameter> ps, List<String> limits, long seed, int index) {
        double[] v = draw(ps, seed, index);
        BakeResult r = BakeSimulator.simulate(apply(nominal, ps, v), SETTINGS);
        return outcome(index, v, r, limits);
    }

    static Outcome outcome(int index, double[] v, BakeResult r, List<String> limits) {
        double[] m = new double[limits.size()];
        boolean[] h = new boolean[limits.size()];
        double[] s = new double[limits.size()];
        for (int i = 0; i < limits.size(); i++) {
            Margin g = r.margin(limits.get(i));
            if (g == null) {
                m[i] = Double.NaN;
                s[i] = Double.NaN;
                h[i] = true;
                continue;
            }
            m[i] = g.margin();
            h[i] = g.holds();
            s[i] = g.headroom() ? Double.NaN : slack(g);
        }
        return new Outcome(index, v, r.timeToTargetS(), m, h, s);
    }

    /** ln(allowed/actual); +∞ when never loaded. */
    public static double slack(Margin g) {
        if (g.headroom()) {
            return Math.log(g.allowed() / g.actual());
        }
        return g.margin() == Double.POSITIVE_INFINITY ? Double.POSITIVE_INFINITY : Math.log(g.margin());
    }
}
