package org.exhale.studies;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

import org.exhale.cli.Main;
import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.planning.PlanResult;
import org.exhale.planning.Planner;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.Wafer;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CompareTest {
    static final Path POROUS = Path.of("data/demo/porous-line.yaml");

    /**
     * The ranked table of a three-option comparison run on two threads agrees with three single
     * plans of the same cases built by hand (common practice, no source: a consistency check).
     */
    @Test
    void rankedTableAgreesWithSinglePlans() {
        CaseFile cf = CaseYamlReader.read(POROUS);
        List<Variation> vary = List.of(Variation.parse("wafer.spread=6K,1K,3K"));
        List<List<Double>> combos = Compare.combinations(vary);
        List<Compare.Option> options = new ParallelRuns<>(combos.size(), 2,
                i -> Compare.planOne(cf.bake(), cf.tool(), vary, i, combos.get(i))).run(null);
        List<Compare.Option> ranked = Compare.rank(options);

        double[] spreads = {6, 1, 3};
        List<double[]> single = new ArrayList<>();
        for (int i = 0; i < spreads.length; i++) {
            BakeCase b = cf.bake().withWafer(new Wafer(cf.bake().wafer().lagS(), spreads[i]));
            PlanResult p = Planner.plan(b, cf.tool());
            assertTrue(p.feasible());
            single.add(new double[]{i, p.durationS(), p.verification().tightest().margin()});
            assertEquals(p.durationS(), options.get(i).durationS(), 0, "option " + i);
            assertEquals(p.lowerBound().boundS(), options.get(i).lowerBoundS(), 0);
            assertEquals(p.verification().tightest().margin(), options.get(i).smallestMargin(), 0);
            assertEquals(p.verification().tightest().limit(), options.get(i).smallestLimit());
            assertEquals(p.verification().peakExcessPressurePa(), options.get(i).peakPressurePa(), 0);
        }
        single.sort(Comparator.comparingDouble((double[] s) -> s[1]).thenComparingDouble(s -> -s[2]));
        for (int r = 0; r < single.size(); r++) {
            assertEquals((int) single.get(r)[0], ranked.get(r).index(), "rank " + (r + 1));
        }
        // A wider spread can only make the plan slower or equal: the hot corner meets the ceiling sooner.
        assertTrue(options.get(1).durationS() <= options.get(0).durationS());
    }

    @Test
    void paretoFrontOfDurationAgainstMargin() {
        List<Compare.Option> o = List.of(
                opt(0, true, 100, 1.2), opt(1, true, 90, 1.1), opt(2, true, 110, 1.15), opt(3, true, 120, 2.0),
                opt(4, false, Double.NaN, Double.NaN), opt(5, true, 90, 1.1));
        // 2 is dominated by 0 (shorter and safer); 1 and 5 tie and do not dominate each other.
        assertArrayEquals(new boolean[]{true, true, false, true, false, true}, Compare.pareto(o));
        List<Compare.Option> ranked = Compare.rank(o);
        assertEquals(List.of(1, 5, 0, 2, 3, 4), ranked.stream().map(Compare.Option::index).toList());
    }

    @Test
    void commandWritesRankedTableAndJson(@TempDir Path tmp) throws Exception {
        Path out = tmp.resolve("cmp");
        int rc = Main.execute("compare", POROUS.toString(), "--vary", "wafer.spread=1K,6K", "--threads", "2",
                "-o", out.toString(), "-q");
        assertEquals(Main.OK, rc);
        List<String> csv = Files.readAllLines(out.resolve("options.csv"));
        assertEquals(3, csv.size());
        assertTrue(csv.get(0).startsWith("rank,option,wafer.spread_K,feasible,pareto,duration_s"));
        assertTrue(csv.get(1).startsWith("1,1,1,true,true,"), csv.get(1));
        String json = Files.readString(out.resolve("compare.json"));
        assertTrue(json.matches("(?s).*\"complete\"\\s*:\\s*true.*"), json);
        assertTrue(json.contains("Predictions are estimates"));
        assertTrue(Files.exists(out.resolve("recipes/option-1.yaml")));
        // The folder is now in use: without --force it is refused (exit 2).
        assertEquals(Main.BAD_INPUT, org.exhale.cli.Quiet.execute("compare", POROUS.toString(), "--vary", "wafer.spread=1K",
                "-o", out.toString(), "-q"));
        assertEquals(Main.BAD_INPUT, org.exhale.cli.Quiet.execute("compare", POROUS.toString(), "--vary", "cap.porosty=0.2",
                "-o", tmp.resolve("x").toString(), "-q"));
        assertFalse(Files.exists(tmp.resolve("x")));
    }

    private static Compare.Option opt(int i, boolean feasible, double d, double m) {
        return new Compare.Option(i, List.of((double) i), feasible, d, d, d, 1, true, 0, m, "strength", 1, 2,
                feasible ? "" : "ceiling", feasible ? "" : "too hot", null);
    }
}
