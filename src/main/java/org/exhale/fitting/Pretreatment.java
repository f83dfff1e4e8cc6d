package org.exhale.fitting;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.exhale.PhysicalConstants;

/**
 * What is done to a run before conversion is computed, in this order:
 * <ol>
 *   <li><b>thermal lag</b> ({@code lagS} &gt; 0): the sample is taken to follow the recorded
 *       temperature as a first-order lag, dT_s/dt = (T − T_s)/τ, integrated exactly for T linear
 *       between samples and started in the steady lag of the first ramp (T_s = T − τ dT/dt);</li>
 *   <li><b>temperature window</b> ({@code fromK}, {@code toK}): only samples with T_s inside;</li>
 *   <li><b>early step</b>: a separate mass-loss step before the main one (moisture, solvent) is
 *       detected on the smoothed mass-loss rate: a step of at most {@link #MAX_EARLY_STEP} of the
 *       mass, separated from the main step by a valley where the rate falls below
 *       {@link #VALLEY_SHARE} of the early step's own peak; the run is cut at the valley unless
 *       {@code keepEarlyStep};</li>
 *   <li><b>sloping end plateau</b> (drift, buoyancy): a straight line of mass on temperature over
 *       the final plateau (after the rate fell below {@link #PLATEAU_RATE_SHARE} of its peak, at
 *       least {@link #MIN_PLATEAU_SPAN_K} long); a slope that is significant (3 standard errors)
 *       and worth more than {@link #DRIFT_THRESHOLD} of the mass lost over the run is subtracted
 *       over the whole run (a buoyancy or drift line is the same at every temperature), or only
 *       warned about when {@code correctDrift} is off. A plateau too short to measure is warned
 *       about.</li>
 * </ol>
 * All thresholds are our choice (common practice, no source) and are stated in docs/model.md.
 *
 * @param fromK         lowest sample temperature kept [K], NaN for none
 * @param toK           highest sample temperature kept [K], NaN for none
 * @param keepEarlyStep keep an early separate step
 * @param lagS          thermal-lag time constant [s], 0 for none
 * @param correctDrift  subtract a sloping end plateau (otherwise only warn)
 */
public record Pretreatment(double fromK, double toK, boolean keepEarlyStep, double lagS, boolean correctDrift) {
    public static final Pretreatment DEFAULT = new Pretreatment(Double.NaN, Double.NaN, false, 0, true);
    /** Largest early step, as a share of the initial mass, taken as moisture or solvent. */
    public static final double MAX_EARLY_STEP = 0.10;
    /** Smallest early step worth removing, as a share of the initial mass. */
    public static final double MIN_EARLY_STEP = 0.003;
    /** The valley between the early and the main step is below this share of the early step's peak rate. */
    public static final double VALLEY_SHARE = 0.25;
    /** The final plateau starts where the rate fell below this share of its peak. */
    public static final double PLATEAU_RATE_SHARE = 0.02;
    /** Shortest final plateau on which a slope is measured [K]. */
    public static final double MIN_PLATEAU_SPAN_K = 25;
    /** Drift over the run worth correcting, as a share of the mass lost. */
    public static final double DRIFT_THRESHOLD = 0.002;

    public Pretreatment {
        if (!Double.isNaN(fromK) && !(fromK > 0)) {
            throw new IllegalArgumentException("--from must be above absolute zero");
        }
        if (!Double.isNaN(fromK) && !Double.isNaN(toK) && !(toK > fromK)) {
            throw new IllegalArgumentException("--to must be above --from");
        }
        if (!(lagS >= 0 && lagS < 3600)) {
            throw new IllegalArgumentException("lag must be in [0, 3600) s, got " + lagS);
        }
    }

    /** A run after pre-treatment and what was done to it. */
    public record Prepared(TgaRun run, List<String> warnings) {
        public Prepared {
            warnings = List.copyOf(warnings);
        }
    }

