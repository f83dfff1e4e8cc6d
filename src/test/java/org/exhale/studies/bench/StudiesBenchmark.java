package org.exhale.studies.bench;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.studies.Compare;
import org.exhale.studies.MonteCarlo;
import org.exhale.studies.ParallelRuns;
import org.exhale.studies.RobustStudy;
import org.exhale.studies.Variation;

/**
 * Speed targets of the studies (a benchmark, not a test): 10 000 Monte Carlo simulations of the
 * porous demo with its recipe (target 30 s on 2 cores) and a 100-option comparison (target 60 s).
 * Run: mvn -q test-compile, then
 * java -cp target/classes:target/test-classes:$(cat cp.txt) org.exhale.studies.bench.StudiesBenchmark [repeats]
 */
public final class StudiesBenchmark {
    public static void main(String[] args) {
        int repeats = args.length > 0 ? Integer.parseInt(args[0]) : 3;
        int threads = args.length > 1 ? Integer.parseInt(args[1]) : 2;
        CaseFile cf = CaseYamlReader.read(Path.of("data/demo/porous-line-uncertain.yaml"));
        List<MonteCarlo.Parameter> ps = MonteCarlo.parameters(cf.bake(), cf.uncertainty());
        List<String> limits = RobustStudy.limitNames(cf.bake());
        double[] mc = new double[repeats];
        double[] cmp = new double[repeats];
        List<Variation> vary = List.of(Variation.parse("cap.porosity=0.2:0.45:0.05"), Variation.parse("cap.pore_radius=1nm:2.5nm:0.5nm"),
                Variation.parse("wafer.spread=1K:5K:1K"));
        List<List<Double>> combos = Compare.combinations(vary).subList(0, 100);
        for (int r = 0; r < repeats; r++) {
            long t0 = System.nanoTime();
            RobustStudy.evaluate(cf.bake(), ps, limits, 1, 10_000, threads, null, null);
            mc[r] = (System.nanoTime() - t0) / 1e9;
            t0 = System.nanoTime();
            new ParallelRuns<>(combos.size(), threads, i -> Compare.planOne(cf.bake(), cf.tool(), vary, i, combos.get(i))).run(null);
            cmp[r] = (System.nanoTime() - t0) / 1e9;
            System.out.printf("repeat %d: 10000 Monte Carlo simulations %.1f s, 100-option compare %.1f s%n", r + 1, mc[r], cmp[r]);
        }
        System.out.printf("median on %d threads: Monte Carlo %.1f s (target 30), compare %.1f s (target 60)%n", threads,
                median(mc), median(cmp));
    }

    static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        return s.length % 2 == 1 ? s[s.length / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
    }
}
