package org.exhale.mechanics;

import org.hipparchus.util.FastMath;

/**
 * Dimensionless functions of the clamped strip (beam-column) and the clamped disc under a uniform
 * in-plane force N and a uniform pressure q, in the variable s = N a²/D (a the half-span or radius,
 * D the flexural rigidity; s &lt; 0 in compression). With u = √s:
 *
 * <pre>
 * strip   edge moment   M_e = q a² fE,  fE = (u coth u − 1)/s
 *         centre moment M_c = q a² fC,  fC = (1 − u/sinh u)/s
 *         deflection    δ   = q a⁴/D fD, fD = (1 − 2 tanh(u/2)/u)/(2s)
 *         ∫ w'² dx      = q² a⁷/D² fG,  fG = (2/3 − 3 coth u/u + 4/s − 1/sinh²u)/s²
 *         ∫ M² dx       = q² a⁵ fB,     fB = (s/sinh²u + u coth u − 2)/s²
 * disc    (R = u I₀(u)/I₁(u))
 *         edge slope    Φ'(1) = Q dE,   dE = (R − 2)/(2s)           (M_e = q a² dE)
 *         centre slope  Φ'(0) = Q dC,   dC = (u/(2 I₁(u)) − 1)/(2s)  (M_c = (1+ν) q a² |dC|)
 *         deflection    δ/h  = Q dD,    dD = (1/2 − (I₀(u) − 1)/(u I₁(u)))/(2s)
 *         ∫₀¹ Φ² ρ dρ  = Q² dH,        dH = (3/4 + (4 − R − R²/2)/s)/(4s²)
 * </pre>
 *
 * with Φ = φ a/h the dimensionless slope and Q = q a⁴/(D h). In compression the hyperbolic functions
 * become the circular ones (u = i v) and I₀, I₁ the Bessel J₀, J₁; every function is analytic in s
 * down to the first buckling load (s = −π² for the strip, −j₁₁² for the disc). Near s = 0 the closed
 * forms cancel (the strip's fG loses about 1/s³ of its digits), so for |s| ≤ {@value #SERIES_LIMIT}
 * the Taylor series in s is used, whose coefficients are computed once from the defining power
 * series of sinh, cosh, I₀ and I₁ (exact arithmetic on the series, no fit). The series radius is
 * π² (strip) and j₁₁² (disc), so 26 terms at |s| ≤ 3 leave a truncation error below 1e-13.
 *
 * <p>Hand-written because Hipparchus 4.0.2 provides only the Bessel J function; the modified
 * functions I₀, I₁ are summed from their power series for u &lt; 12 and from their asymptotic
 * expansion (Abramowitz &amp; Stegun, Handbook of Mathematical Functions, 1964, eq. 9.7.1; 12 terms,
 * relative error below 1e-10 at u = 12) above.
 */
final class MembraneFunctions {
    static final double SERIES_LIMIT = 3;
    /** Strip buckling: s = −π². */
    static final double STRIP_BUCKLING_S = -Math.PI * Math.PI;
    /** Disc buckling: s = −j₁₁². */
    static final double DISC_BUCKLING_S = -CapStructure.BESSEL_J1_FIRST_ZERO_EXACT * CapStructure.BESSEL_J1_FIRST_ZERO_EXACT;

    private static final int TERMS = 26;
    static final double BESSEL_SERIES_LIMIT_U = 12;

    /** 1/k² and 1/(k(k+1)) for the Bessel series, k = 0..79. */
    private static final double[] INV_KK = new double[80];
    private static final double[] INV_KK1 = new double[80];
    private static final double[] FE;
    private static final double[] FC;
    private static final double[] FD;
    private static final double[] FG;
    private static final double[] FB;
    private static final double[] DE;
    private static final double[] DC;
    private static final double[] DD;
    private static final double[] DH;

