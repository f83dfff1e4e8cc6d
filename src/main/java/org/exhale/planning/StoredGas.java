package org.exhale.planning;

import java.util.Arrays;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;
import org.exhale.transport.GasTransport;

/**
 * What the joint bound needs to stay rigorous when the gas is stored (not quasi-steady): how much gas
 * a corner's cavity can hold within the limits and how fast its cap can vent, both as functions of
 * the clock's rate constant u = k_q(T) at the hot corner (docs/model.md, "Lower bounds", 5).
 *
 * <p>In any gas regime a corner's stored moles S = Δp V_g/(RT) obey S' = G − V', S ≥ 0, and the
 * monotone limits hold only while Δp ≤ P_adm(T), so S ≤ S_max and the vented flux is at most
 * J(T) = Φ(T, P_adm(T)) (Φ rises with Δp). With every component's f at least its floor, the gas made
 * is at least γ(u) = Σ_j a_j k_j(T_corner(u)). Over a move of duration d in which the clock gains
 * hot reduced time F = ∫u dt,
 * S' − S ≥ c + ∫(γ(u) − J(u)) dt ≥ c + d φ(F/d), φ = γ̆ − Ĵ, with γ̆ ≤ γ convex (tangents of the
 * convex k_j(T_corner(u))) and Ĵ ≥ J concave (an upper hull): Jensen's inequality. c is gas counted
 * exactly (the clock's own increment at the hot corner).
 */
final class StoredGas {
    private static final double R = PhysicalConstants.GAS_CONSTANT;
    /** Temperature grid step [K]. */
    static final double GRID_K = 0.5;
    /**
     * The vent majorant keeps the supporting lines of every SPARSE-th hull vertex, and the rate constants' tangents are
     * taken every SPARSE grid steps (4 K): both errors are of second order in the step (each a fraction of a per mille).
     */
    static final int SPARSE = 8;

    /** Most moles a corner's cavity can hold within the limits [mol/m²]. */
    final double maxStoredMolPerM2;
    /** Most moles per storage volume, max_T P_adm(T)/(RT) [mol/m³]; the volume's fixed part and height [m]. */
    private final double storedPerVolume;
    private final double fixedVolumeM;
    private final double heightM;
    /** Per component, the storage volume freed per unit conversion, over the height: w_j (1 − c_j). */
    private final double[] freedWeight;
    /** Whether the admissible pressure is finite at every temperature (else venting bounds nothing). */
    final boolean finite;
    final Corner hot;
    final Corner cold;

    /**
     * @param comps  the components (comps[q] the clock: the smallest activation energy)
     * @param q      the clock's index
     * @param topK   the hottest the hot corner can be [K]
     * @param offset the cold corner's offset below the hot one (2ΔT) [K]
     */
    StoredGas(BakeCase bake, InstantLimits limits, Component[] comps, int q, double topK, double offset) {
        int k = limits.size();
        double d = bake.cavity().heightM();
        double fixed = bake.polymer().freeVolumeFraction() * d + bake.cap().porosity() * bake.cap().thicknessM() / 2;
        double freedMax = 0;
        freedWeight = new double[k];
        for (int j = 0; j < k; j++) {
            Component c = bake.polymer().component(j);
            freedWeight[j] = c.fraction() * (1 - c.charFraction());
            freedMax += freedWeight[j];
        }
        fixedVolumeM = fixed;
        heightM = d;
        double vMax = fixed + d * freedMax;
        // the admissible pressure on a corner-temperature grid from LOWEST_K to the top
        int n = (int) Math.ceil((topK - VentBound.LOWEST_K) / GRID_K) + 1;
        double[] temps = new double[n + 1];
        double[] pAdm = new double[n + 1];
        boolean any = true;
        for (int i = 0; i <= n; i++) {
            temps[i] = VentBound.LOWEST_K + i * GRID_K;
            pAdm[i] = VentBound.admissiblePressure(limits, temps[i], bake.limits().maxPressurePa());
            any &= Double.isFinite(pAdm[i]);
        }
        finite = any;
        GasTransport transport = limits.transport();
        double h = bake.cap().thicknessM();
        double[] jUp = new double[n];
        double stored = 0;
        double jMax = 0;
        for (int i = 0; i < n; i++) {
            double lo = temps[i];
            double hi = temps[i + 1];
            double kmax = VentBound.permeanceAtMost(transport, k, lo, hi, h);
            // P_adm between samples: the larger neighbour (as in VentBound)
            double p = Math.max(pAdm[i], pAdm[i + 1]) * (1 + 1e-9);
            double f = p > 0 ? kmax * p + transport.viscousConductance(lo, p) * p : 0;
            jMax = Math.max(jMax, f);
            jUp[i] = jMax;   // a non-decreasing upper bound of the flux on [LOWEST_K, hi]
            stored = Math.max(stored, p / (R * lo));
        }
        storedPerVolume = stored * (1 + 1e-9);
        maxStoredMolPerM2 = storedPerVolume * vMax * (1 + 1e-12);
        hot = new Corner(comps, q, temps, jUp, 0, topK);
        cold = new Corner(comps, q, temps, jUp, offset, topK);
    }

