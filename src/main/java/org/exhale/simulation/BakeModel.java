package org.exhale.simulation;

import java.util.ArrayList;
import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Polymer;
import org.exhale.kinetics.Product;
import org.exhale.kinetics.ReactionModel;
import org.exhale.mechanics.CapResponse;
import org.exhale.mechanics.CapStructure;
import org.exhale.recipe.Segment;
import org.exhale.transport.GasTransport;

/**
 * The bake equations of one wafer corner (MODEL.md §2–§5, §7): rates only, no integration and no
 * I/O. Holds per-run scratch arrays and the current recipe segment, so one instance serves one
 * run on one thread.
 *
 * <p>State vector: conversions α_j; in the full-gas regime the moles under the cap and the moles
 * vented, each normalised by the gasifiable moles n0_j = m0 w_j (1 − c_j)/M_j (so that
 * α_j − α_j(0) = x_j + v_j is the mass balance); and the thermal dose [s]. The wafer's
 * first-order lag behind the linear setpoint of each segment is solved in closed form, so it
 * needs no state and cannot overshoot.
 */
final class BakeModel {
    private static final double R = PhysicalConstants.GAS_CONSTANT;

    final int k;
    final GasRegime regime;
    final int iGas;
    final int iVent;
    final int iDose;
    /** First chamber state (normalised product in the chamber), then the exhausted amounts; −1 without a chamber. */
    final int iChamber;
    final int iExhaust;
    final int dim;

    private final double lagS;
    private final double offsetK;
    private final double heightM;
    private final double fixedVolumeM;
    private final double[] weightGasFree;
    private final double[] gasifiable;
    private final double[] alpha0;
    private final double[] fraction;
    private final Component[] components;
    private final ReactionModel[] models;
    private final GasTransport transport;
    private final double doseEOverR;
    private final double doseInvRef;
    private final boolean hasDose;
    private final List<String> names;
    private final CapStructure structure;

    private Segment segment;
    /** Gasifiable moles of each product in the whole load [mol]. */
    private final double[] loadMoles;
    private final double[] molarMass;
    /** R T_ch/(p_ch V_ch): mole fraction per mole in the chamber [1/mol]. */
    private final double chamberPerMole;
    private final double purge;
    private final double[] vent = new double[8];
    private double waferAtSegmentStart;

    // scratch, reused on every call
    private final double[] rate;
    private final double[] gen;
    private final double[] perm;
    private final double[] part;

    // observable layout
    final int oTime = 0;
    final int oSetpoint = 1;
    final int oWafer = 2;
    final int oAlpha = 3;
    final int oUnconverted;
    final int oPressure;
    final int oPartial;
    final int oFlux;
    final int oRelax;
    final int oDose;
    final int oStored;
    final int oGasified;
    final int oVented;
    /** First mechanics column, or −1 without cap mechanics. */
    final int oFilmStress;
    final int oEdgeStress;
    final int oDeflection;
    final int oCrack;
    final int oDelam;
    final int oCompression;
    final int oCentreStress;
    /** Chamber columns: load [sccm], total ppm, ppm per product, moles in chamber, exhausted, evolved; −1 without. */
    final int oLoad;
    final int oPpm;
    final int oChamberMoles;
    final int observableCount;

