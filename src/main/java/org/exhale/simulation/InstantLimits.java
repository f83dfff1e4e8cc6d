package org.exhale.simulation;

import java.util.List;

import org.exhale.kinetics.Component;
import org.exhale.kinetics.Product;
import org.exhale.mechanics.CapResponse;
import org.exhale.mechanics.CapStructure;
import org.exhale.transport.GasTransport;

/**
 * The limits that depend only on the instant — temperature, conversions and their rates — in the
 * quasi-steady gas regime: trapped pressure and every cap-mechanics limit. Used by the planner's
 * lower bound and seed (MODEL.md §9). Not thread-safe (scratch arrays); one per thread.
 */
public final class InstantLimits {
    private final Component[] components;
    private final double[] gasifiable;
    private final boolean[] included;
    private final GasTransport transport;
    private final CapStructure structure;
    private final double maxPressurePa;
    private final double[] gen;
    private final double[] perm;

    /**
     * @param included which components' gas counts (the lower bound leaves the others out)
     */
    public InstantLimits(BakeCase bake, boolean[] included) {
        List<Component> list = bake.polymer().components();
        components = list.toArray(new Component[0]);
        int k = components.length;
        gasifiable = new double[k];
        double m0 = bake.polymer().densityKgPerM3() * bake.cavity().heightM();
        for (int j = 0; j < k; j++) {
            Component c = components[j];
            gasifiable[j] = m0 * c.fraction() * (1 - c.charFraction()) / c.product().molarMassKgPerMol();
        }
        this.included = included.clone();
        transport = new GasTransport(bake.cap(), bake.ambient(), list.stream().map(Component::product).toList());
        structure = bake.capStructure();
        maxPressurePa = bake.limits().maxPressurePa();
        gen = new double[k];
        perm = new double[k];
    }

    public InstantLimits(BakeCase bake) {
        this(bake, all(bake.polymer().size()));
    }

    private static boolean[] all(int k) {
        boolean[] b = new boolean[k];
        java.util.Arrays.fill(b, true);
        return b;
    }

    public int size() {
        return components.length;
    }

    /** Quasi-steady excess pressure at temperature T and conversions α [Pa]. */
    public double excessPressure(double temperatureK, double[] alpha) {
        for (int j = 0; j < components.length; j++) {
            gen[j] = included[j] ? gasifiable[j] * components[j].rate(temperatureK, alpha[j]) : 0;
            perm[j] = transport.permeance(j, temperatureK);
        }
        return transport.quasiSteadyExcessPressure(temperatureK, gen, perm);
    }

    /**
     * The smallest ratio margin (allowed/actual) of the instantaneous limits at (T, α): pressure and
     * cap mechanics. +∞ when none is loaded.
     */
    public double margin(double temperatureK, double[] alpha) {
        double dp = excessPressure(temperatureK, alpha);
        double m = ratio(maxPressurePa, dp);
        if (beyondStructure(dp)) {
            return 0;
        }
        if (structure != null) {
            CapResponse r = structure.evaluate(temperatureK, dp);
            m = Math.min(m, ratio(structure.allowedStressPa(), r.maxStressPa()));
            m = Math.min(m, ratio(structure.allowedCrackingJPerM2(), r.channelCrackingJPerM2()));
            m = Math.min(m, ratio(structure.allowedDelaminationJPerM2(), r.delaminationJPerM2()));
            m = Math.min(m, ratio(structure.bucklingStressPa(), r.bucklingCompressionPa()));
            m = Math.min(m, ratio(structure.maxDeflectionM(), Math.abs(r.deflectionM())));
        }
        return m;
    }

    /**
     * The smallest margin of the instantaneous limits that can only tighten as gas is added —
     * trapped pressure, edge strength, channel cracking, deflection — and of buckling (which does
     * not depend on the gas), with each component's gas generation given [mol m⁻² s⁻¹].
     * Delamination is left out: under a compressive, membrane-dominated cap its energy release
     * can fall as the pressure rises, so a smaller generation would not give a looser limit.
     */
    public double monotoneMargin(double temperatureK, double[] generation) {
        for (int j = 0; j < components.length; j++) {
            gen[j] = generation[j];
            perm[j] = transport.permeance(j, temperatureK);
        }
        return monotoneMarginAtPressure(temperatureK, transport.quasiSteadyExcessPressure(temperatureK, gen, perm));
    }

    /**
     * The margin of {@link #monotoneMargin} at a given excess pressure instead of a generation: in any
     * gas regime these limits hold at (T, Δp) exactly when this is at least 1.
     */
    public double monotoneMarginAtPressure(double temperatureK, double dp) {
        double m = ratio(maxPressurePa, dp);
        if (beyondStructure(dp)) {
            return 0;
        }
        if (structure != null) {
            CapResponse r = structure.evaluate(temperatureK, dp);
            m = Math.min(m, ratio(structure.allowedStressPa(), r.maxStressPa()));
            m = Math.min(m, ratio(structure.allowedCrackingJPerM2(), r.channelCrackingJPerM2()));
            m = Math.min(m, ratio(structure.bucklingStressPa(), r.bucklingCompressionPa()));
            m = Math.min(m, ratio(structure.maxDeflectionM(), Math.abs(r.deflectionM())));
        }
        return m;
    }

    /** The cap's transport model (permeances, viscous conductance). */
    public GasTransport transport() {
        return transport;
    }

    /**
     * Pressures above this no film survives (1 TPa, beyond the strength of any solid) [Pa]: under a
     * nearly sealed cap (porosity 1e-308, a permeability of 1e-300) the quasi-steady pressure
     * overflows, and the plate formulas with it; every mechanical limit counts as failed there.
     */
    static final double BEYOND_ANY_FILM_PA = 1e12;

    private boolean beyondStructure(double dp) {
        return structure != null && !(dp <= BEYOND_ANY_FILM_PA);
    }

    /** Gasifiable moles of component j per area, m0 w_j (1 − c_j)/M_j [mol/m²]. */
    public double gasifiable(int j) {
        return gasifiable[j];
    }

    private static double ratio(double allowed, double actual) {
        if (!Double.isFinite(allowed) || actual <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        return Double.isNaN(actual) || Double.isInfinite(actual) ? 0 : allowed / actual;
    }

    /** Component j's Arrhenius rate dα/dt at (T, α) [1/s]. */
    public double rate(int j, double temperatureK, double alpha) {
        return components[j].rate(temperatureK, alpha);
    }

    public Product product(int j) {
        return components[j].product();
    }
}
