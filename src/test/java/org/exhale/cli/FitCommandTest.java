package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.exhale.fitting.DemoTgaData;
import org.exhale.io.InputException;
import org.exhale.io.Quantities;
import org.exhale.io.UnitKind;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.yaml.snakeyaml.Yaml;
import picocli.CommandLine;

/** End-to-end run of the command on the seeded demo runs (invented two-component polymer, see DemoTgaData). */
class FitCommandTest {
    private static int run(StringWriter out, StringWriter err, String... args) {
        return runFit(out, err, args);
    }

    /** Runs `exhale fit` in-process with its output captured; input errors exit 2 as in Main. */
    static int runFit(StringWriter out, StringWriter err, String... args) {
        CommandLine cmd = new CommandLine(new FitCommand());
        cmd.setOut(new PrintWriter(out, true));
        cmd.setErr(new PrintWriter(err, true));
        cmd.setExecutionExceptionHandler((ex, c, p) -> {
            c.getErr().println(ex.getMessage());
            return ex instanceof InputException ? 2 : 1;
        });
        return cmd.execute(args);
    }

    @Test
    @SuppressWarnings("unchecked")
    void fitsTheDemoRunsAndWritesAllOutputs(@TempDir Path dir) throws Exception {
        String[] args = new String[DemoTgaData.RATES_K_PER_MIN.length + 2];
        int i = 0;
        for (String[] f : DemoTgaData.files()) {
            Path p = dir.resolve(f[0]);
            Files.writeString(p, f[1]);
            args[i++] = p.toString();
        }
        args[i++] = "-o";
        args[i] = dir.resolve("out").toString();
        StringWriter out = new StringWriter(), err = new StringWriter();
        assertEquals(0, run(out, err, args), err.toString());
        for (String name : List.of("kinetics.yaml", "isoconversional.csv", "fit.csv", "fit.json")) {
            assertTrue(Files.size(dir.resolve("out").resolve(name)) > 0, name);
        }
        Map<String, Object> yaml = new Yaml().load(Files.readString(dir.resolve("out/kinetics.yaml")));
        List<Map<String, Object>> comps = (List<Map<String, Object>>) ((Map<String, Object>) yaml.get("polymer")).get("components");
        // The generator's truth (DemoTgaData): 0.4 / 150 kJ/mol and 0.6 / 175 kJ/mol; BIC must pick two.
        assertEquals(2, comps.size(), out.toString());
        double e1 = Quantities.parse((String) comps.get(0).get("Ea"), UnitKind.MOLAR_ENERGY, false);
        double e2 = Quantities.parse((String) comps.get(1).get("Ea"), UnitKind.MOLAR_ENERGY, false);
        assertEquals(150e3, e1, 1.5e3);
        assertEquals(175e3, e2, 1.75e3);
        double w = ((Number) comps.get(0).get("fraction")).doubleValue() + ((Number) comps.get(1).get("fraction")).doubleValue();
        assertEquals(1.0, w, 1e-9);
        Quantities.parse((String) comps.get(0).get("A"), UnitKind.FREQUENCY, false);
        assertTrue(Files.readString(dir.resolve("out/isoconversional.csv")).startsWith("alpha,E_friedman_kJ_mol,E_friedman_ci_kJ_mol"));
        assertTrue(err.toString().contains("taken as temperature"), err.toString());
    }

    @Test
    void badArgumentsAreInputErrors(@TempDir Path dir) throws Exception {
        Path f = dir.resolve(DemoTgaData.files().get(0)[0]);
        Files.writeString(f, DemoTgaData.files().get(0)[1]);
        StringWriter out = new StringWriter(), err = new StringWriter();
        assertEquals(2, run(out, err, f.toString(), "--range", "0.9:0.1", "-o", dir.toString()));
        assertEquals(2, run(out, err, f.toString(), "--components", "4", "-o", dir.toString()));
        assertEquals(2, run(out, err, f.toString(), "--molar-mass", "100 nm", "-o", dir.toString()));
        assertEquals(2, run(out, err, dir.resolve("missing.csv").toString(), "-o", dir.toString()));
    }

