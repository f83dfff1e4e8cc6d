package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.exhale.fitting.DemoTgaData;
import org.exhale.fitting.SyntheticTga;
import org.exhale.fitting.TgaRun;
import org.exhale.io.TgaCsvWriter;
import org.exhale.kinetics.ReactionModel;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** What `exhale fit` tells the user: data errors on one line, figures without "-0" or "± 0.0". */
class FitMessagesTest {
    private static int run(StringWriter out, StringWriter err, String... args) {
        return FitCommandTest.runFit(out, err, args);
    }

    /** An isothermal run: a ramp from 30 °C to 400 °C in 5 min, then 400 °C held for an hour while the mass falls. */
    private static String isothermal() {
        int n = 220;
        double[] t = new double[n], temp = new double[n], m = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 18.0;
            double hold = Math.max(0, t[i] - 300);
            temp[i] = Math.min(673.15, 303.15 + 370 * t[i] / 300);
            m[i] = 10e-6 * (0.2 + 0.8 * Math.exp(-hold / 600));
        }
        return TgaCsvWriter.DEFAULT.format(List.of(new TgaRun("iso", t, temp, m, TgaRun.MassBasis.KILOGRAM)));
    }

    private static List<String> demo(Path dir) throws Exception {
        List<String> args = new ArrayList<>();
        for (String[] f : DemoTgaData.files()) {
            Path p = dir.resolve(f[0]);
            Files.writeString(p, f[1]);
            args.add(p.toString());
        }
        return args;
    }

    @Test
    void aRunAtConstantTemperatureIsOneLineNamingItsFile(@TempDir Path dir) throws Exception {
        List<String> args = demo(dir);
        Path iso = dir.resolve("iso.csv");
        Files.writeString(iso, isothermal());
        args.add(iso.toString());
        args.addAll(List.of("-o", dir.resolve("out").toString(), "--max-points", "100"));
        StringWriter out = new StringWriter(), err = new StringWriter();
        assertEquals(2, run(out, err, args.toArray(new String[0])));
        String e = err.toString().strip();
        assertEquals(1, e.lines().count(), e);
        assertTrue(e.startsWith(iso.toString()), e);
        assertTrue(e.contains("does not rise") && e.contains("heating run is expected") && e.contains("400.0 °C"), e);
        assertTrue(!e.contains("K/min") && !e.contains("e-"), e);
        assertTrue(!Files.exists(dir.resolve("out/fit.json")));
    }

    @Test
    void twoRunsGiveNoIntervalRatherThanPlusMinusZero(@TempDir Path dir) throws Exception {
        List<String> args = new ArrayList<>(demo(dir).subList(0, 2));
        args.addAll(List.of("-o", dir.resolve("out").toString(), "--max-points", "100", "--components", "1"));
        StringWriter out = new StringWriter(), err = new StringWriter();
        run(out, err, args.toArray(new String[0]));
        String o = out.toString();
        assertTrue(o.contains("vyazovkin"), o + err);
        assertTrue(!o.contains("± 0.0 ") && !o.contains("NaN"), o);
        // every E(alpha) row: five methods, and with two runs none has an interval
        long rows = o.lines().filter(l -> l.matches("\\s+0\\.[13579]0 .*")).count();
        assertEquals(5, rows, o);
        o.lines().filter(l -> l.matches("\\s+0\\.[13579]0 .*")).forEach(l -> assertTrue(!l.matches(".*± \\d.*"), l));
    }

    @Test
    void aTaredBalanceDoesNotPrintMinusZero(@TempDir Path dir) throws Exception {
        // A first-order step that goes to completion, the balance tared 0.1 µg low: the final
        // plateau is -1e-5 of the initial mass, which must read 0.0000, not -0.0000.
        List<SyntheticTga.Part> parts = List.of(new SyntheticTga.Part(1, 1e12, 150e3, new ReactionModel.NthOrder(1)));
        List<String> args = new ArrayList<>();
        for (double b : new double[] {2, 5, 10}) {
            TgaRun frac = SyntheticTga.run("r", parts, b, 423.15, 703.15, 0.1, 1e-4, 0, null);
            double[] m = frac.mass();
            for (int i = 0; i < m.length; i++) {
                m[i] = (10.0 * m[i] - 1e-4) * 1e-6;
            }
            Path p = dir.resolve("tared_" + (int) b + ".csv");
            Files.writeString(p, TgaCsvWriter.DEFAULT.format(List.of(
                    new TgaRun("r", frac.timeS(), frac.temperatureK(), m, TgaRun.MassBasis.KILOGRAM))));
            args.add(p.toString());
        }
        args.addAll(List.of("-o", dir.resolve("out").toString(), "--max-points", "100", "--components", "1"));
        StringWriter out = new StringWriter(), err = new StringWriter();
        run(out, err, args.toArray(new String[0]));
        String o = out.toString();
        assertTrue(o.contains("final/initial mass 0.0000"), o + err);
        assertTrue(!o.contains("-0.0") && !o.matches("(?s).*peak [0-9.]+ K.*"), o);
    }

    @Test
    void twoFilesAtOneHeatingRateAreNamedInOneWarning(@TempDir Path dir) throws Exception {
        List<String> args = demo(dir);
        // a repeat of the 5 K/min run with different noise: same rate, different data
        String five = Files.readString(Path.of(args.get(1)));
        StringBuilder repeat = new StringBuilder();
        int row = 0;
        for (String line : five.split("\n", -1)) {
            String[] c = line.split(",");
            if (c.length == 3 && c[2].matches("[-0-9.eE+]+") && row++ % 2 == 0) {
                line = c[0] + "," + c[1] + "," + (Double.parseDouble(c[2]) * 1.0005);
            }
            repeat.append(line).append('\n');
        }
        Path again = dir.resolve("repeat_5Kmin.csv");
        Files.writeString(again, repeat.toString());
        args.add(again.toString());
        args.addAll(List.of("-o", dir.resolve("out").toString(), "--max-points", "100", "--components", "1"));
        StringWriter out = new StringWriter(), err = new StringWriter();
        assertEquals(0, run(out, err, args.toArray(new String[0])), err.toString());
        List<String> w = err.toString().lines().filter(l -> l.startsWith("warning: ") && l.contains(again.toString())).toList();
        assertEquals(1, w.size(), err.toString());
        assertTrue(w.get(0).startsWith("warning: ") && w.get(0).contains(args.get(1)) && w.get(0).contains("at 5.00 K/min"), w.get(0));
        // no such warning on the four demo runs at four rates
        StringWriter out2 = new StringWriter(), err2 = new StringWriter();
        List<String> four = new ArrayList<>(demo(Files.createDirectories(dir.resolve("four"))));
        four.addAll(List.of("-o", dir.resolve("out2").toString(), "--max-points", "100", "--components", "1"));
        assertEquals(0, run(out2, err2, four.toArray(new String[0])), err2.toString());
        assertTrue(!err2.toString().contains("both heated"), err2.toString());
    }
}