    BakeModel(BakeCase bake, double offsetK, GasRegime regime) {
        Polymer polymer = bake.polymer();
        this.k = polymer.size();
        this.regime = regime;
        this.offsetK = offsetK;
        this.lagS = bake.wafer().lagS();
        this.heightM = bake.cavity().heightM();
        this.fixedVolumeM = polymer.freeVolumeFraction() * heightM
                + bake.cap().porosity() * bake.cap().thicknessM() / 2;
        if (!(fixedVolumeM > 0)) {
            throw new IllegalArgumentException("polymer free_volume and cap porosity are both zero: "
                    + "the gas under the cap would start with no volume");
        }
        double m0 = polymer.densityKgPerM3() * heightM;
        components = polymer.components().toArray(new Component[0]);
        models = new ReactionModel[k];
        weightGasFree = new double[k];
        gasifiable = new double[k];
        alpha0 = new double[k];
        fraction = new double[k];
        List<Product> products = new ArrayList<>();
        names = new ArrayList<>();
        for (int j = 0; j < k; j++) {
            Component c = components[j];
            models[j] = c.model();
            fraction[j] = c.fraction();
            weightGasFree[j] = c.fraction() * (1 - c.charFraction());
            gasifiable[j] = m0 * weightGasFree[j] / c.product().molarMassKgPerMol();
            alpha0[j] = polymer.initialConversion(j);
            products.add(c.product());
            names.add(c.name());
        }
        transport = new GasTransport(bake.cap(), bake.ambient(), products);
        ThermalDose dose = bake.limits().dose();
        hasDose = dose != null;
        doseEOverR = hasDose ? dose.activationEnergyJPerMol() / R : 0;
        doseInvRef = hasDose ? 1 / dose.referenceK() : 0;

        int next = k;
        if (regime == GasRegime.FULL_GAS) {
            iGas = next;
            iVent = next + k;
            next += 2 * k;
        } else {
            iGas = -1;
            iVent = -1;
        }
        iDose = next++;
        Chamber ch = bake.chamber();
        if (ch != null) {
            iChamber = next;
            iExhaust = next + k;
            next += 2 * k;
            loadMoles = new double[k];
            double area = ch.ventAreaM2();
            for (int j = 0; j < k; j++) {
                loadMoles[j] = area * gasifiable[j];
            }
            chamberPerMole = R * ch.temperatureK() / (ch.pressurePa() * ch.volumeM3());
            purge = ch.purgeMolPerS();
            molarMass = new double[k];
            for (int j = 0; j < k; j++) {
                molarMass[j] = components[j].product().molarMassKgPerMol();
            }
        } else {
            iChamber = -1;
            iExhaust = -1;
            loadMoles = null;
            molarMass = null;
            chamberPerMole = 0;
            purge = 0;
        }
        dim = next;

        if (k > vent.length) {
            throw new IllegalArgumentException("at most " + vent.length + " components");
        }
        rate = new double[k];
        gen = new double[k];
        perm = new double[k];
        part = new double[k];

        oUnconverted = oAlpha + k;
        oPressure = oUnconverted + 1;
        oPartial = oPressure + 1;
        oFlux = oPartial + k;
        oRelax = oFlux + 1;
        oDose = oRelax + 1;
        oStored = oDose + 1;
        oGasified = oStored + 1;
        oVented = oGasified + 1;
        structure = bake.capStructure();
        if (structure != null) {
            oFilmStress = oVented + 1;
            // film, bending, membrane, edge, deflection, crack, delam, compression
            oEdgeStress = oFilmStress + 3;
            oDeflection = oFilmStress + 4;
            oCrack = oFilmStress + 5;
            oDelam = oFilmStress + 6;
            oCompression = oFilmStress + 7;
            oCentreStress = oFilmStress + 8;
            next = oFilmStress + 12;
        } else {
            oFilmStress = oEdgeStress = oDeflection = oCrack = oDelam = oCompression = oCentreStress = -1;
            next = oVented + 1;
        }
        if (iChamber >= 0) {
            oLoad = next;
            oPpm = next + 1;
            oChamberMoles = next + 2 + k;
            observableCount = oChamberMoles + 4;
        } else {
            oLoad = oPpm = oChamberMoles = -1;
            observableCount = next;
        }
    }

    GasTransport transport() {
        return transport;
    }

    List<String> componentNames() {
        return names;
    }