    @Test
    void anExistingResultIsKeptWithoutForce(@TempDir Path dir) throws Exception {
        String[] args = new String[DemoTgaData.RATES_K_PER_MIN.length + 2];
        int i = 0;
        for (String[] f : DemoTgaData.files()) {
            Path p = dir.resolve(f[0]);
            Files.writeString(p, f[1]);
            args[i++] = p.toString();
        }
        args[i++] = "-o";
        args[i] = dir.resolve("out").toString();
        Files.createDirectories(dir.resolve("out"));
        Files.writeString(dir.resolve("out/kinetics.yaml"), "earlier result\n");
        StringWriter out = new StringWriter(), err = new StringWriter();
        assertEquals(2, run(out, err, args), err.toString());
        assertEquals("earlier result\n", Files.readString(dir.resolve("out/kinetics.yaml")), "overwritten without --force");
        String[] forced = java.util.Arrays.copyOf(args, args.length + 1);
        forced[args.length] = "--force";
        assertEquals(0, run(out, err, forced), err.toString());
        assertTrue(Files.readString(dir.resolve("out/kinetics.yaml")).contains("components"));
    }

    private static String[] demoArgs(Path dir, String... extra) throws Exception {
        List<String> args = new java.util.ArrayList<>();
        for (String[] f : DemoTgaData.files()) {
            Path p = dir.resolve(f[0]);
            Files.writeString(p, f[1]);
            args.add(p.toString());
        }
        args.add("-o");
        args.add(dir.resolve("out").toString());
        args.add("--max-points");
        args.add("200"); // enough for these checks, a third of the default's cost
        args.addAll(List.of(extra));
        return args.toArray(new String[0]);
    }

    @Test
    void quietPrintsNothingAndHelpHasNoFormatWarnings(@TempDir Path dir) throws Exception {
        StringWriter out = new StringWriter(), err = new StringWriter();
        assertEquals(0, run(out, err, demoArgs(dir, "-q", "--components", "2")), err.toString());
        assertEquals("", out.toString());
        assertEquals("", err.toString());
        java.io.ByteArrayOutputStream sysErr = new java.io.ByteArrayOutputStream();
        java.io.PrintStream old = System.err;
        StringWriter help = new StringWriter();
        try {
            System.setErr(new java.io.PrintStream(sysErr, true));
            CommandLine cmd = new CommandLine(new FitCommand());
            cmd.setOut(new PrintWriter(help, true));
            cmd.setErr(new PrintWriter(help, true));
            cmd.execute("--help");
        } finally {
            System.setErr(old);
        }
        assertTrue(help.toString().contains("--keep-early-step"), help.toString());
        assertTrue(help.toString().contains("3 %"), "escaped percent shown as %: " + help);
        assertEquals("", sysErr.toString(), "picocli warnings");
    }

    @Test
    @SuppressWarnings("unchecked")
    void aForcedCountNeverWritesAComponentUnderOnePercent(@TempDir Path dir) throws Exception {
        // Truth (DemoTgaData): two components. Forcing three must not write an empty third one.
        StringWriter out = new StringWriter(), err = new StringWriter();
        int code = run(out, err, demoArgs(dir, "--components", "3"));
        assertEquals(0, code, err.toString());
        Map<String, Object> yaml = new Yaml().load(Files.readString(dir.resolve("out/kinetics.yaml")));
        List<Map<String, Object>> comps = (List<Map<String, Object>>) ((Map<String, Object>) yaml.get("polymer")).get("components");
        for (Map<String, Object> c : comps) {
            assertTrue(((Number) c.get("fraction")).doubleValue() >= 0.01, c.toString());
        }
        assertTrue(Files.size(dir.resolve("out/isoconversional.csv")) > 0);
        assertTrue(!err.toString().contains("maximal count") && !err.toString().contains("Exception"), err.toString());
    }
}
