package org.exhale;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.exhale.fitting.AnalysisOptions;
import org.exhale.fitting.KineticsAnalysis;
import org.exhale.fitting.KineticsReport;
import org.exhale.fitting.ModelFitOptions;
import org.exhale.fitting.ModelKind;
import org.exhale.fitting.TgaRun;
import org.exhale.io.CaseFile;
import org.exhale.io.CaseTemplates;
import org.exhale.io.CaseYamlReader;
import org.exhale.io.TgaCsvReader;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.studies.CaseDiagnostics;

/**
 * The library's front door: the same jobs as the command line, returning the result records
 * instead of writing files. Everything is static, stateless and safe to call from several threads.
 * From jshell:
 *
 * <pre>
 *   jshell --class-path target/exhale.jar
 *   jshell&gt; var c = org.exhale.Exhale.loadCase(java.nio.file.Path.of("data/demo/porous-line.yaml"));
 *   jshell&gt; var r = org.exhale.Exhale.simulate(c.bake());
 *   jshell&gt; r.feasible(); r.peakExcessPressurePa(); r.timeTo1pctS()
 * </pre>
 *
 * Units are SI throughout (K, s, m, Pa, J/mol); see {@code notebooks-free-examples/} for complete
 * programs. Results are estimates from a model: confirm recipes on test wafers and follow your
 * site's safety rules (see {@link org.exhale.report.Cautions}).
 */
public final class Exhale {
    private Exhale() {
    }

    /**
     * Reads and validates a case file.
     *
     * @return the case, the tool (or null), the defaults filled in and the warnings
     * @throws org.exhale.io.InputException naming the file, key and line when the case is invalid
     */
    public static CaseFile loadCase(Path caseFile) {
        return CaseYamlReader.read(caseFile);
    }

    /** Simulates the case's recipe at every wafer corner and evaluates every limit. */
    public static BakeResult simulate(BakeCase bake) {
        return BakeSimulator.simulate(bake);
    }

    /**
     * Fits decomposition kinetics to thermogravimetric runs (CSV files as {@code exhale fit} reads
     * them) with the command's defaults: n-th order components, 1 to 3 of them, the number chosen by
     * the lowest BIC; conversion range 0.05 to 0.95; each run's final plateau as its residue.
     */
    public static KineticsReport fit(List<Path> runFiles) {
        if (runFiles == null || runFiles.isEmpty()) {
            throw new IllegalArgumentException("fit needs at least one run file");
        }
        TgaCsvReader reader = new TgaCsvReader();
        List<TgaRun> runs = new ArrayList<>();
        for (Path f : runFiles) {
            runs.addAll(reader.read(f).runs());
        }
        return KineticsAnalysis.run(runs, AnalysisOptions.DEFAULT, ModelFitOptions.of(1, ModelKind.NTH_ORDER), true);
    }

    /** The figures {@code exhale check} prints, computed without simulating. */
    public static CaseDiagnostics.CaseDiagnosis diagnose(BakeCase bake) {
        return CaseDiagnostics.diagnose(bake);
    }

    /** The text of a commented case-file template, as {@code exhale new KIND [--dense]} writes it. */
    public static String template(CaseTemplates.Kind kind, boolean dense) {
        return CaseTemplates.text(kind, dense);
    }

    /**
     * Plans the shortest recipe that meets every limit (the case's recipe gives the start
     * temperature; the tool's abilities come from its tool section).
     */
    public static org.exhale.planning.PlanResult plan(CaseFile caseFile) {
        if (caseFile.tool() == null) {
            throw new IllegalArgumentException(caseFile.path() + ": planning needs a 'tool' section");
        }
        return org.exhale.planning.Planner.plan(caseFile.bake(), caseFile.tool());
    }

    /** Plans with an explicit tool. */
    public static org.exhale.planning.PlanResult plan(BakeCase bake, org.exhale.planning.Tool tool) {
        return org.exhale.planning.Planner.plan(bake, tool);
    }
}