    /** Column names of {@link #observe}, SI units in the suffix. */
    List<String> observableNames() {
        List<String> out = new ArrayList<>();
        out.add("time_s");
        out.add("setpoint_K");
        out.add("wafer_K");
        for (String n : names) {
            out.add("alpha_" + n);
        }
        out.add("unconverted");
        out.add("excess_pressure_Pa");
        for (String n : names) {
            out.add("p_" + n + "_Pa");
        }
        out.add("vent_flux_mol_m2_s");
        out.add("relaxation_time_s");
        out.add("thermal_dose_s");
        out.add("stored_mol_m2");
        out.add("gasified_mol_m2");
        out.add("vented_mol_m2");
        if (structure != null) {
            out.addAll(List.of("film_stress_Pa", "bending_stress_Pa", "membrane_stress_Pa", "edge_stress_Pa",
                    "deflection_m", "crack_release_J_m2", "delamination_release_J_m2", "compression_Pa",
                    "centre_stress_Pa", "cap_stress_Pa", "bonded_crack_release_J_m2", "span_crack_release_J_m2"));
        }
        if (iChamber >= 0) {
            out.add("chamber_load_sccm");
            out.add("chamber_ppm");
            for (String n : names) {
                out.add("chamber_ppm_" + n);
            }
            out.add("chamber_mol");
            out.add("exhausted_mol");
            out.add("evolved_mol");
            out.add("evolved_g");
        }
        return out;
    }

    /** Moves to the next recipe segment; the wafer starts it where it ended the previous one. */
    void setSegment(Segment s) {
        if (segment != null && lagS > 0) {
            waferAtSegmentStart = waferTemperature(segment.endTimeS(), null);
        }
        this.segment = s;
    }

    /** Starts a segment with the wafer at a given temperature (a bake resumed from a saved state). */
    void startSegment(Segment s, double waferAtStartK) {
        this.segment = s;
        this.waferAtSegmentStart = waferAtStartK;
    }

    /**
     * Absolute tolerances of the states: conversions 1e-12; in the full-gas regime the normalised
     * moles under the cap 1e-7 of their expected peak {@code gasScale}; dose 1e-6 s; chamber states.
     */
    double[] absoluteTolerances(double gasScale) {
        double[] a = new double[dim];
        for (int j = 0; j < k; j++) {
            a[j] = 1e-12;
        }
        if (regime == GasRegime.FULL_GAS) {
            for (int j = 0; j < k; j++) {
                a[iGas + j] = Math.max(1e-7 * gasScale, 1e-30);
                a[iVent + j] = 1e-12;
            }
        }
        a[iDose] = 1e-6;
        if (iChamber >= 0) {
            for (int j = 0; j < k; j++) {
                a[iChamber + j] = 1e-14;
                a[iExhaust + j] = 1e-12;
            }
        }
        return a;
    }

    double[] initialState(double startSetpointK) {
        double[] y = new double[dim];
        System.arraycopy(alpha0, 0, y, 0, k);
        waferAtSegmentStart = startSetpointK + offsetK;
        segment = null;
        return y;
    }

    double setpoint(double t) {
        return segment.setpointAt(t) + offsetK;
    }

    double waferTemperature(double t, double[] y) {
        if (lagS == 0) {
            return setpoint(t);
        }
        // exact first-order lag under a linear setpoint: T = Ts(t) − bτ + (T0 − Ts(t0) + bτ) e^{−(t−t0)/τ}
        double b = segment.slopeKPerS();
        double t0 = segment.startTimeS();
        double ts0 = segment.startK() + offsetK;
        double ts = ts0 + b * (Math.min(Math.max(t, t0), segment.endTimeS()) - t0);
        return ts - b * lagS + (waferAtSegmentStart - ts0 + b * lagS) * Math.exp(-(t - t0) / lagS);
    }

    /** Storage volume per area V_g [m³/m² = m]. */
    double gasVolume(double[] y) {
        double freed = 0;
        for (int j = 0; j < k; j++) {
            freed += weightGasFree[j] * Math.min(Math.max(y[j], 0), 1);
        }
        return heightM * freed + fixedVolumeM;
    }

