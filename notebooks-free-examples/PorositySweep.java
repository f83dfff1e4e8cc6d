// Porosity sweep of the demo line case: how the cap's open porosity changes venting and the bake.
// Run from the project folder:  java -cp target/exhale.jar notebooks-free-examples/PorositySweep.java
import java.nio.file.Path;
import java.util.Locale;

import org.exhale.Exhale;
import org.exhale.io.CaseFile;
import org.exhale.report.Cautions;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.studies.CaseDiagnostics;

public class PorositySweep {
    public static void main(String[] args) {
        CaseFile cf = Exhale.loadCase(Path.of(args.length > 0 ? args[0] : "data/demo/porous-line.yaml"));
        System.out.println("porosity  D_eff(ceiling) [m2/s]  peak excess [Pa]  time to 1 % [min]  regime        all limits met");
        for (double porosity : new double[] {0.10, 0.20, 0.30, 0.40, 0.50}) {
            BakeCase bake = cf.bake().withCap(cf.bake().cap().withPorosity(porosity));
            BakeResult r = Exhale.simulate(bake);
            double dEff = CaseDiagnostics.diagnose(bake).products().get(0).at().stream()
                    .filter(t -> t.label().equals("ceiling")).findFirst().orElseThrow().effectiveM2PerS();
            System.out.println(String.format(Locale.ROOT, "%8.2f  %21.3e  %16.4f  %17.1f  %-12s  %s", porosity, dEff,
                    r.peakExcessPressurePa(), r.timeTo1pctS() / 60, r.regime().label(), r.feasible() ? "yes" : "no"));
        }
        Cautions.BAKE.forEach(c -> System.out.println("Caution: " + c));
    }
}
