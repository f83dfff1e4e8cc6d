package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.exhale.io.CaseEcho;
import org.exhale.io.CaseFile;
import org.exhale.io.CaseTemplates;
import org.exhale.io.CaseYamlReader;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.studies.CaseDiagnostics;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import picocli.CommandLine;

/** {@code exhale new} writes every template; each passes {@code exhale check} and simulates. */
class NewAndCheckCommandTest {
    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = Main.commandLine();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    static Stream<Arguments> templates() {
        return Stream.of(CaseTemplates.Kind.values()).flatMap(k -> Stream.of(Arguments.of(k, false), Arguments.of(k, true)));
    }

    @ParameterizedTest(name = "{0} dense={1}")
    @MethodSource("templates")
    void newWritesACaseThatChecksAndSimulates(CaseTemplates.Kind kind, boolean dense, @TempDir Path dir) throws Exception {
        Path file = dir.resolve("case.yaml");
        List<String> args = new java.util.ArrayList<>(List.of("new", kind.name(), "-o", file.toString()));
        if (dense) {
            args.add("--dense");
        }
        Run made = run(args.toArray(String[]::new));
        assertEquals(0, made.code(), made.err());
        assertEquals(CaseTemplates.text(kind, dense), Files.readString(file));

        Run checked = run("check", file.toString());
        assertEquals(0, checked.code(), checked.err());
        assertTrue(checked.out().contains(": valid"), checked.out());
        assertTrue(checked.out().contains("Defaults filled in: none"), "a template writes every key: " + checked.out());
        assertTrue(checked.out().contains("Caution: "), "check shows the usual cautions");

        CaseFile cf = CaseYamlReader.read(file);
        // a template raises no warnings (rectangles are corrected to the 2D plate solution: docs/model.md, Rectangle)
        assertEquals(List.of(), cf.warnings(), "a template should raise no warnings");
        assertEquals(kind.name(), cf.bake().cavity().shape().name().toLowerCase(java.util.Locale.ROOT));
        assertEquals(dense, cf.bake().cap().porosity() == 0);
        BakeResult r = BakeSimulator.simulate(cf.bake());
        // A template is a working example: its own recipe must meet every limit it sets.
        assertTrue(r.feasible(), kind + " dense=" + dense + " violates " + r.violated());
        // The regime 'check' expects is the one the simulator chose (porous: quasi-steady; dense: full gas).
        assertEquals(r.regime(), CaseDiagnostics.diagnose(cf.bake()).expectedRegime());
    }

    @ParameterizedTest(name = "{0} dense={1}")
    @MethodSource("templates")
    void everyKeyIsWrittenWithItsMeaning(CaseTemplates.Kind kind, boolean dense) {
        String text = CaseTemplates.text(kind, dense);
        Set<String> written = new HashSet<>();
        for (CaseEcho.Entry e : CaseEcho.entries(text.getBytes(java.nio.charset.StandardCharsets.UTF_8))) {
            written.add(CaseEcho.pattern(e.path()));
        }
        Set<String> missing = new HashSet<>(CaseEcho.knownPaths());
        missing.removeAll(written);
        Set<String> allowed = new HashSet<>();
        if (kind != CaseTemplates.Kind.rectangle) {
            allowed.add("cavity.length");
        }
        if (dense) {
            allowed.add("cap.pore_radius");
        }
        missing.removeAll(allowed);
        assertEquals(Set.of(), missing, "keys absent from the template");
        for (String absent : allowed) {
            String leaf = absent.substring(absent.lastIndexOf('.') + 1);
            assertTrue(text.contains("# " + leaf + ":"), "a key left out is still explained in a comment: " + leaf);
        }
        // Each key name carries a one-line comment where it first appears.
        Pattern keyLine = Pattern.compile("^\\s*(?:- )?([A-Za-z_0-9]+):(.*)$");
        Set<String> explained = new HashSet<>();
        Set<String> seen = new HashSet<>();
        for (String line : text.split("\n")) {
            Matcher m = keyLine.matcher(line);
            if (m.matches()) {
                seen.add(m.group(1));
                if (m.group(2).contains("#")) {
                    explained.add(m.group(1));
                }
            }
        }
        seen.removeAll(explained);
        assertEquals(Set.of(), seen, "keys without a comment");
    }

    @Test
    void refusesToOverwriteWithoutForce(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("mine.yaml");
        Files.writeString(file, "my own case\n");
        Run refused = run("new", "line", "-o", file.toString());
        assertEquals(Main.BAD_INPUT, refused.code());
        assertTrue(refused.err().contains("--force"), refused.err());
        assertEquals("my own case\n", Files.readString(file));
        Run forced = run("new", "line", "-o", file.toString(), "--force");
        assertEquals(0, forced.code(), forced.err());
        assertEquals(CaseTemplates.text(CaseTemplates.Kind.line, false), Files.readString(file));
    }

    @Test
    void printsToStdoutWithDash() {
        Run r = run("new", "disc", "--dense", "-o", "-");
        assertEquals(0, r.code(), r.err());
        assertEquals(CaseTemplates.text(CaseTemplates.Kind.disc, true), r.out());
    }

    @Test
    void unknownKindIsBadInput() {
        Run r = run("new", "hexagon");
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.err().contains("line") && r.err().contains("rectangle"), r.err());
    }

    @Test
    void checkOfAnInvalidCaseExitsTwoAndNamesTheKey(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("bad.yaml");
        Files.writeString(file, CaseTemplates.text(CaseTemplates.Kind.line, false).replace("density: 1.15 g/cm3", "density: 1.15 kg"));
        Run r = run("check", file.toString());
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.err().contains("polymer.density"), r.err());
        assertFalse(r.out().contains("valid"), r.out());
    }

    @Test
    void checkEchoesGivenUnitsSiValuesAndDefaults(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("short.yaml");
        // The template without its optional ambient and wafer sections: check must list the defaults.
        String text = CaseTemplates.text(CaseTemplates.Kind.line, false)
                .replaceAll("(?s)ambient:.*?\n\n", "").replaceAll("(?s)wafer:.*?\n\n", "");
        Files.writeString(file, text);
        Run r = run("check", file.toString());
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().matches("(?s).*cap\\.thickness\\s+60 nm\\s+= 6e-8 m.*"), r.out());
        assertTrue(r.out().matches("(?s).*limits\\.ceiling\\s+400 C\\s+= 673\\.15 K.*"), r.out());
        assertTrue(r.out().contains("ambient = nitrogen at 101.325 kPa"), r.out());
        assertTrue(r.out().contains("wafer.lag = 0 s"), r.out());
    }
}
