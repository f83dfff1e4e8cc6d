package org.exhale.transport;

import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Product;

/**
 * Transport of the decomposition products through the cap (MODEL.md §5): Knudsen and molecular
 * diffusion combined by Bosanquet's rule, size exclusion, solution–diffusion through the solid, and
 * viscous (Darcy) flow of the cavity gas through a capillary bundle. All constants are computed
 * once; the per-instant methods allocate nothing and are safe to call from the integrator's
 * right-hand side. Instances are immutable and may be shared between threads.
 */
public final class GasTransport {
    private static final double R = PhysicalConstants.GAS_CONSTANT;

    private final CapFilm cap;
    private final Ambient ambient;
    private final int size;
    /** D_K,j = knudsen[j] · √T. */
    private final double[] knudsen;
    /** D_m,j = molecular[j] · T^1.75 (0 in vacuum). */
    private final double[] molecular;
    /** (ε/τ) S_j. */
    private final double[] geometric;
    private final double[] steric;
    /** Solution–diffusion Π0_j and E_Π,j/R of each product: its own, or the cap's default. */
    private final double[] pi0;
    private final double[] piEOverR;
    /** a in c(Δp) = a/T · g(Δp). */
    private final double viscousPerT;

    public GasTransport(CapFilm cap, Ambient ambient, List<Product> products) {
        this.cap = cap;
        this.ambient = ambient;
        this.size = products.size();
        this.knudsen = new double[size];
        this.molecular = new double[size];
        this.geometric = new double[size];
        this.steric = new double[size];
        this.pi0 = new double[size];
        this.piEOverR = new double[size];
        double eOverTau = cap.porosityOverTortuosity();
        for (int j = 0; j < size; j++) {
            Product p = products.get(j);
            knudsen[j] = cap.porosity() == 0 ? 0
                    : (2 * cap.poreRadiusM() / 3) * Math.sqrt(8 * R / (Math.PI * p.molarMassKgPerMol()));
            molecular[j] = ambient.isVacuum() ? 0
                    : p.molecularDiffusivityRefM2PerS() * (ambient.diffusivityRefPressurePa() / ambient.pressurePa())
                      / Math.pow(ambient.diffusivityRefTemperatureK(), 1.75);
            steric[j] = cap.porosity() == 0 ? 0 : stericFactor(p.kineticDiameterM(), cap.poreRadiusM());
            geometric[j] = eOverTau * steric[j];
            pi0[j] = p.hasOwnPermeability() ? p.permeabilityPi0() : cap.permeabilityPi0();
            piEOverR[j] = (p.hasOwnPermeability() ? p.permeationActivationJPerMol() : cap.permeationActivationJPerMol()) / R;
        }
        viscousPerT = cap.viscousPermeabilityM2() / (ambient.viscosityPaS() * R * cap.thicknessM());
    }

    /** Size exclusion (1 − λ)², λ = σ/(2 r_p), zero once the molecule does not fit. */
    public static double stericFactor(double kineticDiameterM, double poreRadiusM) {
        double lambda = kineticDiameterM / (2 * poreRadiusM);
        return lambda < 1 ? (1 - lambda) * (1 - lambda) : 0;
    }

    /** Mean molecular speed √(8RT/(πM)) [m/s]. */
    public static double meanMolecularSpeed(double temperatureK, double molarMassKgPerMol) {
        return Math.sqrt(8 * R * temperatureK / (Math.PI * molarMassKgPerMol));
    }

    public int size() {
        return size;
    }

    public CapFilm cap() {
        return cap;
    }

    public Ambient ambient() {
        return ambient;
    }

    /** Knudsen diffusivity (2 r_p/3) v̄ [m²/s]. */
    public double knudsenDiffusivity(int j, double temperatureK) {
        return knudsen[j] * Math.sqrt(temperatureK);
    }

    /** Molecular diffusivity at the ambient pressure [m²/s]; infinite in vacuum (no collisions with ambient gas). */
    public double molecularDiffusivity(int j, double temperatureK) {
        return molecular[j] == 0 ? Double.POSITIVE_INFINITY : molecular[j] * Math.pow(temperatureK, 1.75);
    }

    /** Pore diffusivity by Bosanquet, 1/D = 1/D_K + 1/D_m [m²/s]. */
    public double poreDiffusivity(int j, double temperatureK) {
        double dk = knudsenDiffusivity(j, temperatureK);
        if (molecular[j] == 0 || dk == 0) {
            return dk;
        }
        double dm = molecular[j] * Math.pow(temperatureK, 1.75);
        return dk * dm / (dk + dm);
    }

    public double stericFactor(int j) {
        return steric[j];
    }

    /** Effective diffusivity (ε/τ) S D [m²/s]. */
    public double effectiveDiffusivity(int j, double temperatureK) {
        return geometric[j] == 0 ? 0 : geometric[j] * poreDiffusivity(j, temperatureK);
    }

