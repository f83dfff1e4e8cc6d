package org.exhale.studies;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.exhale.cli.Main;
import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RobustCommandTest {
    static final Path UNCERTAIN = Path.of("data/demo/porous-line-uncertain.yaml");

    @Test
    void writesSamplesAndJsonIdenticallyForAnyThreadCount(@TempDir Path tmp) throws Exception {
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        assertEquals(Main.OK, Main.execute("robust", UNCERTAIN.toString(), "--samples", "10", "--seed", "42",
                "--threads", "1", "-o", a.toString(), "-q"));
        assertEquals(Main.OK, Main.execute("robust", UNCERTAIN.toString(), "--samples", "10", "--seed", "42",
                "--threads", "2", "-o", b.toString(), "-q"));
        String sa = Files.readString(a.resolve("samples.csv"));
        assertEquals(sa, Files.readString(b.resolve("samples.csv")));
        assertEquals(11, sa.lines().count());
        String json = Files.readString(a.resolve("robust.json"));
        assertTrue(json.matches("(?s).*\"seed\"\\s*:\\s*42.*"), json);
        assertTrue(json.matches("(?s).*\"complete\"\\s*:\\s*true.*"));
        assertTrue(json.contains("Predictions are estimates"));
        // The recipe written can be evaluated again with --recipe.
        assertEquals(Main.OK, Main.execute("robust", UNCERTAIN.toString(), "--samples", "10", "--seed", "42",
                "--recipe", a.resolve("recipe.yaml").toString(), "-o", tmp.resolve("c").toString(), "-q"));
        assertEquals(sa, Files.readString(tmp.resolve("c/samples.csv")));
    }

    @Test
    void badArgumentsAreExitTwo(@TempDir Path tmp) {
        assertEquals(Main.BAD_INPUT, org.exhale.cli.Quiet.execute("robust", "data/demo/porous-line.yaml", "--samples", "10",
                "-o", tmp.resolve("x").toString(), "-q"));
        assertEquals(Main.BAD_INPUT, org.exhale.cli.Quiet.execute("robust", UNCERTAIN.toString(), "--samples", "1",
                "-o", tmp.resolve("y").toString(), "-q"));
        assertEquals(Main.BAD_INPUT, org.exhale.cli.Quiet.execute("robust", UNCERTAIN.toString(), "--samples", "10", "--quantile", "1.5",
                "-o", tmp.resolve("z").toString(), "-q"));
        assertFalse(Files.exists(tmp.resolve("x")));
    }

    @Test
    void uncertaintySectionIsCheckedLikeEveryOther() throws Exception {
        String base = Files.readString(Path.of("data/demo/porous-line.yaml"));
        CaseFile ok = parse(base + "uncertainty: {Ea_sd: 2 kJ/mol, lnA_sd: 0.3, components: {backbone: {Ea_sd: 3 kJ/mol}},"
                + " spread_sd: 1 K, purge_sd: 5 %, pore_radius_sd: 0.1 nm}\n");
        Uncertainty u = ok.uncertainty();
        assertEquals(2000, u.kinetics().eaSdJPerMol(), 1e-9);
        assertEquals(3000, u.kineticsOf("backbone").eaSdJPerMol(), 1e-9);
        assertEquals(0, u.kineticsOf("backbone").lnASd(), 0);
        assertEquals(0.05, u.purgeSdRelative(), 1e-15);
        assertEquals(1e-10, u.poreRadiusSdM(), 1e-22);
        assertNull(parse(base).uncertainty());
        assertKind(ErrorKind.UNKNOWN_KEY, base + "uncertainty: {spread_sdd: 1 K}\n");
        assertKind(ErrorKind.UNKNOWN_NAME, base + "uncertainty: {components: {backbon: {Ea_sd: 1 kJ/mol}}}\n");
        assertKind(ErrorKind.OUT_OF_RANGE, base + "uncertainty: {spread_sd: -1 K}\n");
        assertKind(ErrorKind.BAD_UNIT, base + "uncertainty: {thickness_sd: 5 kPa}\n");
        assertKind(ErrorKind.OUT_OF_RANGE, base + "uncertainty: {Ea_lnA_correlation: 1.5}\n");
        String noChamber = base.replaceAll("(?s)\\nchamber:.*", "\n");
        assertKind(ErrorKind.INCONSISTENT, noChamber + "uncertainty: {purge_sd: 5 %}\n");
    }

    /**
     * The robust planner's contract: with a wide spread the nominal plan breaks the ceiling in
     * about 2 % of the samples; at the 99.5 % quantile the final recipe breaks no limit in more
     * than 0.5 % of the same samples (a consistency check, no source).
     */
    @Test
    void robustPlanHoldsEveryLimitAtTheQuantile() {
        String text;
        try {
            text = Files.readString(UNCERTAIN).replace("spread_sd: 1 K", "spread_sd: 4 K");
        } catch (java.io.IOException e) {
            throw new AssertionError(e);
        }
        CaseFile cf = parse(text);
        List<MonteCarlo.Parameter> ps = MonteCarlo.parameters(cf.bake(), cf.uncertainty());
        List<String> limits = RobustStudy.limitNames(cf.bake());
        RobustStudy.RobustPlan rp = RobustStudy.plan(cf.bake(), cf.tool(), ps, limits, 0.995,
                (withRecipe, round) -> RobustStudy.evaluate(withRecipe, ps, limits, 11, 300, 2, null, null), null);
        assertTrue(rp.nominal().summary().risk("ceiling").probability() > 0.005, "nominal plan should break the ceiling sometimes");
        assertTrue(rp.met(), rp.note());
        assertTrue(rp.rounds().size() >= 2);
        for (RobustStudy.LimitRisk r : rp.last().summary().risks()) {
            assertTrue(r.probability() <= 0.005, r.toString());
        }
        assertTrue(rp.last().planningCase().limits().ceilingK() < cf.bake().limits().ceilingK());
    }

    @Test
    void stoppedRunsKeepWhatIsDone() {
        ParallelRuns<Integer>[] holder = new ParallelRuns[1];
        holder[0] = new ParallelRuns<>(100, 2, i -> {
            if (i == 10) {
                holder[0].cancel();
            }
            return i * i;
        });
        List<Integer> r = holder[0].run(null);
        assertFalse(holder[0].complete());
        assertTrue(holder[0].done() >= 11 && holder[0].done() < 100, "done " + holder[0].done());
        assertEquals(100, r.get(10));
        assertNull(r.get(99));
        // A failing task stops the rest and its exception reaches the caller.
        ParallelRuns<Integer> bad = new ParallelRuns<>(50, 2, i -> {
            if (i == 3) {
                throw new IllegalStateException("boom");
            }
            return i;
        });
        assertThrows(IllegalStateException.class, () -> bad.run(null));
    }

    private static CaseFile parse(String text) {
        return CaseYamlReader.parse("case.yaml", text.getBytes(StandardCharsets.UTF_8));
    }

    private static void assertKind(ErrorKind kind, String text) {
        InputException e = assertThrows(InputException.class, () -> parse(text));
        assertEquals(kind, e.kind(), e.getMessage());
    }
}
