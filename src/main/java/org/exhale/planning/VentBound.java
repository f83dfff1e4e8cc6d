package org.exhale.planning;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;
import org.exhale.transport.GasTransport;

/**
 * Two lower bounds that hold in any gas regime (MODEL.md §9; proofs in docs/model.md, "Lower bounds").
 *
 * <p><b>Ceiling</b>: the cold corner, never warmer than T_cap(t) − ΔT, gains reduced time
 * F_j(α_j(t)) = ∫k_j(T) ds ≤ ∫k_j(T_cap(s) − ΔT) ds; the integral is taken as an upper Riemann
 * sum (the integrand never falls), so α_j(t) ≤ b_j(t) with b_j rounded up.
 *
 * <p><b>Vent capacity</b>: the gas made at the cold corner is stored or vented, gasified = S + V.
 * The stored moles S = Δp V_g/(RT) never exceed P_adm(T) V_g,max/(RT), P_adm(T) the highest excess
 * pressure the monotone limits allow at T. The vented flux is at most
 * Φ(T, Δp) = max_j K_j(T) Δp + c(T, Δp) Δp, rising in Δp, with Δp ≤ P_adm(T) and
 * Δp ≤ (G_k(t) − V) RT/V_g,0 (G_k the gas the ceiling bound allows), so
 * V' ≤ Ψ(t, V) = sup_{T ≤ T_cap(t) − ΔT} Φ(T, min(P_adm(T), (G_k(t) − V) RT/V_g,0)). Ψ rises with t
 * and falls with V, so the explicit step v ← v + h Ψ(t + h, v) stays above V (docs/model.md). The
 * bake cannot end before some conversions within b(t) that meet the residue target have gasified no
 * more than S_max + v(t).
 */
final class VentBound {
    private static final double R = PhysicalConstants.GAS_CONSTANT;
    private static final double HORIZON_S = 2 * 86_400;
    /** Temperature grid step for P_adm and the permeances [K]. */
    static final double GRID_K = 0.5;
    /** Lowest wafer temperature considered for the vent flux [K]; Knudsen permeance grows as T falls. */
    static final double LOWEST_K = 250;

    /** The ceiling-only bound and the vent-capacity bound [s] (+∞ when beyond the horizon, 0 when not applicable). */
    record Outcome(double ceilingS, double ventS) {
    }

    private VentBound() {
    }

    static Outcome compute(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread, boolean withVent) {
        int k = limits.size();
        Component[] comps = bake.polymer().components().toArray(new Component[0]);
        ReducedTime[] rt = new ReducedTime[k];
        double[] w = new double[k];
        double[] a0 = new double[k];
        double[] n0 = new double[k];
        for (int j = 0; j < k; j++) {
            a0[j] = bake.polymer().initialConversion(j);
            rt[j] = new ReducedTime(comps[j].model(), a0[j]);
            w[j] = comps[j].fraction();
            n0[j] = limits.gasifiable(j);
        }
        double target = bake.limits().residue();
        Vent vent = withVent ? new Vent(bake, limits, cap.capK() - spread, a0) : null;
        double[] theta = new double[k];
        double[] b = new double[k];
        double v = 0;
        double ceilingS = Double.NaN;
        double ventS = vent == null || !vent.finite ? 0 : Double.NaN;
        double dt = 1;
        double t = 0;
        double settled = cap.settledS();
        while (Double.isNaN(ceilingS) || Double.isNaN(ventS)) {
            double tn = t + dt;
            double cold = Math.min(cap.wafer(tn), cap.capK()) - spread;
            if (tn > settled) {
                cold = cap.capK() - spread;
            }
            for (int j = 0; j < k; j++) {
                theta[j] += dt * comps[j].rateConstant(cold) * (1 + 1e-12);
                b[j] = rt[j].conversionAtMost(theta[j]);
            }
            if (Double.isNaN(ceilingS)) {
                double u = 0;
                for (int j = 0; j < k; j++) {
                    u += w[j] * (1 - b[j]);
                }
                if (u <= target) {
                    ceilingS = t;
                }
            }
            if (Double.isNaN(ventS)) {
                double gk = 0;
                for (int j = 0; j < k; j++) {
                    gk += n0[j] * (b[j] - a0[j]);
                }
                int top = vent.interval(cold);
                v += dt * Math.min(vent.prefixFlux[top], vent.flux(top, Math.max(0, gk - v) * R * vent.temps[top + 1] / vent.v0));
                double budget = vent.prefixStored[top] + v;
                if (residueWithin(w, n0, a0, b, budget) <= target) {
                    ventS = t;
                }
            }
            t = tn;
            if (t > HORIZON_S) {
                ceilingS = Double.isNaN(ceilingS) ? Double.POSITIVE_INFINITY : ceilingS;
                ventS = Double.isNaN(ventS) ? Double.POSITIVE_INFINITY : ventS;
            }
            // 1 s steps while the cap moves and near the end, longer ones in between cost at most dt of the bound
            dt = t < settled ? 1 : 5;
        }
        return new Outcome(ceilingS, ventS);
    }

