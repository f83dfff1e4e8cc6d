// Fits kinetics to the demo thermogravimetric runs, puts the fitted components into the demo line
// case (products taken from the case's first component), simulates the case's recipe with them and
// plans the shortest safe recipe for the fitted polymer.
// Run from the project folder:
//   java -cp target/exhale.jar notebooks-free-examples/FitThenSimulate.java
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.exhale.Exhale;
import org.exhale.fitting.FittedComponent;
import org.exhale.fitting.KineticsReport;
import org.exhale.io.CaseFile;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Polymer;
import org.exhale.report.Cautions;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;

public class FitThenSimulate {
    public static void main(String[] args) {
        List<Path> runs = new ArrayList<>();
        for (String rate : new String[] {"02", "05", "10", "20"}) {
            runs.add(Path.of("data/demo/tga/demo_" + rate + "Kmin.csv"));
        }
        KineticsReport fit = Exhale.fit(runs);
        System.out.println("fitted " + fit.chosen().components().size() + " component(s), chosen by the lowest BIC");
        CaseFile cf = Exhale.loadCase(Path.of("data/demo/porous-line.yaml"));
        Component template = cf.bake().polymer().components().get(0);
        List<Component> fitted = new ArrayList<>();
        for (FittedComponent f : fit.chosen().components()) {
            System.out.println(String.format(Locale.ROOT, "  %-4s fraction %.3f  Ea %6.1f kJ/mol  A %.2e 1/s  T(k = 1e-3 1/s) %.1f C",
                    f.name(), f.fraction(), f.energyJPerMol() / 1e3, f.preExponentialPerS(),
                    new Component(f.name(), f.fraction(), f.model(), f.preExponentialPerS(), f.energyJPerMol(), 0,
                            template.product()).temperatureForRateConstant(1e-3) - 273.15));
            fitted.add(new Component(f.name(), f.fraction(), f.model(), f.preExponentialPerS(), f.energyJPerMol(), 0,
                    template.product()));
        }
        Polymer p = cf.bake().polymer();
        BakeCase bake = cf.bake().withPolymer(new Polymer(p.densityKgPerM3(), p.freeVolumeFraction(), fitted, p.seedConversion()));
        BakeResult r = Exhale.simulate(bake);
        System.out.println(String.format(Locale.ROOT, "simulated '%s' with the fitted kinetics: final unconverted %.2e, "
                + "1 %% reached at %.1f min, all limits met: %s", bake.name(), r.finalUnconverted(), r.timeTo1pctS() / 60,
                r.feasible() ? "yes" : "no"));
        if (!r.feasible()) {
            r.violated().forEach(m -> System.out.println("  violated: " + m.limit()));
        }
        org.exhale.planning.PlanResult plan = Exhale.plan(bake, cf.tool());
        System.out.println(String.format(Locale.ROOT, "planned with the fitted kinetics: %.1f min to the target "
                + "(lower bound %.1f min), verified: %s", plan.durationS() / 60, plan.lowerBound().boundS() / 60,
                plan.verified() ? "yes" : "no"));
        System.out.print(org.exhale.io.RecipeCsvWriter.csv(plan.recipe()));
        Cautions.BAKE.forEach(c -> System.out.println("Caution: " + c));
    }
}