    static {
        for (int k = 1; k < INV_KK.length; k++) {
            INV_KK[k] = 1.0 / ((double) k * k);
            INV_KK1[k] = 1.0 / ((double) k * (k + 1));
        }
        int n = TERMS + 6;
        double[] sh = new double[n];   // sinh(u)/u
        double[] ch = new double[n];   // cosh(u)
        double[] sh4 = new double[n];  // sinh(u/2)/(u/2)
        double[] ch4 = new double[n];  // cosh(u/2)
        double[] ai = new double[n];   // I0(u)
        double[] bi = new double[n];   // 2 I1(u)/u
        double f = 1;                  // (2k)!
        double fk = 1;                 // k!
        for (int k = 0; k < n; k++) {
            if (k > 0) {
                f *= (2 * k - 1) * (2.0 * k);
                fk *= k;
            }
            ch[k] = 1 / f;
            sh[k] = 1 / (f * (2 * k + 1));
            ch4[k] = ch[k] / Math.pow(4, k);
            sh4[k] = sh[k] / Math.pow(4, k);
            ai[k] = 1 / (Math.pow(4, k) * fk * fk);
            bi[k] = 1 / (Math.pow(4, k) * fk * fk * (k + 1));
        }
        FE = shift(div(sub(ch, sh), sh), 1);
        FC = shift(div(sub(sh, one(n)), sh), 1);
        FD = scale(shift(div(sub(ch4, sh4), ch4), 1), 0.5);
        double[] sh2 = mul(sh, sh);
        double[] numG = add(add(scale(shift(sh2, -1), 2.0 / 3), scale(mul(ch, sh), -3)), sub(scale(sh2, 4), one(n)));
        FG = shift(div(numG, sh2), 3);
        FB = shift(div(sub(add(one(n), mul(ch, sh)), scale(sh2, 2)), sh2), 2);
        DE = shift(div(sub(ai, bi), bi), 1);
        DC = scale(shift(div(sub(one(n), bi), bi), 1), 0.5);
        DD = scale(shift(div(sub(shift(bi, -1), scale(sub(ai, one(n)), 4)), bi), 2), 0.25);
        double[] b2 = mul(bi, bi);
        double[] numH = add(add(scale(shift(b2, -1), 0.75), scale(b2, 4)),
                add(scale(mul(ai, bi), -2), scale(mul(ai, ai), -2)));
        DH = scale(shift(div(numH, b2), 3), 0.25);
    }

    private MembraneFunctions() {
    }

    // ---- strip -------------------------------------------------------------------------------