    /** The cap's own solution–diffusion permeability Π(T), the default for every product [mol m⁻¹ s⁻¹ Pa⁻¹]. */
    public double solidPermeability(double temperatureK) {
        if (cap.permeabilityPi0() == 0) {
            return 0;
        }
        return cap.permeabilityPi0() * Math.exp(-cap.permeationActivationJPerMol() / (R * temperatureK));
    }

    /** Product j's solution–diffusion permeability Π_j(T): its own, else the cap's [mol m⁻¹ s⁻¹ Pa⁻¹]. */
    public double solidPermeability(int j, double temperatureK) {
        return pi0[j] == 0 ? 0 : pi0[j] * Math.exp(-piEOverR[j] / temperatureK);
    }

    /** Diffusive permeance K_j = D_eff,j/(R T h) + Π_j/h [mol m⁻² s⁻¹ Pa⁻¹]. */
    public double permeance(int j, double temperatureK) {
        double h = cap.thicknessM();
        return effectiveDiffusivity(j, temperatureK) / (R * temperatureK * h) + solidPermeability(j, temperatureK) / h;
    }

    /**
     * Viscous conductance per unit partial pressure, c(Δp) = J_v/(p_amb + Δp) with
     * J_v = (B0/μ)(p̄/RT)(Δp/h), p̄ = p_amb + Δp/2 [mol m⁻² s⁻¹ Pa⁻¹]. Zero at Δp ≤ 0.
     */
    public double viscousConductance(double temperatureK, double excessPressurePa) {
        if (excessPressurePa <= 0 || viscousPerT == 0) {
            return 0;
        }
        double pa = ambient.pressurePa();
        return viscousPerT / temperatureK * excessPressurePa * (pa + 0.5 * excessPressurePa) / (pa + excessPressurePa);
    }

    /** d c / d Δp. */
    private double viscousConductanceSlope(double temperatureK, double excessPressurePa) {
        if (viscousPerT == 0) {
            return 0;
        }
        double pa = ambient.pressurePa();
        double x = Math.max(excessPressurePa, 0);
        double s = pa + x;
        return viscousPerT / temperatureK * (pa * pa + pa * x + 0.5 * x * x) / (s * s);
    }

    /**
     * Quasi-steady excess pressure: the unique root of Σ_j G_j/(K_j + c(Δp)) = Δp.
     *
     * @param generation   G_j [mol m⁻² s⁻¹], non-negative
     * @param permeance    K_j at this temperature
     * @return Δp [Pa]; +∞ if gas is generated and there is no vent path at all
     */
    public double quasiSteadyExcessPressure(double temperatureK, double[] generation, double[] permeance) {
        double upper = 0;
        boolean any = false;
        for (int j = 0; j < size; j++) {
            if (generation[j] > 0) {
                any = true;
                upper += generation[j] / permeance[j];
            }
        }
        if (!any) {
            return 0;
        }
        if (viscousPerT == 0 || upper == 0) {
            return upper;
        }
        if (Double.isInfinite(upper) || Double.isNaN(upper)) {
            // No diffusive path for some product: the viscous flow alone bounds the pressure.
            upper = Double.MAX_VALUE;
        }
        // F(x) = Σ G/(K + c(x)) − x is strictly decreasing with F(0) ≥ 0: safeguarded Newton on [lo, hi].
        double lo = 0;
        double hi = upper;
        double x = Math.min(upper, initialGuess(temperatureK, generation, permeance, upper));
        for (int it = 0; it < 100; it++) {
            double c = viscousConductance(temperatureK, x);
            double dc = viscousConductanceSlope(temperatureK, x);
            double sum = 0;
            double dsum = 0;
            for (int j = 0; j < size; j++) {
                if (generation[j] > 0) {
                    double q = permeance[j] + c;
                    sum += generation[j] / q;
                    dsum -= generation[j] * dc / (q * q);
                }
            }
            double fx = sum - x;
            if (fx > 0) {
                lo = x;
            } else {
                hi = x;
            }
            double next = x - fx / (dsum - 1);
            if (!(next > lo && next < hi)) {
                next = hi == Double.MAX_VALUE ? Math.max(2 * lo, 1e-30) : 0.5 * (lo + hi);
            }
            if (Math.abs(next - x) <= 1e-13 * Math.max(x, 1e-300) || hi - lo <= 1e-13 * hi) {
                return next;
            }
            x = next;
        }
        return x;
    }

    private double initialGuess(double temperatureK, double[] generation, double[] permeance, double upper) {
        // Purely viscous estimate: Σ G = c(x) x, with c ≈ a x (p_a + x/2)/(p_a + x) / T.
        double g = 0;
        for (int j = 0; j < size; j++) {
            g += generation[j];
        }
        double a = viscousPerT / temperatureK;
        double pa = ambient.pressurePa();
        double viscousOnly = pa > 0 ? Math.sqrt(g / a) : Math.sqrt(2 * g / a);
        if (pa > 0 && viscousOnly < pa) {
            viscousOnly = Math.sqrt(g / a);
        }
        return Math.min(upper, viscousOnly);
    }
}