    /**
     * The least residue Σ w_j (1 − α_j) over α0 ≤ α ≤ b with Σ n0_j (α_j − α0_j) ≤ budget: a
     * fractional knapsack, filled in order of residue removed per mole gasified.
     */
    static double residueWithin(double[] w, double[] n0, double[] a0, double[] b, double budget) {
        int k = w.length;
        Integer[] order = new Integer[k];
        for (int j = 0; j < k; j++) {
            order[j] = j;
        }
        java.util.Arrays.sort(order, (x, y) -> Double.compare(w[y] / n0[y], w[x] / n0[x]));
        double u = 0;
        double left = budget;
        for (int idx : order) {
            double room = n0[idx] * (b[idx] - a0[idx]);
            double take = Math.max(0, Math.min(room, left));
            left -= take;
            double alpha = a0[idx] + (n0[idx] > 0 ? take / n0[idx] : b[idx] - a0[idx]);
            u += w[idx] * (1 - Math.min(alpha, 1));
        }
        return u;
    }

    /**
     * An upper bound of every product's permeance on the temperature interval [lo, hi], raised against rounding: D_eff
     * rises with T (Knudsen √T, molecular T^1.75), 1/T falls, Π rises, so each part is taken at its worst end.
     */
    static double permeanceAtMost(GasTransport transport, int products, double lo, double hi, double thicknessM) {
        double kmax = 0;
        for (int j = 0; j < products; j++) {
            kmax = Math.max(kmax, transport.effectiveDiffusivity(j, hi) / (R * lo * thicknessM)
                    + transport.solidPermeability(j, hi) / thicknessM);
        }
        return kmax * (1 + 1e-9);
    }

    /** The highest Δp ≤ max_pressure at which the monotone limits hold at T (+∞ when none limits it). */
    static double admissiblePressure(InstantLimits limits, double temperatureK, double maxPressurePa) {
        if (limits.monotoneMarginAtPressure(temperatureK, 0) < 1) {
            return 0;
        }
        double hi = Double.isFinite(maxPressurePa) ? maxPressurePa * 1.000001 : 1e9;
        if (limits.monotoneMarginAtPressure(temperatureK, hi) >= 1) {
            return Double.isFinite(maxPressurePa) ? hi : Double.POSITIVE_INFINITY;
        }
        double lo = 0;
        while (hi - lo > 1e-6 * hi) {
            double mid = 0.5 * (lo + hi);
            if (limits.monotoneMarginAtPressure(temperatureK, mid) >= 1) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return hi;
    }

    /** The vent's capacity on a temperature grid: interval bounds of the permeance, viscous flow and P_adm. */
    private static final class Vent {
        final double[] temps;
        final double[] kUp;
        final double[] pUp;
        final double[] prefixFlux;
        final double[] prefixStored;
        final double v0;
        final boolean finite;
        private final GasTransport transport;

        Vent(BakeCase bake, InstantLimits limits, double coldCapK, double[] a0) {
            transport = limits.transport();
            int k = limits.size();
            double d = bake.cavity().heightM();
            double fixed = bake.polymer().freeVolumeFraction() * d + bake.cap().porosity() * bake.cap().thicknessM() / 2;
            double freed0 = 0;
            double freedMax = 0;
            for (int j = 0; j < k; j++) {
                Component c = bake.polymer().component(j);
                freed0 += c.fraction() * (1 - c.charFraction()) * a0[j];
                freedMax += c.fraction() * (1 - c.charFraction());
            }
            v0 = fixed + d * freed0;
            double vMax = fixed + d * freedMax;
            int n = (int) Math.ceil((coldCapK - LOWEST_K) / GRID_K) + 1;
            temps = new double[n + 1];
            double[] pAdm = new double[n + 1];
            boolean any = true;
            for (int i = 0; i <= n; i++) {
                temps[i] = LOWEST_K + i * GRID_K;
                pAdm[i] = admissiblePressure(limits, temps[i], bake.limits().maxPressurePa());
                any &= Double.isFinite(pAdm[i]);
            }
            finite = any;
            kUp = new double[n];
            pUp = new double[n];
            prefixFlux = new double[n];
            prefixStored = new double[n];
            double h = bake.cap().thicknessM();
            for (int i = 0; i < n; i++) {
                double lo = temps[i];
                double hi = temps[i + 1];
                kUp[i] = permeanceAtMost(transport, k, lo, hi, h);
                // P_adm between samples: the larger neighbour (P_adm varies smoothly; see docs/model.md)
                pUp[i] = Math.max(pAdm[i], pAdm[i + 1]) * (1 + 1e-9);
                double f = flux(i, pUp[i]);
                prefixFlux[i] = i == 0 ? f : Math.max(prefixFlux[i - 1], f);
                double s = pUp[i] * vMax / (R * lo);
                prefixStored[i] = i == 0 ? s : Math.max(prefixStored[i - 1], s);
            }
        }

        /** An upper bound of the vented flux on grid interval i at excess pressure dp [mol m⁻² s⁻¹]. */
        double flux(int i, double dp) {
            if (!(dp > 0)) {
                return 0;
            }
            // the viscous conductance falls with T: taken at the interval's low end
            return kUp[i] * dp + transport.viscousConductance(temps[i], dp) * dp;
        }

        /** The grid interval whose upper end is at or above T (every interval below it is also admissible). */
        int interval(double temperatureK) {
            int i = (int) Math.ceil((temperatureK - LOWEST_K) / GRID_K) - 1;
            return Math.max(0, Math.min(i, kUp.length - 1));
        }
    }
}
