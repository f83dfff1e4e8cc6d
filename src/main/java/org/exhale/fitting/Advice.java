package org.exhale.fitting;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Warnings about the design of the experiment and the meaning of the results, following the
 * recommendations of the ICTAC Kinetics Committee (Vyazovkin et al., Thermochim. Acta 520 (2011) 1):
 * at least three (better 3–5) heating rates over a useful span, isoconversional analysis first,
 * Kissinger and single-step fits only when E does not vary with α. The thresholds are our choice.
 */
public final class Advice {
    /** Heating-rate span (max/min) below which the regressions are poorly conditioned. */
    public static final double MIN_RATE_SPAN = 3;
    /** Largest departure of T(t) from a straight line over the reaction range, as a share of its span. */
    public static final double MAX_RAMP_DEVIATION = 0.01;

    private Advice() {
    }

    /** Fewest samples across the reaction range of the fastest run before sampling is called coarse. */
    public static final int MIN_REACTION_SAMPLES = 40;

    public static List<String> warnings(List<ConversionCurve> runs, IsoconversionalResult reference) {
        return warnings(runs, reference, null);
    }

    public static List<String> warnings(List<ConversionCurve> runs, IsoconversionalResult reference,
                                        KissingerResult kissinger) {
        List<String> w = new ArrayList<>();
        if (runs.size() < 3) {
            w.add("only " + runs.size() + " heating rate(s): at least three (better 3 to 5) are needed for "
                    + "isoconversional intervals; treat E(alpha) as indicative");
        }
        double lo = Double.POSITIVE_INFINITY, hi = 0;
        for (ConversionCurve c : runs) {
            lo = Math.min(lo, c.heatingRateKPerS());
            hi = Math.max(hi, c.heatingRateKPerS());
        }
        if (runs.size() >= 2 && hi / lo < MIN_RATE_SPAN) {
            w.add(String.format(Locale.ROOT, "heating rates span only a factor %.1f (%.3g to %.3g K/min): "
                    + "a span of 3 to 5 or more is recommended", hi / lo, lo * 60, hi * 60));
        }
        for (ConversionCurve c : runs) {
            double[] t = c.temperatureK();
            double span = t[c.reactionTo()] - t[c.reactionFrom()];
            if (span > 0 && c.heatingMaxDevK() > MAX_RAMP_DEVIATION * span) {
                w.add(String.format(Locale.ROOT, "run %s: temperature departs from a straight ramp by up to %.2f K "
                        + "over the reaction range (%.1f K); methods assuming a constant rate (KAS, OFW, Starink, "
                        + "Kissinger) are biased, prefer Vyazovkin and the model fit", c.label(), c.heatingMaxDevK(), span));
            }
        }
        ConversionCurve fastest = null;
        for (ConversionCurve c : runs) {
            if (fastest == null || c.heatingRateKPerS() > fastest.heatingRateKPerS()) {
                fastest = c;
            }
        }
        if (fastest != null) {
            int samples = fastest.reactionTo() - fastest.reactionFrom() + 1;
            if (samples < MIN_REACTION_SAMPLES) {
                double[] t = fastest.timeS();
                double duration = t[fastest.reactionTo()] - t[fastest.reactionFrom()];
                w.add(String.format(Locale.ROOT, "run %s: only %d samples across the reaction at the fastest rate; "
                        + "derivatives (Friedman, Kissinger) are coarse; sample at least every %.2g s", fastest.label(),
                        samples, duration / MIN_REACTION_SAMPLES));
            }
        }
        if (reference != null) {
            double spread = reference.relativeSpread(0.1, 0.9);
            if (spread > Kissinger.MAX_SPREAD) {
                w.add(String.format(Locale.ROOT, "E(alpha) by %s varies by %.0f %% of its mean over alpha 0.1-0.9, more "
                        + "than the 10-20 %% the ICTAC recommendations allow for one step: the process is likely "
                        + "multi-step; Kissinger's single E is not meaningful%s, use the multi-component fit",
                        reference.method().id(), spread * 100, kissinger != null ? " (flagged in fit.json)" : ""));
            }
        }
        return w;
    }
}
