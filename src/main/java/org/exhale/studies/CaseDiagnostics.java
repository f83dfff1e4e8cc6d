package org.exhale.studies;

import java.util.ArrayList;
import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Product;
import org.exhale.mechanics.CapStructure;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.GasRegime;
import org.exhale.transport.GasTransport;

/**
 * The figures an engineer looks at before baking a case, computed without simulating: the gas
 * regime in the pores, the diffusivities and permeance of every product, how fast the gas under the
 * cap relaxes (and so which gas regime to expect), the polymer load, the cap's buckling and thermal
 * stresses, and where each component starts to decompose. Pure computation, no I/O.
 *
 * <p>The ambient gas is taken as nitrogen (the case file does not name the gas) with the kinetic
 * diameter {@link #NITROGEN_DIAMETER_M}; pass another diameter to {@link #diagnose(BakeCase, double)}.
 */
public final class CaseDiagnostics {
    private static final double R = PhysicalConstants.GAS_CONSTANT;

    /**
     * Effective collision diameter of N₂ for the mean free path, 0.37 nm: a rounded value between the
     * kinetic diameter (≈ 0.364 nm) and the hard-sphere diameter from viscosity (≈ 0.375 nm) as commonly
     * tabulated — from memory, unconfirmed. Cross-check: with it the mean free path of air at 25 °C and
     * 1 atm is 66.8 nm, within 0.5 % of 66.5 nm (Jennings, J. Aerosol Sci. 19 (1988) 159).
     */
    public static final double NITROGEN_DIAMETER_M = 0.37e-9;
    /** Room temperature used for the "as deposited" figures: 25 °C. */
    public static final double ROOM_K = PhysicalConstants.ZERO_CELSIUS_K + 25;
    /** The rate constant taken as "decomposing noticeably": 1e-3 1/s (a time scale of about 17 min). */
    public static final double ONSET_RATE_PER_S = 1e-3;

    private CaseDiagnostics() {
    }

    /**
     * Transport of one product at one temperature. Diffusivities in m²/s; permeances in mol m⁻² s⁻¹ Pa⁻¹:
     * {@code permeance} is the whole K_j, {@code solidPermeance} its solution–diffusion share Π_j/h.
     */
    public record TransportAt(String label, double temperatureK, double knudsenM2PerS, double molecularM2PerS,
                              double poreM2PerS, double effectiveM2PerS, double solidPermeance, double permeance,
                              double relaxationTimeS) {
    }

    /**
     * One product: size exclusion in the pores, its solution–diffusion permeability through the cap's
     * solid (Π0 [mol m⁻¹ s⁻¹ Pa⁻¹], E [J/mol]; {@code ownPermeability} false where the cap's default
     * applies) and transport at room, onset and ceiling temperature.
     */
    public record ProductTransport(String component, double molarMassKgPerMol, double kineticDiameterM,
                                   double stericFactor, double permeabilityPi0, double permeationActivationJPerMol,
                                   boolean ownPermeability, List<TransportAt> at) {
        public ProductTransport {
            at = List.copyOf(at);
        }
    }

    /** Where a component reaches {@link #ONSET_RATE_PER_S}. */
    public record Onset(String component, double temperatureK) {
    }

    /**
     * The cap as a structure (all in Pa).
     *
     * @param thermalStressStartPa at the recipe's start setpoint (NaN without a recipe)
     */
    public record Mechanics(double planeStrainModulusPa, double bucklingStressPa, double thermalStressRoomPa,
                            double thermalStressStartPa, double thermalStressCeilingPa) {
        /** Whether the cap, once freed, is compressed beyond its buckling stress at T (σ_th given). */
        public static boolean buckles(double thermalStressPa, double bucklingStressPa) {
            return thermalStressPa < 0 && -thermalStressPa >= bucklingStressPa;
        }
    }

    /**
     * Everything {@link #diagnose} found.
     *
     * @param ambientDiameterM          collision diameter used for the ambient gas [m]
     * @param ambientPressurePa         chamber pressure [Pa] (0: vacuum, mean free paths infinite)
     * @param startK                    recipe start setpoint, NaN without a recipe
     * @param meanFreePathRoomM         λ of the ambient gas at 25 °C [m]
     * @param meanFreePathCeilingM      λ at the ceiling [m]
     * @param knudsenRoom               λ / (2 r_p) at 25 °C (NaN for a dense cap)
     * @param knudsenCeiling            λ / (2 r_p) at the ceiling
     * @param initialLoadKgPerM2        m0 = ρ d
     * @param initialGasVolumeM3PerM2   V_g before any decomposition, φ0 d + ε h/2
     * @param freedGasVolumeM3PerM2     V_g with all polymer converted (the largest, so the longest relaxation)
     * @param regimeIndicator           max over products of τ_g(onset, freed cavity) · {@link #ONSET_RATE_PER_S}
     * @param expectedRegime            quasi-steady when the indicator is at most the simulator's threshold
     * @param mechanics                 null when the case has no cap mechanics
     */
    public record CaseDiagnosis(double ambientDiameterM, double ambientPressurePa, double roomK, double ceilingK,
                                double startK, double meanFreePathRoomM, double meanFreePathCeilingM,
                                double knudsenRoom, double knudsenCeiling, double initialLoadKgPerM2,
                                double initialGasVolumeM3PerM2, double freedGasVolumeM3PerM2,
                                List<ProductTransport> products, List<Onset> onsets, double regimeIndicator,
                                GasRegime expectedRegime, Mechanics mechanics) {
        public CaseDiagnosis {
            products = List.copyOf(products);
            onsets = List.copyOf(onsets);
        }
    }