    /** Whether the bound may use this: a finite admissible pressure everywhere and rate constants found convex in u. */
    boolean applicable() {
        return finite && hot.convex && cold.convex;
    }

    /**
     * Most moles a corner's cavity can hold while its conversions are at most {@code alphaHi} (the storage volume grows
     * as the polymer goes) [mol/m²].
     */
    double capacity(double[] alphaHi) {
        double v = fixedVolumeM;
        for (int j = 0; j < alphaHi.length; j++) {
            v += heightM * freedWeight[j] * Math.min(1, Math.max(0, alphaHi[j]));
        }
        return storedPerVolume * v * (1 + 1e-12);
    }

    /** The last index i &lt; n − 1 with px[i] ≤ v, for px[0] &lt; v &lt; px[n − 1] (bisection). */
    static int segment(double[] px, double v) {
        int lo = 0;
        int hi = px.length - 1;
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (px[mid] <= v) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /**
     * One corner's gas and vent as functions of the hot clock rate u, on a common set of breakpoints
     * where every piece is linear: the tangent minorants of k_j(T − δ) and the concave majorant of J.
     */
    static final class Corner {
        /** Breakpoints in u (x[0] = 0) and, per component, the minorant of its rate constant there. */
        final double[] x;
        final double[][] kappa;
        /** The vent majorant Ĵ at the breakpoints. */
        final double[] vent;
        /** Per component, its rate constant at the hot corner k_j(T(u)) at the breakpoints (exact). */
        final double[][] hotKappa;
        /** Whether the rate constants were found convex in u on the grid (else the corner bounds nothing). */
        final boolean convex;

        Corner(Component[] comps, int q, double[] temps, double[] jUp, double offset, double topK) {
            int k = comps.length;
            Component clock = comps[q];
            double eq = clock.activationEnergyJPerMol();
            // hot temperatures: the corner's grid shifted up by the offset, to the top
            int n = 0;
            while (n < temps.length && temps[n] + offset <= topK + 1e-9) {
                n++;
            }
            // and one point at or above the top, so that φ is its convex self (not held flat past its last breakpoint)
            // up to the hottest rate a move may have: the least duration is then convex in the room, which the
            // programme's affine bin labels rely on
            if (n < temps.length) {
                n++;
            }
            n = Math.max(n, 2);
            double[] hotT = new double[n];
            double[] u = new double[n];
            for (int i = 0; i < n; i++) {
                hotT[i] = temps[i] + offset;
                u[i] = clock.rateConstant(hotT[i]);
            }
            // Ĵ: upper concave hull of (u_i, jUp_i) — on [T_i, T_{i+1}] the flux is at most jUp_i and u at least u_i —
            // from (0, jUp_0), flat beyond the last point
            double[] hx = new double[n + 1];
            double[] hy = new double[n + 1];
            int m = 0;
            for (int i = -1; i < n; i++) {
                double px = i < 0 ? 0 : u[i] * (1 - 1e-12);
                double py = jUp[Math.max(0, Math.min(i, jUp.length - 1))];
                if (m > 0 && px <= hx[m - 1]) {
                    hy[m - 1] = Math.max(hy[m - 1], py);
                    continue;
                }
                while (m >= 2 && (hx[m - 1] - hx[m - 2]) * (py - hy[m - 2]) - (hy[m - 1] - hy[m - 2]) * (px - hx[m - 2]) >= 0) {
                    m--;
                }
                hx[m] = px;
                hy[m] = py;
                m++;
            }
            // a sparser concave majorant: the least of the hull's supporting lines at every SPARSE-th vertex (each line
            // lies on or above the hull; consecutive lines meet between their vertices)
            {
                int[] keep = new int[m / SPARSE + 2];
                int nk = 0;
                for (int i = 0; i < m; i += SPARSE) {
                    keep[nk++] = i;
                }
                if (keep[nk - 1] != m - 1) {
                    keep[nk++] = m - 1;
                }
                double[] sx = new double[2 * nk];
                double[] sy = new double[2 * nk];
                int ns = 0;
                for (int a = 0; a < nk; a++) {
                    int v = keep[a];
                    double slope = v + 1 < m ? (hy[v + 1] - hy[v]) / (hx[v + 1] - hx[v]) : 0;
                    if (a == 0) {
                        sx[ns] = hx[v];
                        sy[ns] = hy[v];
                        ns++;
                    }
                    if (a + 1 < nk) {
                        int w = keep[a + 1];
                        double slopeW = w + 1 < m ? (hy[w + 1] - hy[w]) / (hx[w + 1] - hx[w]) : 0;
                        // L_v(x) = hy[v] + slope (x − hx[v]) meets L_w(x) = hy[w] + slopeW (x − hx[w])
                        double xi = slope > slopeW
                                ? (hy[w] - slopeW * hx[w] - hy[v] + slope * hx[v]) / (slope - slopeW) : hx[w];
                        xi = Math.min(Math.max(xi, hx[v]), hx[w]);
                        double yi = Math.max(hy[v] + slope * (xi - hx[v]), hy[w] + slopeW * (xi - hx[w]));
                        if (xi > sx[ns - 1]) {
                            sx[ns] = xi;
                            sy[ns] = yi;
                            ns++;
                        }
                    } else if (hx[v] > sx[ns - 1]) {
                        sx[ns] = hx[v];
                        sy[ns] = hy[v];
                        ns++;
                    }
                }
                hx = Arrays.copyOf(sx, ns);
                hy = Arrays.copyOf(sy, ns);
                m = ns;
            }
            // tangent minorants of κ_j(u) = k_j(T(u) − δ) at every SPARSE-th grid temperature: slope
            // dκ/du = (κ/u)(E_j/E_q)(T/T_c)²; consecutive tangents meet between their points when κ is convex in u
            // (checked: slopes must not fall, and each secant must lie between its ends' tangent slopes)
            int nf = n;
            int nc = (nf - 1) / SPARSE + 1 + ((nf - 1) % SPARSE == 0 ? 0 : 1);
            double[] hotC = new double[nc];
            double[] uC = new double[nc];
            for (int a = 0; a < nc; a++) {
                int i = Math.min(a * SPARSE, nf - 1);
                hotC[a] = hotT[i];
                uC[a] = u[i];
            }
            hotT = hotC;
            u = uC;
            n = nc;
            boolean ok = true;
            java.util.TreeSet<Double> bps = new java.util.TreeSet<>();
            bps.add(0.0);
            for (int i = 0; i < m; i++) {
                bps.add(hx[i]);
            }
            double[][] tx = new double[k][];
            double[][] ty = new double[k][];
            for (int j = 0; j < k; j++) {
                double ej = comps[j].activationEnergyJPerMol();
                double[] kv = new double[n];
                double[] sl = new double[n];
                for (int i = 0; i < n; i++) {
                    double tc = hotT[i] - offset;
                    kv[i] = comps[j].rateConstant(tc);
                    sl[i] = u[i] > 0 ? kv[i] / u[i] * (ej / eq) * (hotT[i] / tc) * (hotT[i] / tc) : 0;
                }
                for (int i = 1; i < n; i++) {
                    if (sl[i] < sl[i - 1] * (1 - 1e-9)) {
                        ok = false;
                    }
                    // secant between samples lies between the tangent slopes for a convex function
                    double sec = u[i] > u[i - 1] ? (kv[i] - kv[i - 1]) / (u[i] - u[i - 1]) : sl[i];
                    if (sec < sl[i - 1] * (1 - 1e-9) || sec > sl[i] * (1 + 1e-9)) {
                        ok = false;
                    }
                }
                // vertices: where the tangent at u_0 meets zero, then the tangents' intersections, then the last point
                double[] vx = new double[n + 2];
                double[] vy = new double[n + 2];
                int c = 0;
                vx[c] = 0;
                vy[c] = 0;
                c++;
                double zero = u[0] - kv[0] / Math.max(sl[0], 1e-300);
                if (zero > 0) {
                    vx[c] = zero;
                    vy[c] = 0;
                    c++;
                }
                for (int i = 0; i + 1 < n; i++) {
                    double s0 = sl[i];
                    double s1 = sl[i + 1];
                    double xi = s1 > s0 ? (kv[i + 1] - s1 * u[i + 1] - kv[i] + s0 * u[i]) / (s0 - s1) : u[i];
                    xi = Math.min(Math.max(xi, u[i]), u[i + 1]);
                    double yi = kv[i] + s0 * (xi - u[i]);
                    if (xi > vx[c - 1]) {
                        vx[c] = xi;
                        vy[c] = Math.max(0, Math.min(yi, kv[i + 1] + s1 * (xi - u[i + 1])));
                        c++;
                    }
                }
                if (u[n - 1] > vx[c - 1]) {
                    vx[c] = u[n - 1];
                    vy[c] = kv[n - 1];
                    c++;
                }
                tx[j] = Arrays.copyOf(vx, c);
                ty[j] = Arrays.copyOf(vy, c);
                for (int i = 0; i < c; i++) {
                    bps.add(tx[j][i]);
                }
            }
            convex = ok;
            double top = u[n - 1];
            x = bps.stream().mapToDouble(Double::doubleValue).filter(v -> v <= top).toArray();
            kappa = new double[k][];
            for (int j = 0; j < k; j++) {
                kappa[j] = new double[x.length];
                for (int i = 0; i < x.length; i++) {
                    kappa[j][i] = interpolate(tx[j], ty[j], x[i]) * (1 - 1e-12);
                }
            }
            hotKappa = new double[k][x.length];
            for (int i = 0; i < x.length; i++) {
                // the hot temperature at which the clock's rate constant is x_i (Arrhenius inverted)
                double t = x[i] > 0 ? eq / (R * Math.log(clock.preExponentialPerS() / x[i])) : 0;
                for (int j = 0; j < k; j++) {
                    hotKappa[j][i] = t > 0 ? comps[j].rateConstant(t) : 0;
                }
            }
            double[] jx = Arrays.copyOf(hx, m);
            double[] jy = Arrays.copyOf(hy, m);
            vent = new double[x.length];
            for (int i = 0; i < x.length; i++) {
                vent[i] = interpolate(jx, jy, x[i]) * (1 + 1e-12);
            }
        }

        /** The piecewise-linear function through (px, py) at v (flat beyond the ends). */
        private static double interpolate(double[] px, double[] py, double v) {
            int n = px.length;
            if (v <= px[0]) {
                return py[0];
            }
            if (v >= px[n - 1]) {
                return py[n - 1];
            }
            int lo = segment(px, v);
            return py[lo] + (py[lo + 1] - py[lo]) * (v - px[lo]) / (px[lo + 1] - px[lo]);
        }

        /**
         * φ ≤ Σ a_j κ_j − Σ λ_j k_j(T_hot) − Ĵ, convex: the lower convex hull of the breakpoint values (κ̆_j are
         * tangent minorants, −λ_j k_j(T_hot(u)) is concave in u so its chords lie below it, −Ĵ is a minorant of −J),
         * for gas weights a_j (moles per unit reduced time) and multipliers λ_j ≥ 0 on the hot corner's reduced time
         * [mol m⁻² s⁻¹]. With λ the move's own progress θ_j of the hot reduced time is paid up front: ∫(G − J) dt ≥
         * Σ λ_j θ_j + ∫(γ − Σ λ_j k_j − J) dt for any λ ≥ 0.
         */
        Phi phi(double[] a, double[] lambda) {
            if (lambda == null) {
                return new Phi(x, a, kappa, vent);
            }
            int n = x.length;
            if (hxs == null) {
                hxs = new double[n + 1];
                hys = new double[n + 1];
            }
            double[] hxs = this.hxs;
            double[] hys = this.hys;
            int m = 0;
            // below the breakpoint `low` the integrand is at least its value there with the gas left out (γ ≥ 0, the
            // other terms fall with u): one flat step stands for that stretch, so the hull is built on fewer points
            int first = 0;
            if (low > 0) {
                double floor = -vent[low];
                for (int j = 0; j < a.length; j++) {
                    if (lambda[j] > 0) {
                        floor -= lambda[j] * hotKappa[j][low] * (1 + 1e-12);
                    }
                }
                hxs[0] = 0;
                hys[0] = floor;
                m = 1;
                first = low;
                // the step's right end (x_low, floor) is below the value at x_low, so the hull passes under it
                double yl = floor;
                while (m >= 2 && (hxs[m - 1] - hxs[m - 2]) * (yl - hys[m - 2]) - (hys[m - 1] - hys[m - 2]) * (x[low] - hxs[m - 2]) <= 0) {
                    m--;
                }
                hxs[m] = x[low];
                hys[m] = yl;
                m++;
                first = low + 1;
            }
            for (int i = first; i < n; i++) {
                double g = 0;
                for (int j = 0; j < a.length; j++) {
                    g += a[j] * kappa[j][i];
                    if (lambda != null && lambda[j] > 0) {
                        g -= lambda[j] * hotKappa[j][i] * (1 + 1e-12);
                    }
                }
                double yi = g - vent[i];
                // lower convex hull (monotone chain)
                while (m >= 2 && (hxs[m - 1] - hxs[m - 2]) * (yi - hys[m - 2]) - (hys[m - 1] - hys[m - 2]) * (x[i] - hxs[m - 2]) <= 0) {
                    m--;
                }
                hxs[m] = x[i];
                hys[m] = yi;
                m++;
            }
            return new Phi(Arrays.copyOf(hxs, m), Arrays.copyOf(hys, m));
        }

        /** Scratch for the hulls of {@link #phi} (a corner serves one bound, on one thread). */
        private double[] hxs;
        private double[] hys;

        /** The first breakpoint at or above the clock's rate constant at the coolest temperature worth resolving. */
        private int low;

        /** Below {@code coolK} (hot corner) the hulls of {@link #phi} with multipliers are not resolved point by point. */
        void resolveFrom(double clockRateAtCool) {
            int i = 0;
            while (i + 1 < x.length && x[i] < clockRateAtCool) {
                i++;
            }
            low = i;
        }
    }

    /**
     * A convex, piecewise-linear φ(u) with φ(0) &lt; 0 (the cap vents something), on [0, x_last]: the net rate at
     * which a corner stores gas while the clock runs at u.
     */
    static final class Phi {
        private final double[] x;
        /** The values at the breakpoints, or null: then they are Σ a_j κ_j − Ĵ, evaluated when asked (convex as it is). */
        private final double[] y;
        private final double[] a;
        private final double[][] kappa;
        private final double[] vent;
        private int argmin = -1;

        Phi(double[] x, double[] y) {
            this.x = x;
            this.y = y;
            this.a = null;
            this.kappa = null;
            this.vent = null;
        }

        /** φ = Σ a_j κ̆_j − Ĵ on the corner's breakpoints, evaluated lazily (a search looks at a few of them). */
        Phi(double[] x, double[] a, double[][] kappa, double[] vent) {
            this.x = x;
            this.y = null;
            this.a = a.clone();
            this.kappa = kappa;
            this.vent = vent;
        }

        private double yv(int i) {
            if (y != null) {
                return y[i];
            }
            if (seen == null) {
                seen = new double[x.length];
                Arrays.fill(seen, Double.NaN);
            }
            if (!Double.isNaN(seen[i])) {
                return seen[i];
            }
            double g = 0;
            for (int j = 0; j < a.length; j++) {
                if (a[j] != 0) {
                    g += a[j] * kappa[j][i];
                }
            }
            seen[i] = g - vent[i];
            return seen[i];
        }

        /** The lazily evaluated φ at the breakpoints asked for so far (NaN where not yet asked). */
        private double[] seen;

        /** The breakpoint where φ is least (φ convex: the first whose next difference is not negative). */
        private int argmin() {
            if (argmin < 0) {
                int lo = 0;
                int hi = x.length - 1;
                while (lo < hi) {
                    int mid = (lo + hi) >>> 1;
                    if (yv(mid + 1) - yv(mid) >= 0) {
                        hi = mid;
                    } else {
                        lo = mid + 1;
                    }
                }
                argmin = lo;
            }
            return argmin;
        }

        private double value(double v) {
            int n = x.length;
            if (v <= x[0]) {
                return yv(0);
            }
            if (v >= x[n - 1]) {
                return yv(n - 1);
            }
            int lo = segment(x, v);
            double ylo = yv(lo);
            return ylo + (yv(lo + 1) - ylo) * (v - x[lo]) / (x[lo + 1] - x[lo]);
        }

        /** Where the last search ended. */
        private int hint;
        /** The last cap seen, the last vertex at or below it, and φ there (the bound asks with one cap per level). */
        private double capSeen = Double.NaN;
        private int capIndex;
        private double capValue;

        private void prepare(double cap) {
            if (cap == capSeen) {
                return;
            }
            int last = x.length - 1;
            capIndex = cap >= x[last] ? last : cap <= x[0] ? 0 : segment(x, cap);
            capValue = value(cap);
            capSeen = cap;
        }

        /** The largest u ≤ cap with φ(u) ≤ r u (φ(u)/u rises with u); cap when φ(cap) ≤ r cap. */
        private double largestBelow(double r, double cap) {
            prepare(cap);
            if (capValue <= r * cap) {
                return cap;
            }
            // vertices up to the cap: the last with φ ≤ r x (vertex 0, at x = 0 where φ(0) < 0, always qualifies); the
            // search gallops from the last answer (successive questions differ little)
            int lo;
            int hi;
            int cap0 = capIndex;
            if (cap0 > 0 && yv(cap0) <= r * x[cap0]) {
                lo = cap0;
            } else {
                int h = Math.min(Math.max(hint, 0), cap0);
                if (h == 0 || yv(h) <= r * x[h]) {
                    // the answer is at or above h: gallop up
                    lo = h;
                    int step = 1;
                    hi = Math.min(h + step, cap0);
                    while (hi < cap0 && yv(hi) <= r * x[hi]) {
                        lo = hi;
                        step *= 2;
                        hi = Math.min(h + step, cap0);
                    }
                } else {
                    // below h: gallop down
                    hi = h;
                    int step = 1;
                    lo = Math.max(h - step, 0);
                    while (lo > 0 && !(yv(lo) <= r * x[lo])) {
                        hi = lo;
                        step *= 2;
                        lo = Math.max(h - step, 0);
                    }
                }
                while (hi - lo > 1) {
                    int mid = (lo + hi) >>> 1;
                    if (yv(mid) <= r * x[mid]) {
                        lo = mid;
                    } else {
                        hi = mid;
                    }
                }
                hint = lo;
            }
            double x1;
            double y1;
            if (lo == capIndex) {
                x1 = cap;
                y1 = capValue;
            } else {
                x1 = x[lo + 1];
                y1 = yv(lo + 1);
            }
            double ylo = yv(lo);
            double b = x1 > x[lo] ? (y1 - ylo) / (x1 - x[lo]) : 0;
            double a = ylo - b * x[lo];
            // a + b u = r u  →  u = a / (r − b)
            double root = r != b ? a / (r - b) : x[lo];
            return Math.min(Math.max(root, x[lo]), x1);
        }

        /**
         * The least duration of a move in which the clock gains hot reduced time F ∈ [fLo, fHi] at rates u ≤ uMax and
         * the corner's stored gas may rise by at most {@code room} beyond what is counted elsewhere: the least d with
         * d φ(F/d) ≤ room for some such F (docs/model.md, "Lower bounds", 5). +∞ if none.
         */
        double leastDuration(double room, double fLo, double fHi, double uMax) {
            if (!(fLo > 0) || !(yv(0) < 0)) {
                // no clock progress to bound, or a cap that vents nothing at the lowest temperatures (then φ/u need not
                // rise): nothing bounded here
                return 0;
            }
            if (room >= 0) {
                double u = largestBelow(room / fLo, uMax);
                return u > 0 ? fLo / u : Double.POSITIVE_INFINITY;
            }
            // room < 0: the move must vent more than it makes; d ≥ max(fLo/u, room/φ(u)) with φ(u) < 0 and d ≤ fHi/u
            double uc = largestBelow(room / fLo, uMax);
            double um = Math.min(x[argmin()], uMax);
            double uh = largestBelow(room / fHi, uMax);
            double u = Math.min(Math.max(uc, um), uh);
            double p = value(u);
            if (!(p < 0) || !(u > 0)) {
                return Double.POSITIVE_INFINITY;
            }
            return Math.max(fLo / u, room / p);
        }
    }
}
