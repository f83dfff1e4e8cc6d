package org.exhale.io;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.exhale.PhysicalConstants;
import org.exhale.report.Cautions;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.CornerResult;
import org.exhale.simulation.Extremum;
import org.exhale.simulation.Margin;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

/**
 * Writes the headline figures and margins of a simulated bake as JSON (non-finite numbers as null).
 * Every JSON file exhale writes goes through {@link #toJson}: decimal numbers are written with nine
 * significant digits (as in the CSV files), so binary noise such as 0.30000000000000004 or
 * 1749.9999999999998 never reaches a reader; nine digits keep far more than any input carries.
 * Values that feed a later computation (recipes, kinetics) go to YAML and CSV files, not to JSON.
 */
public final class SummaryJsonWriter {
    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
            .registerModule(new com.fasterxml.jackson.databind.module.SimpleModule("exhale-numbers")
                    .addSerializer(Double.class, new RoundedDouble()).addSerializer(double.class, new RoundedDouble()));

    /** Nine significant digits, the CSV files' precision; integral values keep one decimal (1513.0). */
    private static final class RoundedDouble extends com.fasterxml.jackson.databind.ser.std.StdSerializer<Double> {
        RoundedDouble() {
            super(Double.class);
        }

        @Override
        public void serialize(Double v, com.fasterxml.jackson.core.JsonGenerator g,
                              com.fasterxml.jackson.databind.SerializerProvider p) throws java.io.IOException {
            if (v == null || !Double.isFinite(v)) {
                g.writeNull();
                return;
            }
            String t = Numbers.csv(v == 0 ? 0.0 : v);
            g.writeNumber(t.contains(".") || t.contains("e") ? t : t + ".0");
        }
    }

    private SummaryJsonWriter() {
    }

    public static Map<String, Object> summary(BakeResult r, List<String> warnings) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("case", r.bake().name());
        CornerResult pc = r.pressureCorner();
        m.put("peak_excess_pressure_Pa", num(pc.peakPressure().value()));
        m.put("peak_excess_pressure_time_s", num(pc.peakPressure().timeS()));
        m.put("time_to_1pct_s", num(r.timeTo1pctS()));
        m.put("time_to_target_s", num(r.timeToTargetS()));
        m.put("unconverted_at_checkpoint", num(r.unconvertedAtCheckpoint()));
        m.put("residue_checkpoint", checkpoint(r.residueCheckpoint()));
        m.put("final_unconverted", num(r.finalUnconverted()));
        m.put("max_wafer_temperature_C", num(r.maxWaferTemperatureK() - PhysicalConstants.ZERO_CELSIUS_K));
        m.put("thermal_dose_s", r.bake().limits().dose() == null ? null : num(r.thermalDoseS()));
        m.put("gas_regime", r.regime().label());
        m.put("mass_balance_error", num(r.massBalanceError()));
        if (r.bake().film() != null) {
            m.put("peak_cap_stress_Pa", num(r.max("cap_stress_Pa").value()));
            m.put("peak_deflection_m", num(r.max("deflection_m").value()));
        }
        if (r.bake().chamber() != null) {
            m.put("peak_chamber_load_sccm", num(r.max("chamber_load_sccm").value()));
            m.put("peak_chamber_load_time_s", num(r.max("chamber_load_sccm").timeS()));
            m.put("peak_chamber_ppm", num(r.max("chamber_ppm").value()));
            m.put("peak_chamber_ppm_time_s", num(r.max("chamber_ppm").timeS()));
            CornerResult hot = r.hottest();
            double[] last = hot.history().isEmpty() ? null : hot.history().get(hot.history().size() - 1);
            if (last != null) {
                // (no chamber "mass balance" here: evolved = held + exhausted holds by construction of the states)
                m.put("evolved_mass_g", num(last[hot.column("evolved_g")]));
            }
            m.put("chamber_residence_time_s", num(r.bake().chamber().residenceTimeS()));
        }
        m.put("recipe_duration_s", num(r.bake().recipe().durationS()));
        m.put("seed_conversion", r.bake().polymer().seedConversion());
        // the components as the user named them (history.csv columns carry CSV-safe forms of the names)
        m.put("components", r.bake().polymer().components().stream().map(org.exhale.kinetics.Component::name).toList());
        m.put("all_limits_met", r.feasible());
        m.put("margins", margins(r.margins()));
        List<Object> corners = new ArrayList<>();
        for (CornerResult c : r.corners()) {
            Map<String, Object> cm = new LinkedHashMap<>();
            cm.put("corner", c.corner());
            cm.put("offset_K", c.offsetK());
            cm.put("gas_regime", c.regime().label());
            cm.put("quasi_steady_error_estimate", num(c.quasiSteadyError()));
            cm.put("peak_excess_pressure_Pa", num(c.peakPressure().value()));
            cm.put("peak_excess_pressure_time_s", num(c.peakPressure().timeS()));
            cm.put("max_relaxation_time_s", num(c.max("relaxation_time_s").value()));
            cm.put("time_to_1pct_s", num(c.timeTo1pctS()));
            cm.put("time_to_target_s", num(c.timeToTargetS()));
            cm.put("unconverted_at_checkpoint", num(c.unconvertedAtCheckpoint()));
            cm.put("final_unconverted", num(c.finalUnconverted()));
            cm.put("thermal_dose_s", num(c.thermalDoseS()));
            cm.put("mass_balance_error", num(c.massBalanceError()));
            cm.put("rhs_evaluations", c.evaluations());
            corners.add(cm);
        }
        m.put("corners", corners);
        m.put("warnings", warnings);
        List<String> cautions = new ArrayList<>(Cautions.BAKE);
        if (r.bake().chamber() != null) {
            cautions.addAll(Cautions.CHAMBER);
        }
        m.put("cautions", cautions);
        return m;
    }

    public static Map<String, Object> margins(List<Margin> margins) {
        Map<String, Object> out = new LinkedHashMap<>();
        for (Margin g : margins) {
            Map<String, Object> e = new LinkedHashMap<>();
            boolean kelvin = g.unit().equals("K");
            e.put("allowed", kelvin ? num(g.allowed() - PhysicalConstants.ZERO_CELSIUS_K) : num(g.allowed()));
            e.put("actual", kelvin ? num(g.actual() - PhysicalConstants.ZERO_CELSIUS_K) : num(g.actual()));
            e.put("unit", kelvin ? "C" : g.unit());
            if (g.headroom()) {
                e.put("headroom_K", num(g.margin()));
            } else {
                e.put("margin", num(g.margin()));
            }
            e.put("holds", g.holds());
            e.put("time_s", num(g.timeS()));
            e.put("corner", g.corner());
            if (!g.detail().isEmpty()) {
                e.put(g.limit().equals("residue") ? "evaluated_at" : "dominant", g.detail());
            }
            out.put(g.limit(), e);
        }
        return out;
    }

    /** Where the residue target applies: the end of the final hold, or why elsewhere. */
    public static Map<String, Object> checkpoint(org.exhale.recipe.ResidueCheckpoint at) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("time_s", num(at.timeS()));
        m.put("step", at.stepIndex() + 1);
        m.put("final_hold", at.finalHold());
        m.put("description", at.describe());
        return m;
    }

    /** A finite number, or null. */
    public static Double num(double v) {
        return Double.isFinite(v) ? v : null;
    }

    public static String toJson(Object tree) {
        try {
            return MAPPER.writeValueAsString(tree) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }
}