    /**
     * Mean free path λ = k T / (√2 π d² p) of a gas of hard spheres (IUPAC Gold Book, "mean free
     * path") [m]; infinite at p = 0.
     */
    public static double meanFreePathM(double temperatureK, double pressurePa, double diameterM) {
        if (pressurePa == 0) {
            return Double.POSITIVE_INFINITY;
        }
        return PhysicalConstants.BOLTZMANN * temperatureK / (Math.sqrt(2) * Math.PI * diameterM * diameterM * pressurePa);
    }

    /** Knudsen number of a pore, λ over the pore diameter 2 r_p. */
    public static double knudsenNumber(double meanFreePathM, double poreRadiusM) {
        return meanFreePathM / (2 * poreRadiusM);
    }

    public static CaseDiagnosis diagnose(BakeCase bake) {
        return diagnose(bake, NITROGEN_DIAMETER_M);
    }

    public static CaseDiagnosis diagnose(BakeCase bake, double ambientDiameterM) {
        if (!(ambientDiameterM > 0 && ambientDiameterM < 1e-8)) {
            throw new IllegalArgumentException("ambient gas diameter must be in (0, 10) nm, got " + ambientDiameterM + " m");
        }
        double pAmb = bake.ambient().pressurePa();
        double ceiling = bake.limits().ceilingK();
        double start = bake.recipe() == null ? Double.NaN : bake.recipe().startK();
        double lRoom = meanFreePathM(ROOM_K, pAmb, ambientDiameterM);
        double lCeil = meanFreePathM(ceiling, pAmb, ambientDiameterM);
        boolean porous = bake.cap().porosity() > 0;
        double r = bake.cap().poreRadiusM();
        double knRoom = porous ? knudsenNumber(lRoom, r) : Double.NaN;
        double knCeil = porous ? knudsenNumber(lCeil, r) : Double.NaN;

        double d = bake.cavity().heightM();
        double m0 = bake.polymer().densityKgPerM3() * d;
        double capPores = bake.cap().porosity() * bake.cap().thicknessM() / 2;
        double vInitial = bake.polymer().freeVolumeFraction() * d + capPores;
        double charShare = 0;
        for (Component c : bake.polymer().components()) {
            charShare += c.fraction() * c.charFraction();
        }
        double vFreed = d * (1 - charShare) + vInitial;

        List<Component> comps = bake.polymer().components();
        List<Product> products = comps.stream().map(Component::product).toList();
        GasTransport gas = new GasTransport(bake.cap(), bake.ambient(), products);
        List<ProductTransport> transport = new ArrayList<>();
        List<Onset> onsets = new ArrayList<>();
        double indicator = 0;
        for (int j = 0; j < comps.size(); j++) {
            Component c = comps.get(j);
            double onset = c.temperatureForRateConstant(ONSET_RATE_PER_S);
            onsets.add(new Onset(c.name(), onset));
            List<TransportAt> at = new ArrayList<>();
            at.add(transportAt(gas, j, "25 C", ROOM_K, vFreed));
            boolean onsetValid = onset > 0 && Double.isFinite(onset);
            if (onsetValid) {
                TransportAt o = transportAt(gas, j, "onset", onset, vFreed);
                at.add(o);
                indicator = Math.max(indicator, o.relaxationTimeS() * ONSET_RATE_PER_S);
            }
            TransportAt top = transportAt(gas, j, "ceiling", ceiling, vFreed);
            at.add(top);
            if (!onsetValid) {
                indicator = Math.max(indicator, top.relaxationTimeS() * ONSET_RATE_PER_S);
            }
            Product pr = c.product();
            boolean own = pr.hasOwnPermeability();
            transport.add(new ProductTransport(c.name(), pr.molarMassKgPerMol(), pr.kineticDiameterM(),
                    gas.stericFactor(j), own ? pr.permeabilityPi0() : bake.cap().permeabilityPi0(),
                    own ? pr.permeationActivationJPerMol() : bake.cap().permeationActivationJPerMol(), own, at));
        }
        GasRegime regime = indicator <= BakeSimulator.QUASI_STEADY_ERROR ? GasRegime.QUASI_STEADY : GasRegime.FULL_GAS;

        Mechanics mech = null;
        CapStructure cap = bake.capStructure();
        if (cap != null) {
            mech = new Mechanics(cap.planeStrainModulusPa(), cap.bucklingStressPa(), cap.thermalStressPa(ROOM_K),
                    Double.isNaN(start) ? Double.NaN : cap.thermalStressPa(start), cap.thermalStressPa(ceiling));
        }
        return new CaseDiagnosis(ambientDiameterM, pAmb, ROOM_K, ceiling, start, lRoom, lCeil, knRoom, knCeil, m0,
                vInitial, vFreed, transport, onsets, indicator, regime, mech);
    }

    /** τ_g = V_g / (R T K): infinite where the product has no way out (K = 0). */
    private static TransportAt transportAt(GasTransport gas, int j, String label, double t, double vGas) {
        double k = gas.permeance(j, t);
        double tau = k > 0 ? vGas / (R * t * k) : Double.POSITIVE_INFINITY;
        return new TransportAt(label, t, gas.knudsenDiffusivity(j, t), gas.molecularDiffusivity(j, t),
                gas.poreDiffusivity(j, t), gas.effectiveDiffusivity(j, t),
                gas.solidPermeability(j, t) / gas.cap().thicknessM(), k, tau);
    }
}