    public Prepared apply(TgaRun run) {
        List<String> w = new ArrayList<>();
        String label = run.label();
        double[] t = run.timeS();
        double[] temp = run.temperatureK();
        double[] m = run.mass();
        if (lagS > 0) {
            temp = lagged(t, temp, lagS);
        }
        if (!Double.isNaN(fromK) || !Double.isNaN(toK)) {
            int n0 = t.length;
            List<Integer> keep = new ArrayList<>();
            for (int i = 0; i < n0; i++) {
                if ((Double.isNaN(fromK) || temp[i] >= fromK) && (Double.isNaN(toK) || temp[i] <= toK)) {
                    keep.add(i);
                }
            }
            if (keep.size() < TgaRun.MIN_POINTS) {
                throw new IllegalArgumentException("run " + label + ": only " + keep.size()
                        + " samples between --from and --to; widen the window");
            }
            int a = keep.get(0), b = keep.get(keep.size() - 1);
            t = Arrays.copyOfRange(t, a, b + 1);
            temp = Arrays.copyOfRange(temp, a, b + 1);
            m = Arrays.copyOfRange(m, a, b + 1);
        }
        int n = t.length;
        // Smoothed mass-loss rate on time, and its noise level from the scatter of the mass about
        // the smooth curve (median absolute deviation) through the variance of a local slope.
        int half = Math.max(3, n / 50);
        half = Math.min(half, (n - 1) / 2);
        LocalPolynomial.Smoothed s = LocalPolynomial.quadratic(t, m, half);
        double[] ms = s.value();
        double[] rate = new double[n];
        double[] dev = new double[n];
        for (int i = 0; i < n; i++) {
            rate[i] = -s.slope()[i];
            dev[i] = Math.abs(m[i] - ms[i]);
        }
        double sigmaM = 1.4826 * median(dev);
        int mid = n / 2;
        double sxx = 0;
        for (int i = Math.max(0, mid - half); i <= Math.min(n - 1, mid + half); i++) {
            sxx += (t[i] - t[mid]) * (t[i] - t[mid]);
        }
        double sigmaRate = sxx > 0 ? sigmaM / Math.sqrt(sxx) : 0;
        int peak = 0;
        for (int i = 1; i < n; i++) {
            if (rate[i] > rate[peak]) {
                peak = i;
            }
        }
        double mRef = Math.abs(ms[0]) > 0 ? Math.abs(ms[0]) : 1;
        if (!(rate[peak] > 0)) {
            return new Prepared(new TgaRun(label, t, temp, m, run.basis()), w);
        }
        double quiet = Math.max(PLATEAU_RATE_SHARE * rate[peak], 3 * sigmaRate);
        // Early step: walk left from the main peak to where the main step starts.
        int start = peak;
        while (start > 0 && rate[start] > quiet) {
            start--;
        }
        int early = -1;
        for (int i = 0; i < start; i++) {
            if (early < 0 || rate[i] > rate[early]) {
                early = i;
            }
        }
        if (early >= 0 && rate[early] > 5 * sigmaRate && rate[early] > quiet) {
            int valley = early;
            for (int i = early; i <= start; i++) {
                if (rate[i] < rate[valley]) {
                    valley = i;
                }
            }
            double lost = (ms[0] - ms[valley]) / mRef;
            boolean separate = rate[valley] < VALLEY_SHARE * rate[early];
            boolean clear = ms[0] - ms[valley] > 10 * sigmaM / Math.sqrt(2 * half + 1.0);
            if (separate && clear && lost >= MIN_EARLY_STEP && lost <= MAX_EARLY_STEP && valley > 0
                    && n - valley >= TgaRun.MIN_POINTS) {
                double tc = temp[valley] - PhysicalConstants.ZERO_CELSIUS_K;
                if (keepEarlyStep) {
                    w.add(String.format(Locale.ROOT, "run %s: an early separate mass-loss step of %.1f %% below %.0f °C "
                            + "(moisture or solvent?) is kept (--keep-early-step); it may appear as a component", label,
                            100 * lost, tc));
                } else {
                    w.add(String.format(Locale.ROOT, "run %s: an early separate mass-loss step of %.1f %% below %.0f °C "
                            + "(moisture or solvent?) is excluded; the initial mass is taken at %.0f °C "
                            + "(--keep-early-step keeps it)", label, 100 * lost, tc, tc));
                    t = Arrays.copyOfRange(t, valley, n);
                    temp = Arrays.copyOfRange(temp, valley, n);
                    m = Arrays.copyOfRange(m, valley, n);
                    ms = Arrays.copyOfRange(ms, valley, n);
                    rate = Arrays.copyOfRange(rate, valley, n);
                    peak -= valley;
                    n = t.length;
                }
            }
        }
        // Final plateau.
        int end = peak;
        while (end < n - 1 && rate[end] > quiet) {
            end++;
        }
        int from = Math.min(n - 1, end + half);
        double span = temp[n - 1] - temp[from];
        double lostTotal = Math.abs(m[0] - m[n - 1]);
        if (span >= MIN_PLATEAU_SPAN_K && n - from >= 10) {
            LinearRegression lr = LinearRegression.fit(temp, m, from, n);
            double runSpan = temp[n - 1] - temp[0];
            double drift = Math.abs(lr.slope()) * runSpan;
            boolean significant = Math.abs(lr.slope()) > 3 * lr.slopeStdError();
            if (significant && drift > DRIFT_THRESHOLD * lostTotal) {
                double per100 = 100 * lr.slope() * 100 / mRef;
                if (correctDrift) {
                    double[] mc = new double[n];
                    for (int i = 0; i < n; i++) {
                        mc[i] = m[i] - lr.slope() * (temp[i] - temp[0]);
                    }
                    m = mc;
                    w.add(String.format(Locale.ROOT, "run %s: the final plateau slopes by %+.2f %% of the initial mass "
                            + "per 100 K (drift or buoyancy); that slope is subtracted over the whole run", label, per100));
                } else {
                    w.add(String.format(Locale.ROOT, "run %s: the final plateau slopes by %+.2f %% of the initial mass "
                            + "per 100 K (drift or buoyancy); not corrected, conversion near the end is biased", label, per100));
                }
            }
        } else {
            double endRate = Math.abs(rate[n - 1]);
            if (endRate > 5 * quiet) {
                w.add(String.format(Locale.ROOT, "run %s: the run ends before the mass settles (final plateau %.0f K "
                        + "long); extend the run or state the residue with --residue", label, Math.max(0, span)));
            }
        }
        return new Prepared(new TgaRun(label, t, temp, m, run.basis()), w);
    }

    private static double median(double[] v) {
        double[] c = v.clone();
        Arrays.sort(c);
        return c.length == 0 ? 0 : c[c.length / 2];
    }

    /** First-order lag of a piecewise-linear history, exact per piece, started in its steady lag. */
    static double[] lagged(double[] t, double[] x, double tau) {
        int n = t.length;
        double[] y = new double[n];
        int k = Math.min(n - 1, 5);
        double s0 = (x[k] - x[0]) / (t[k] - t[0]);
        y[0] = x[0] - tau * s0;
        for (int i = 1; i < n; i++) {
            double h = t[i] - t[i - 1];
            double slope = (x[i] - x[i - 1]) / h;
            double decay = Math.exp(-h / tau);
            y[i] = x[i] - tau * slope + (y[i - 1] - x[i - 1] + tau * slope) * decay;
        }
        return y;
    }
}
