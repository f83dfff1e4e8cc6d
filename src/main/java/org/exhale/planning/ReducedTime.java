package org.exhale.planning;

import org.exhale.kinetics.ReactionModel;

/**
 * The reduced time of one component, F(α) = ∫_{α0}^{α} dα'/f(α'): under any temperature history
 * F(α(t)) = ∫_0^t k(T(s)) ds, so conversions are compared through F without integrating an ODE
 * (MODEL.md §9, docs/model.md "Lower bounds"). Closed forms for the n-th order, random-scission and
 * Avrami–Erofeev models; Šesták–Berggren by a table of lower and upper Riemann sums of 1/f (f is
 * unimodal, so its extremes on a sub-interval are at the ends or the peak). {@link #lower} never
 * exceeds the true F and {@link #upper} never falls below it, whatever the rounding.
 */
final class ReducedTime {
    private static final double SAFE = 1e-12;
    private final ReactionModel model;
    private final double alpha0;
    private final double base;
    /** Šesták–Berggren only: table of α and the lower and upper sums from α0. */
    private final double[] xs;
    private final double[] lo;
    private final double[] hi;

    ReducedTime(ReactionModel model, double alpha0) {
        this.model = model;
        this.alpha0 = alpha0;
        if (model instanceof ReactionModel.SestakBerggren) {
            int n = 20_000;
            xs = new double[n + 1];
            lo = new double[n + 1];
            hi = new double[n + 1];
            double s0 = logit(Math.max(alpha0, 1e-12));
            double s1 = logit(1 - 1e-12);
            xs[0] = alpha0;
            for (int i = 1; i <= n; i++) {
                xs[i] = sigmoid(s0 + (s1 - s0) * i / n);
                double fmax = maxF(xs[i - 1], xs[i]);
                double fmin = Math.min(model.f(xs[i - 1]), model.f(xs[i]));
                double w = xs[i] - xs[i - 1];
                lo[i] = lo[i - 1] + w / fmax;
                hi[i] = hi[i - 1] + (fmin > 0 ? w / fmin : Double.POSITIVE_INFINITY);
            }
            base = 0;
        } else {
            xs = null;
            lo = null;
            hi = null;
            base = absolute(alpha0);
        }
    }

    static double logit(double a) {
        return Math.log(a / (1 - a));
    }

    static double sigmoid(double s) {
        return 1 / (1 + Math.exp(-s));
    }

    /** The largest f on [a, b]: f of all four models is unimodal (rises to one peak, then falls). */
    double maxF(double a, double b) {
        double m = Math.max(model.f(a), model.f(b));
        double p = peak();
        if (p > a && p < b) {
            m = Math.max(m, model.f(p));
        }
        return m;
    }

    /** The smallest f on [a, b] (unimodal: at an end). */
    double minF(double a, double b) {
        return Math.min(model.f(a), model.f(b));
    }

    /** Where f peaks (0 where it only falls). */
    double peak() {
        if (model instanceof ReactionModel.RandomScission) {
            return 0.25;
        }
        if (model instanceof ReactionModel.SestakBerggren sb) {
            return sb.m() / (sb.m() + sb.n());
        }
        if (model instanceof ReactionModel.AvramiErofeev ae && ae.n() > 1) {
            return 1 - Math.exp(-(1 - 1 / ae.n()));
        }
        return 0;
    }

    private double absolute(double a) {
        if (a >= 1) {
            return Double.POSITIVE_INFINITY;
        }
        if (model instanceof ReactionModel.NthOrder no) {
            return no.n() == 1 ? -Math.log1p(-a) : (Math.pow(1 - a, 1 - no.n()) - 1) / (no.n() - 1);
        }
        if (model instanceof ReactionModel.RandomScission) {
            return -Math.log1p(-Math.sqrt(a));
        }
        if (model instanceof ReactionModel.AvramiErofeev ae) {
            return Math.pow(-Math.log1p(-a), 1 / ae.n());
        }
        throw new IllegalStateException("no closed form for " + model.id());
    }

    private double inverseAbsolute(double v) {
        if (model instanceof ReactionModel.NthOrder no) {
            if (no.n() == 1) {
                return -Math.expm1(-v);
            }
            double base1 = 1 + (no.n() - 1) * v;
            return base1 <= 0 ? 1 : 1 - Math.pow(base1, 1 / (1 - no.n()));
        }
        if (model instanceof ReactionModel.RandomScission) {
            double s = -Math.expm1(-v);
            return s * s;
        }
        if (model instanceof ReactionModel.AvramiErofeev ae) {
            return -Math.expm1(-Math.pow(v, ae.n()));
        }
        throw new IllegalStateException("no closed form for " + model.id());
    }

    /** A lower bound on F(α) [dimensionless reduced time]. */
    double lower(double a) {
        if (a <= alpha0) {
            return 0;
        }
        if (xs != null) {
            int i = java.util.Arrays.binarySearch(xs, a);
            int at = i >= 0 ? i : -i - 2;
            return lo[Math.max(at, 0)];
        }
        double v = absolute(a) - base;
        return Math.max(0, v * (1 - SAFE) - SAFE * base);
    }

    /** An upper bound on F(α). */
    double upper(double a) {
        if (a <= alpha0) {
            return 0;
        }
        if (a >= 1) {
            return Double.POSITIVE_INFINITY;
        }
        if (xs != null) {
            int i = java.util.Arrays.binarySearch(xs, a);
            int at = i >= 0 ? i : -i - 1;
            return at >= xs.length ? Double.POSITIVE_INFINITY : hi[at];
        }
        double v = absolute(a) - base;
        return v * (1 + SAFE) + SAFE * base + 1e-300;
    }

    /**
     * An upper bound on the conversion reached after reduced time v from α0: the largest α whose
     * lower F is at most v.
     */
    double conversionAtMost(double v) {
        if (v <= 0) {
            return alpha0;
        }
        if (Double.isInfinite(v)) {
            return 1;
        }
        if (xs != null) {
            // lower(α) = lo[i] on [xs[i], xs[i+1]): the largest α with lower(α) ≤ v lies just below the first xs whose lo exceeds v
            int i = java.util.Arrays.binarySearch(lo, v);
            int at = i >= 0 ? i + 1 : -i - 1;
            while (at < lo.length && lo[at] <= v) {
                at++;
            }
            return at >= xs.length ? 1 : xs[at];
        }
        double a = inverseAbsolute((v + SAFE * base) / (1 - SAFE) + base);
        return Math.min(1, Math.nextUp(a) + 1e-15);
    }

    /**
     * A lower bound on the conversion of a corner whose reduced time is at least v: the largest α whose
     * upper F is at most v (α0 when v ≤ 0), rounded down.
     */
    double conversionAtLeast(double v) {
        if (!(v > 0)) {
            return alpha0;
        }
        if (Double.isInfinite(v)) {
            return 1;
        }
        if (xs != null) {
            // upper(xs[i]) = hi[i] ≥ F(xs[i]): the last table point whose upper sum is at most v has F at most v
            int i = java.util.Arrays.binarySearch(hi, v);
            int at = i >= 0 ? i : -i - 2;
            while (at + 1 < hi.length && hi[at + 1] <= v) {
                at++;
            }
            return at <= 0 ? alpha0 : xs[at];
        }
        double a = inverseAbsolute((v - SAFE * base) / (1 + SAFE) + base);
        return Math.max(alpha0, Math.min(1, Math.nextDown(a) - 1e-15));
    }

    double alpha0() {
        return alpha0;
    }

    ReactionModel model() {
        return model;
    }
}