    static double stripEdge(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(FE, s);
        }
        if (s > 0) {
            double u = Math.sqrt(s);
            return (u * coth(u) - 1) / s;
        }
        double v = Math.sqrt(-s);
        return (1 - v / FastMath.tan(v)) / (v * v);
    }

    static double stripCentre(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(FC, s);
        }
        if (s > 0) {
            double u = Math.sqrt(s);
            return (1 - u * cschSmall(u)) / s;
        }
        double v = Math.sqrt(-s);
        return (v / FastMath.sin(v) - 1) / (v * v);
    }

    static double stripDeflection(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(FD, s);
        }
        if (s > 0) {
            double u = Math.sqrt(s);
            return (1 - 2 * FastMath.tanh(u / 2) / u) / (2 * s);
        }
        double v = Math.sqrt(-s);
        return (2 * FastMath.tan(v / 2) / v - 1) / (2 * v * v);
    }

    static double stripStretch(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(FG, s);
        }
        if (s > 0) {
            double u = Math.sqrt(s);
            double c = coth(u);
            double z = c * c - 1;
            return (2.0 / 3 - 3 * c / u + 4 / s - z) / (s * s);
        }
        double v = Math.sqrt(-s);
        double ct = 1 / FastMath.tan(v);
        double zs = ct * ct + 1;
        return (2.0 / 3 + 3 * ct / v - 4 / (v * v) + zs) / (s * s);
    }

    /** d fG/ds. */
    static double stripStretchSlope(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return polySlope(FG, s);
        }
        if (s > 0) {
            double u = Math.sqrt(s);
            double c = coth(u);
            double z = c * c - 1;
            double num = 2.0 / 3 - 3 * c / u + 4 / s - z;
            double dnumdu = 3 * (z * u + c) / (u * u) - 8 / (u * u * u) + 2 * c * z;
            return dnumdu / (2 * u) / (s * s) - 2 * num / (s * s * s);
        }
        double v = Math.sqrt(-s);
        double ct = 1 / FastMath.tan(v);
        double zs = ct * ct + 1;
        double num = 2.0 / 3 + 3 * ct / v - 4 / (v * v) + zs;
        double dnumdv = 3 * (-zs * v - ct) / (v * v) + 8 / (v * v * v) - 2 * ct * zs;
        return dnumdv * (-1 / (2 * v)) / (s * s) - 2 * num / (s * s * s);
    }

    static double stripBendingEnergy(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(FB, s);
        }
        if (s > 0) {
            double u = Math.sqrt(s);
            double c = coth(u);
            return (s * (c * c - 1) + u * c - 2) / (s * s);
        }
        double v = Math.sqrt(-s);
        double ct = 1 / FastMath.tan(v);
        return (v * v * (ct * ct + 1) + v * ct - 2) / (s * s);
    }

    /**
     * fB/(2 fE²): the mean square of the strip's moment across the span over the square of its edge moment,
     * for s above the strip's buckling load (one hyperbolic or circular function for both; the disc's crack-along-
     * the-span estimate calls it at every step, so coth takes the JDK's exp, an intrinsic, rather than FastMath's).
     */
    static double stripBendingShare(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            double fe = poly(FE, s);
            return poly(FB, s) / (2 * fe * fe);
        }
        double fe;
        double fb;
        if (s > 0) {
            double u = Math.sqrt(s);
            double e = Math.exp(-2 * u);
            double c = (1 + e) / (1 - e);
            fe = (u * c - 1) / s;
            fb = (s * (c * c - 1) + u * c - 2) / (s * s);
        } else {
            double v = Math.sqrt(-s);
            double ct = 1 / FastMath.tan(v);
            fe = (1 - v * ct) / (v * v);
            fb = (v * v * (ct * ct + 1) + v * ct - 2) / (s * s);
        }
        return fb / (2 * fe * fe);
    }

    // ---- disc --------------------------------------------------------------------------------

    static double discEdge(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(DE, s);
        }
        return (ratioR(s) - 2) / (2 * s);
    }

    static double discCentre(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(DC, s);
        }
        return (halfUOverI1(s) - 1) / (2 * s);
    }

    static double discDeflection(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(DD, s);
        }
        return (0.5 - i0m1OverUI1(s)) / (2 * s);
    }

    static double discStretch(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return poly(DH, s);
        }
        double r = ratioR(s);
        return (0.75 + (4 - r - r * r / 2) / s) / (4 * s * s);
    }

    static double discStretchSlope(double s) {
        if (Math.abs(s) <= SERIES_LIMIT) {
            return polySlope(DH, s);
        }
        return discStretchSlope(s, ratioR(s));
    }

    /** dH from a given R(s), |s| above {@value #SERIES_LIMIT}. */
    static double discStretch(double s, double r) {
        return (0.75 + (4 - r - r * r / 2) / s) / (4 * s * s);
    }

    /** dH/ds from a given R(s), |s| above {@value #SERIES_LIMIT}. */
    static double discStretchSlope(double s, double r) {
        double rp = (2 * r + s - r * r) / (2 * s);
        double g = 4 - r - r * r / 2;
        double num = 0.75 + g / s;
        double dnum = (-rp - r * rp) / s - g / (s * s);
        return dnum / (4 * s * s) - 2 * num / (4 * s * s * s);
    }

    // ---- Bessel pieces -----------------------------------------------------------------------

    /** R = u I₀(u)/I₁(u) (v J₀(v)/J₁(v) for s = −v² &lt; 0). */
    static double ratioR(double s) {
        if (s < BESSEL_SERIES_LIMIT_U * BESSEL_SERIES_LIMIT_U) {
            double t = s / 4;
            return 2 * seriesA(t) / seriesB(t);
        }
        double u = Math.sqrt(s);
        return u * asymptotic(0, u) / asymptotic(1, u);
    }

    /** u/(2 I₁(u)). */
    private static double halfUOverI1(double s) {
        if (s < BESSEL_SERIES_LIMIT_U * BESSEL_SERIES_LIMIT_U) {
            return 1 / seriesB(s / 4);
        }
        double u = Math.sqrt(s);
        return u * Math.sqrt(2 * Math.PI * u) * FastMath.exp(-u) / (2 * asymptotic(1, u));
    }

    /** (I₀(u) − 1)/(u I₁(u)). */
    private static double i0m1OverUI1(double s) {
        if (s < BESSEL_SERIES_LIMIT_U * BESSEL_SERIES_LIMIT_U) {
            double t = s / 4;
            return 2 * (seriesA(t) - 1) / (s * seriesB(t));
        }
        double u = Math.sqrt(s);
        double a1 = asymptotic(1, u);
        return asymptotic(0, u) / (u * a1) - Math.sqrt(2 * Math.PI * u) * FastMath.exp(-u) / (u * a1);
    }

    /** I₀ = Σ t^k/(k!)², t = u²/4. */
    static double seriesA(double t) {
        double term = 1;
        double sum = 1;
        for (int k = 1; k < INV_KK.length; k++) {
            term *= t * INV_KK[k];
            sum += term;
            if (Math.abs(term) < 1e-17 * Math.abs(sum)) {
                break;
            }
        }
        return sum;
    }

    /** 2 I₁(u)/u = Σ t^k/(k!(k+1)!). */
    static double seriesB(double t) {
        double term = 1;
        double sum = 1;
        for (int k = 1; k < INV_KK1.length; k++) {
            term *= t * INV_KK1[k];
            sum += term;
            if (Math.abs(term) < 1e-17 * Math.abs(sum)) {
                break;
            }
        }
        return sum;
    }

    /** I_ν(u) √(2πu) e^{−u} from the asymptotic expansion (A&amp;S 9.7.1), ν = 0 or 1. */
    private static double asymptotic(int nu, double u) {
        double mu = 4.0 * nu * nu;
        double term = 1;
        double sum = 1;
        for (int k = 1; k <= 12; k++) {
            double odd = 2 * k - 1;
            term *= -(mu - odd * odd) / (k * 8 * u);
            sum += term;
        }
        return sum;
    }

    // ---- helpers -----------------------------------------------------------------------------

    private static double coth(double u) {
        double e = FastMath.exp(-2 * u);
        return (1 + e) / (1 - e);
    }

    /** 1/sinh(u) for u &gt; 0. */
    private static double cschSmall(double u) {
        double e = FastMath.exp(-u);
        return 2 * e / (1 - e * e);
    }

    private static double poly(double[] c, double s) {
        double r = 0;
        for (int i = TERMS - 1; i >= 0; i--) {
            r = r * s + c[i];
        }
        return r;
    }

    private static double polySlope(double[] c, double s) {
        double r = 0;
        for (int i = TERMS - 1; i >= 1; i--) {
            r = r * s + i * c[i];
        }
        return r;
    }

    private static double[] one(int n) {
        double[] r = new double[n];
        r[0] = 1;
        return r;
    }

    private static double[] add(double[] a, double[] b) {
        double[] r = new double[a.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = a[i] + b[i];
        }
        return r;
    }

    private static double[] sub(double[] a, double[] b) {
        return add(a, scale(b, -1));
    }

    private static double[] scale(double[] a, double f) {
        double[] r = new double[a.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = a[i] * f;
        }
        return r;
    }

    private static double[] mul(double[] a, double[] b) {
        double[] r = new double[a.length];
        for (int i = 0; i < r.length; i++) {
            for (int j = 0; j <= i; j++) {
                r[i] += a[j] * b[i - j];
            }
        }
        return r;
    }

    /** Power-series quotient a/b (b[0] ≠ 0). */
    private static double[] div(double[] a, double[] b) {
        double[] r = new double[a.length];
        for (int i = 0; i < r.length; i++) {
            double v = a[i];
            for (int j = 1; j <= i; j++) {
                v -= b[j] * r[i - j];
            }
            r[i] = v / b[0];
        }
        return r;
    }

    /** Divides by s^k (k &gt; 0, dropping the k leading coefficients, which vanish) or multiplies (k &lt; 0). */
    private static double[] shift(double[] a, int k) {
        double[] r = new double[a.length];
        for (int i = 0; i < r.length; i++) {
            int j = i + k;
            if (j >= 0 && j < a.length) {
                r[i] = a[j];
            }
        }
        return r;
    }
}
