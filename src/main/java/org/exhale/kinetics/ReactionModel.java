package org.exhale.kinetics;

/**
 * A conversion function f(α) of the Arrhenius rate law dα/dt = A exp(−E/RT) f(α).
 * Every model returns 0 for α ≥ 1; models with f(0) = 0 (or infinite) need a seed conversion
 * to start (see {@link #needsSeed()}).
 */
public sealed interface ReactionModel
        permits ReactionModel.NthOrder, ReactionModel.SestakBerggren,
                ReactionModel.AvramiErofeev, ReactionModel.RandomScission {

    /** f(α); 0 for α ≥ 1; negative α is treated as 0. */
    double f(double alpha);

    /** True when f(0) is zero or infinite, so that integration must start from a seed α. */
    boolean needsSeed();

    /** The name used in case files. */
    String id();

    /** n-th order: f = (1 − α)^n. */
    record NthOrder(double n) implements ReactionModel {
        public NthOrder {
            if (!(n > 0 && n <= 10)) {
                throw new IllegalArgumentException("reaction order n must be in (0, 10], got " + n);
            }
        }

        @Override
        public double f(double alpha) {
            if (alpha >= 1) {
                return 0;
            }
            double x = 1 - Math.max(alpha, 0);
            return n == 1 ? x : Math.pow(x, n);
        }

        @Override
        public boolean needsSeed() {
            return false;
        }

        @Override
        public String id() {
            return "nth-order";
        }
    }

    /** Šesták–Berggren (truncated): f = α^m (1 − α)^n. */
    record SestakBerggren(double m, double n) implements ReactionModel {
        public SestakBerggren {
            if (!(m >= 0 && m <= 5)) {
                throw new IllegalArgumentException("Sestak-Berggren exponent m must be in [0, 5], got " + m);
            }
            if (!(n > 0 && n <= 10)) {
                throw new IllegalArgumentException("Sestak-Berggren exponent n must be in (0, 10], got " + n);
            }
        }

        @Override
        public double f(double alpha) {
            if (alpha >= 1) {
                return 0;
            }
            double a = Math.max(alpha, 0);
            return Math.pow(a, m) * Math.pow(1 - a, n);
        }

        @Override
        public boolean needsSeed() {
            return m > 0;
        }

        @Override
        public String id() {
            return "sestak-berggren";
        }
    }

    /** Avrami–Erofeev nucleation and growth: f = n (1 − α) (−ln(1 − α))^(1 − 1/n). */
    record AvramiErofeev(double n) implements ReactionModel {
        public AvramiErofeev {
            if (!(n >= 0.5 && n <= 4)) {
                throw new IllegalArgumentException("Avrami-Erofeev exponent n must be in [0.5, 4], got " + n);
            }
        }

        @Override
        public double f(double alpha) {
            if (alpha >= 1) {
                return 0;
            }
            double a = Math.max(alpha, 0);
            double x = 1 - a;
            if (n == 1) {
                return x;
            }
            if (a == 0) {
                return n > 1 ? 0 : Double.POSITIVE_INFINITY;
            }
            return n * x * Math.pow(-Math.log1p(-a), 1 - 1 / n);
        }

        @Override
        public boolean needsSeed() {
            return n != 1;
        }

        @Override
        public String id() {
            return "avrami-erofeev";
        }
    }

    /**
     * Random scission with L = 2 (the smallest fragment that evaporates is a dimer):
     * f = 2 (α^½ − α), maximum 0.5 at α = 0.25.
     */
    record RandomScission() implements ReactionModel {
        @Override
        public double f(double alpha) {
            if (alpha >= 1) {
                return 0;
            }
            double a = Math.max(alpha, 0);
            return 2 * (Math.sqrt(a) - a);
        }

        @Override
        public boolean needsSeed() {
            return true;
        }

        @Override
        public String id() {
            return "random-scission";
        }
    }
}
