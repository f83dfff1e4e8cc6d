package org.exhale.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.junit.jupiter.api.Test;

/**
 * Runs every program in notebooks-free-examples/ as its README says (single-file source launch,
 * {@code java -cp <classes> Example.java}, from the project folder) and checks its key lines.
 */
class ExamplesTest {
    static final Path FOLDER = Path.of("notebooks-free-examples");

    static String run(String file) throws Exception {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process p = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"), FOLDER.resolve(file).toString())
                .redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.waitFor(), out);
        assertTrue(out.contains("Caution: "), "every example shows the usual cautions:\n" + out);
        return out;
    }

    @Test
    void everyExampleIsInTheReadme() throws Exception {
        String readme = Files.readString(FOLDER.resolve("README.md"));
        try (var files = Files.list(FOLDER)) {
            for (Path f : files.filter(p -> p.toString().endsWith(".java")).toList()) {
                assertTrue(readme.contains("notebooks-free-examples" + File.separator + f.getFileName())
                        || readme.contains("notebooks-free-examples/" + f.getFileName()), "README lacks " + f);
            }
        }
    }

    @Test
    void porositySweepPrintsATableWhereVentingImprovesWithPorosity() throws Exception {
        String out = run("PorositySweep.java");
        Pattern row = Pattern.compile("(?m)^\\s+(0\\.\\d0)\\s+(\\S+)\\s+(\\S+)\\s+(\\S+)\\s+quasi-steady\\s+yes$");
        Matcher m = row.matcher(out);
        double lastDeff = 0;
        double lastPeak = Double.POSITIVE_INFINITY;
        int rows = 0;
        while (m.find()) {
            double dEff = Double.parseDouble(m.group(2));
            double peak = Double.parseDouble(m.group(3));
            // More open porosity: larger effective diffusivity (ε^1.5 with Bruggeman), lower trapped pressure.
            assertTrue(dEff > lastDeff && peak < lastPeak, out);
            lastDeff = dEff;
            lastPeak = peak;
            rows++;
        }
        assertEquals(5, rows, out);
        // At ε = 0.3 the ceiling figure is the one check prints for the demo case (CaseDiagnostics, Bruggeman).
        assertTrue(out.contains("0.30              3.919e-08"), out);
    }

    @Test
    void residueCrossingAgreesWithTheSimulatorsOwnEvent() throws Exception {
        String out = run("ResidueCrossing.java");
        Matcher m = Pattern.compile("corner (\\w+)\\s+history rows\\s+\\d+\\s+residue crossed 1 % at\\s+([\\d.]+) s.*simulator:\\s+([\\d.]+) s")
                .matcher(out);
        int corners = 0;
        while (m.find()) {
            double interpolated = Double.parseDouble(m.group(2));
            double event = Double.parseDouble(m.group(3));
            // Interpolating 30 s history rows is good to a few seconds (the simulator locates the event exactly).
            assertEquals(event, interpolated, 5.0, out);
            corners++;
        }
        assertEquals(2, corners, "hot and cold corner:\n" + out);
        assertTrue(out.contains("whole wafer (slowest corner): 75.3 min"), out);
    }

    @Test
    void fitThenSimulateRecoversTheDemoKineticsAndBakes() throws Exception {
        String out = run("FitThenSimulate.java");
        // The demo runs' truth (DemoTgaData, seeded): 0.4 / 150 kJ/mol / 1e12 and 0.6 / 175 kJ/mol / 1.7e13 1/s.
        List<String> expected = List.of("fitted 2 component(s)", "fraction 0.400  Ea  150.0 kJ/mol  A 1.00e+12 1/s",
                "fraction 0.600  Ea  175.0 kJ/mol  A 1.70e+13 1/s", "all limits met: yes", "verified: yes",
                "step,action,start_C,end_C,rate_C_per_min,duration_s,elapsed_s");
        for (String e : expected) {
            assertTrue(out.contains(e), "missing '" + e + "' in\n" + out);
        }
    }
}