    /**
     * The equations for Hipparchus' integrators, whose interface returns a fresh array per call
     * (the only allocation on the right-hand-side path, forced by that API).
     */
    org.hipparchus.ode.OrdinaryDifferentialEquation asOde() {
        return new org.hipparchus.ode.OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return dim;
            }

            @Override
            public double[] computeDerivatives(double t, double[] y) {
                double[] dy = new double[y.length];
                derivatives(t, y, dy);
                return dy;
            }
        };
    }

    /** dy/dt; allocates nothing. */
    void derivatives(double t, double[] y, double[] dy) {
        double temp = waferTemperature(t, y);
        for (int j = 0; j < k; j++) {
            double r = components[j].rateConstant(temp) * models[j].f(y[j]);
            rate[j] = r;
            dy[j] = r;
        }
        if (regime == GasRegime.FULL_GAS) {
            double vg = gasVolume(y);
            double dp = 0;
            for (int j = 0; j < k; j++) {
                part[j] = Math.max(y[iGas + j], 0) * gasifiable[j] * R * temp / vg;
                dp += part[j];
            }
            double c = transport.viscousConductance(temp, dp);
            for (int j = 0; j < k; j++) {
                double flux = (transport.permeance(j, temp) + c) * part[j] / gasifiable[j];
                dy[iGas + j] = rate[j] - flux;
                dy[iVent + j] = flux;
            }
        }
        dy[iDose] = hasDose ? Math.exp(-doseEOverR * (1 / temp - doseInvRef)) : 0;
        if (iChamber >= 0) {
            // well-mixed purged chamber: dN_j/dt = Q_j − (F + ΣQ) y_j, in units of the load's moles
            double total = 0;
            for (int j = 0; j < k; j++) {
                double phi = regime == GasRegime.FULL_GAS ? dy[iVent + j] : rate[j];
                vent[j] = phi;
                total += loadMoles[j] * phi;
            }
            double out = (purge + total) * chamberPerMole;
            for (int j = 0; j < k; j++) {
                double flow = out * loadMoles[j] * y[iChamber + j];
                dy[iChamber + j] = vent[j] - flow / loadMoles[j];
                dy[iExhaust + j] = flow / loadMoles[j];
            }
        }
    }

    /** Everything reported at an instant, SI units, into {@code out} (length {@link #observableCount}). */
    void observe(double t, double[] y, double[] out) {
        double temp = waferTemperature(t, y);
        out[oTime] = t;
        out[oSetpoint] = setpoint(t);
        out[oWafer] = temp;
        double u = 0;
        double gasified = 0;
        for (int j = 0; j < k; j++) {
            double a = y[j];
            out[oAlpha + j] = a;
            u += fraction[j] * (1 - Math.min(Math.max(a, 0), 1));
            rate[j] = components[j].rateConstant(temp) * models[j].f(a);
            gen[j] = gasifiable[j] * rate[j];
            perm[j] = transport.permeance(j, temp);
            gasified += gasifiable[j] * (Math.min(a, 1) - alpha0[j]);
        }
        out[oUnconverted] = u;
        double vg = gasVolume(y);
        double dp;
        double stored = 0;
        double vented = 0;
        if (regime == GasRegime.FULL_GAS) {
            dp = 0;
            for (int j = 0; j < k; j++) {
                double n = Math.max(y[iGas + j], 0) * gasifiable[j];
                stored += n;
                vented += y[iVent + j] * gasifiable[j];
                part[j] = n * R * temp / vg;
                dp += part[j];
            }
        } else {
            dp = transport.quasiSteadyExcessPressure(temp, gen, perm);
            double c = transport.viscousConductance(temp, dp);
            for (int j = 0; j < k; j++) {
                part[j] = gen[j] == 0 ? 0 : gen[j] / (perm[j] + c);
                stored += part[j] * vg / (R * temp);
            }
            vented = gasified - stored;
        }
        double c = transport.viscousConductance(temp, dp);
        double flux = 0;
        double relax = 0;
        for (int j = 0; j < k; j++) {
            out[oPartial + j] = part[j];
            flux += (perm[j] + c) * part[j];
            double conductance = perm[j] + c;
            relax = Math.max(relax, conductance > 0 ? vg / (R * temp * conductance) : Double.POSITIVE_INFINITY);
        }
        out[oPressure] = dp;
        out[oFlux] = flux;
        out[oRelax] = relax;
        out[oDose] = y[iDose];
        out[oStored] = stored;
        out[oGasified] = gasified;
        out[oVented] = vented;
        if (structure != null && !(dp <= InstantLimits.BEYOND_ANY_FILM_PA)) {
            // a (nearly) sealed cap: the pressure is beyond any film, the plate formulas overflow; the thermal
            // stress stands, every pressure-driven response is unbounded and its limit fails
            CapResponse r0 = structure.evaluate(temp, 0);
            java.util.Arrays.fill(out, oFilmStress, oCompression + 1, Double.POSITIVE_INFINITY);
            out[oFilmStress] = r0.thermalStressPa();
            out[oCompression] = r0.bucklingCompressionPa();
        } else if (structure != null) {
            CapResponse r = structure.evaluate(temp, dp);
            out[oFilmStress] = r.thermalStressPa();
            out[oFilmStress + 1] = r.bendingStressPa();
            out[oFilmStress + 2] = r.membraneStressPa();
            out[oEdgeStress] = r.edgeStressPa();
            out[oDeflection] = r.deflectionM();
            out[oCrack] = r.channelCrackingJPerM2();
            out[oDelam] = r.delaminationJPerM2();
            out[oCompression] = r.bucklingCompressionPa();
            out[oCentreStress] = r.centreStressPa();
            out[oCentreStress + 1] = r.maxStressPa();
            out[oCentreStress + 2] = r.bondedCrackJPerM2();
            out[oCentreStress + 3] = r.spanCrackJPerM2();
        }
        if (iChamber >= 0) {
            double load = 0;
            double ppm = 0;
            double inChamber = 0;
            double exhausted = 0;
            double evolved = 0;
            double grams = 0;
            for (int j = 0; j < k; j++) {
                double phi = regime == GasRegime.FULL_GAS ? (perm[j] + c) * part[j] / gasifiable[j] : rate[j];
                load += loadMoles[j] * phi;
                double nj = loadMoles[j] * y[iChamber + j];
                double pj = 1e6 * nj * chamberPerMole;
                out[oPpm + 1 + j] = pj;
                ppm += pj;
                inChamber += nj;
                exhausted += loadMoles[j] * y[iExhaust + j];
                double ej = loadMoles[j] * (regime == GasRegime.FULL_GAS ? y[iVent + j] : Math.min(y[j], 1) - alpha0[j]);
                evolved += ej;
                grams += 1e3 * ej * molarMass[j];
            }
            out[oLoad] = load / PhysicalConstants.MOL_PER_S_PER_SCCM;
            out[oPpm] = ppm;
            out[oChamberMoles] = inChamber;
            out[oChamberMoles + 1] = exhausted;
            out[oChamberMoles + 2] = evolved;
            out[oChamberMoles + 3] = grams;
        }
    }



    CapStructure structure() {
        return structure;
    }

    /** Gasifiable moles per area of the whole polymer, Σ m0 w_j (1 − c_j)/M_j [mol/m²]. */
    static double gasifiableMoles(BakeCase bake) {
        double m0 = bake.polymer().densityKgPerM3() * bake.cavity().heightM();
        double s = 0;
        for (Component c : bake.polymer().components()) {
            s += m0 * c.fraction() * (1 - c.charFraction()) / c.product().molarMassKgPerMol();
        }
        return s;
    }

    /** Total gasifiable moles per area, Σ n0_j (α from its seed to 1) [mol/m²]. */
    double totalGasifiable() {
        double s = 0;
        for (int j = 0; j < k; j++) {
            s += gasifiable[j] * (1 - alpha0[j]);
        }
        return s;
    }
}
