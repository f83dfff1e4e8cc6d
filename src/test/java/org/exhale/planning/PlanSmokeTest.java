package org.exhale.planning;

import java.nio.file.Path;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.junit.jupiter.api.Test;

class PlanSmokeTest {
    @Test
    void plansDemos() {
        for (String f : new String[]{"data/demo/porous-line.yaml", "data/demo/dense-disc.yaml"}) {
            CaseFile cf = CaseYamlReader.read(Path.of(f));
            long t0 = System.nanoTime();
            PlanResult p = Planner.plan(cf.bake(), cf.tool());
            long t1 = System.nanoTime();
            System.out.printf("%s: feasible %s verified %s duration %.1f min bound %.1f min (ceiling-only %.1f) ratio %.4f evals %d %.0f ms%n",
                    f, p.feasible(), p.verified(), p.durationS() / 60, p.lowerBound().boundS() / 60,
                    p.lowerBound().ceilingOnlyBoundS() / 60, p.boundRatio(), p.evaluations(), (t1 - t0) / 1e6);
            p.notes().forEach(n -> System.out.println("  note: " + n));
            if (p.recipe() != null) {
                for (int i = 0; i < p.recipe().steps().size(); i++) {
                    System.out.println("  " + p.recipe().steps().get(i) + "  <- " + p.binding().get(i));
                }
                p.verification().margins().forEach(m -> System.out.println("   " + m.limit() + " " + m.margin()));
            } else {
                System.out.println("  " + p.infeasibility());
            }
        }
    }
}
