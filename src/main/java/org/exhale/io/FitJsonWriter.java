package org.exhale.io;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.exhale.fitting.ConversionCurve;
import org.exhale.fitting.FittedComponent;
import org.exhale.fitting.KineticsReport;
import org.exhale.fitting.KissingerResult;
import org.exhale.fitting.ModelFitResult;

/**
 * The machine-readable account of a fit: heating rates found, Kissinger, every model fit tried
 * with parameters, confidence half-widths and criteria, the choice, warnings and settings.
 * Energies in kJ/mol, A in 1/s, heating rates in K/min, temperatures in K.
 */
public final class FitJsonWriter {
    private FitJsonWriter() {
    }

    public static String format(KineticsReport report, Map<String, Object> settings, List<String> notes) {
        return format(report, settings, notes, report.warnings(), Map.of());
    }

    /**
     * @param warnings  every warning shown (the report's and the command's own)
     * @param metadata  per run label, the metadata block read from its file
     */
    public static String format(KineticsReport report, Map<String, Object> settings, List<String> notes,
                                List<String> warnings, Map<String, Map<String, String>> metadata) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("settings", settings);
        List<Map<String, Object>> runs = new ArrayList<>();
        for (ConversionCurve c : report.curves()) {
            Map<String, Object> r = new LinkedHashMap<>();
            r.put("label", c.label());
            r.put("heating_rate_K_min", c.heatingRateKPerMin());
            r.put("ramp_max_deviation_K", c.heatingMaxDevK());
            r.put("points", c.size());
            r.put("peak_temperature_K", c.peakTemperatureK());
            r.put("final_over_initial_mass", c.finalMass() / c.initialMass());
            r.put("samples_in_reaction_range", c.reactionTo() - c.reactionFrom() + 1);
            Map<String, String> meta = metadata.get(c.label());
            if (meta != null && !meta.isEmpty()) {
                r.put("metadata", meta);
            }
            runs.add(r);
        }
        root.put("runs", runs);
        KissingerResult k = report.kissinger();
        if (k != null) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("Ea_kJ_mol", k.energyJPerMol() / 1e3);
            m.put("Ea_ci_kJ_mol", finite(k.energyHalfWidthJPerMol() / 1e3));
            m.put("A_1_s", k.preExponentialPerS());
            m.put("lnA_ci", finite(k.lnPreExponentialHalfWidth()));
            m.put("confidence", k.confidence());
            m.put("peak_method", "cubic least squares over the top of the rate peak (rate >= 80 % of its maximum)");
            m.put("E_alpha_spread", finite(k.energySpread()));
            m.put("flagged", k.flagged());
            m.put("flag_rule", "E(alpha) over alpha 0.1-0.9 varies by more than 10 % of its mean "
                    + "(ICTAC: Vyazovkin et al., Thermochim. Acta 520 (2011) 1)");
            root.put("kissinger", m);
        }
        List<Map<String, Object>> fits = new ArrayList<>();
        for (ModelFitResult f : report.fits()) {
            fits.add(fit(f));
        }
        root.put("model_fits", fits);
        root.put("criterion", "BIC with an effective sample size, N_eff ln(SSR/N) + p ln N_eff, N_eff from the lag-1 "
                + "autocorrelation of the residuals of the largest fit; a new component must also carry >= 3 % of the mass, "
                + "differ from the others and lower the rms residual by >= 10 % and 2e-4 (docs/model.md)");
        root.put("effective_points", finite(report.effectivePoints()));
        Map<String, String> verdicts = new LinkedHashMap<>();
        report.verdicts().forEach((count, v) -> verdicts.put(String.valueOf(count), v));
        root.put("component_verdicts", verdicts);
        root.put("chosen_components", report.chosen() == null ? null : report.chosen().components().size());
        root.put("intervals", report.intervalMethod());
        List<Map<String, Object>> fam = new ArrayList<>();
        for (KineticsReport.FamilyFit f : report.families()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("model", f.family().id());
            x.put("rms_alpha", finite(f.rms()));
            x.put("failure", f.failure());
            x.put("at_bound", f.atBound());
            fam.add(x);
        }
        root.put("model_families", fam);
        root.put("failures", report.failures());
        root.put("warnings", warnings);
        root.put("notes", notes);
        return SummaryJsonWriter.toJson(root);
    }

    private static Map<String, Object> fit(ModelFitResult f) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("components", f.components().size());
        m.put("model", f.options().model().id());
        m.put("ssr", f.ssr());
        m.put("rms_alpha", f.rms());
        m.put("points", f.points());
        m.put("parameters", f.parameters());
        m.put("aic", f.aic());
        m.put("bic", f.bic());
        m.put("iterations", f.iterations());
        m.put("residual_lag1_correlation", f.lag1Correlation());
        m.put("effective_points", f.effectivePoints());
        m.put("max_points_per_run", f.options().maxPointsPerRun());
        m.put("confidence", f.options().confidence());
        List<Map<String, Object>> cs = new ArrayList<>();
        for (FittedComponent c : f.components()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("name", c.name());
            x.put("fraction", c.fraction());
            x.put("fraction_ci", finite(c.fractionHalfWidth()));
            x.put("model", c.model().id());
            x.put("shape", c.shape());
            List<Double> shapeCi = new ArrayList<>();
            for (double h : c.shapeHalfWidth()) {
                shapeCi.add(finite(h));
            }
            x.put("shape_ci", shapeCi);
            x.put("Ea_kJ_mol", c.energyJPerMol() / 1e3);
            x.put("Ea_ci_kJ_mol", finite(c.energyHalfWidthJPerMol() / 1e3));
            x.put("A_1_s", c.preExponentialPerS());
            x.put("lnA", c.lnPreExponential());
            x.put("lnA_ci", finite(c.lnPreExponentialHalfWidth()));
            x.put("at_bound", new ArrayList<>(new java.util.TreeSet<>(c.atBound())));
            x.put("reference_temperature_K", c.referenceTemperatureK());
            cs.add(x);
        }
        m.put("parts", cs);
        return m;
    }

    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }
}
