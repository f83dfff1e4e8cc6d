package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.exhale.fitting.TgaRun;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Reader checks: accepted spellings and layouts, and one test per bad-file error kind (common practice, no source). */
class TgaCsvReaderTest {
    private final TgaCsvReader reader = new TgaCsvReader();

    /** 30 rows: t = i minutes, T = 100 + 10 i °C, mass = 10 − 0.1 i mg. */
    private static String body(String header, String sep, boolean decimalComma) {
        StringBuilder sb = new StringBuilder(header).append('\n');
        for (int i = 0; i < 30; i++) {
            String row = String.format(Locale.ROOT, "%.1f%s%.2f%s%.3f", i * 1.0, sep, 100 + 10.0 * i + 0.25, sep, 10 - 0.1 * i);
            sb.append(decimalComma ? row.replace('.', ',') : row).append('\n');
        }
        return sb.toString();
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "time_min,temperature_C,mass_mg|,|false",
        "Time (min);Temp [°C];weight_mg|;|true",
        "Time (min)\tTemp [°C]\tMass/mg|'\t'|true",
        "\"t [min]\",\"Sample temperature (C)\",\"mass_mg\"|,|false",
        "time/min;temperature/°C;wt_mg|;|false",
    })
    void acceptsSpellingsSeparatorsAndDecimalCommas(String header, String sep, boolean decimalComma) {
        TgaCsvReader.Result r = reader.read("run.csv", body(header, sep, decimalComma));
        assertEquals(1, r.runs().size());
        TgaRun run = r.runs().get(0);
        assertEquals(30, run.size());
        assertEquals(120.0, run.timeS()[2], 1e-9);
        assertEquals(100.25 + 20 + 273.15, run.temperatureK()[2], 1e-9);
        assertEquals(9.8e-6, run.mass()[2], 1e-15);
        assertEquals(TgaRun.MassBasis.KILOGRAM, run.basis());
        assertTrue(r.notes().stream().anyMatch(n -> n.contains("taken as temperature")), r.notes().toString());
    }

    @Test
    void acceptsSecondsKelvinAndPercent() {
        String csv = body("time_s,temperature_K,Mass/%", ",", false);
        TgaRun run = reader.read("k.csv", csv).runs().get(0);
        assertEquals(2.0, run.timeS()[2], 1e-12);
        assertEquals(120.25, run.temperatureK()[2], 1e-12);
        assertEquals(0.098, run.mass()[2], 1e-12);
        assertEquals(TgaRun.MassBasis.FRACTION, run.basis());
    }

    @Test
    void prefersTheSampleTemperatureAndIgnoresUnknownColumns() {
        StringBuilder sb = new StringBuilder("# exported\nTime (min);Furnace temp (°C);Sample temp (°C);Mass (mg);DTG (%/min);Gas\n");
        for (int i = 0; i < 25; i++) {
            sb.append(i).append(";").append(500 + i).append(";").append(100 + i).append(";").append(10 - 0.01 * i)
                    .append(";0;N2\n");
        }
        TgaCsvReader.Result r = reader.read("s.csv", sb.toString());
        assertEquals(100 + 273.15, r.runs().get(0).temperatureK()[0], 1e-9);
        assertTrue(r.notes().stream().anyMatch(n -> n.contains("Gas") && n.contains("ignored")));
    }

    @Test
    void roundTripsSeveralRunsThroughOneFile(@TempDir Path dir) throws Exception {
        TgaRun a = ramp("a", 5, 0);
        TgaRun b = ramp("b", 10, 1e-6);
        for (TgaCsvWriter w : List.of(TgaCsvWriter.DEFAULT, new TgaCsvWriter(';', true, false, false),
                new TgaCsvWriter('\t', false, true, false))) {
            Path f = dir.resolve("runs.csv");
            Files.writeString(f, w.format(List.of(a, b)));
            List<TgaRun> back = reader.read(f).runs();
            assertEquals(2, back.size());
            assertEquals("runs:a", back.get(0).label());
            for (int k = 0; k < 2; k++) {
                TgaRun orig = k == 0 ? a : b;
                assertArrayEquals(orig.timeS(), back.get(k).timeS(), 1e-7);
                assertArrayEquals(orig.temperatureK(), back.get(k).temperatureK(), 1e-7);
                assertArrayEquals(orig.mass(), back.get(k).mass(), 1e-15);
            }
        }
    }

    private static TgaRun ramp(String label, double kPerMin, double offset) {
        int n = 40;
        double[] t = new double[n], temp = new double[n], m = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = 6.0 * i;
            temp[i] = 300 + kPerMin / 60 * t[i];
            m[i] = 1e-5 * (1 - 0.01 * i) + offset;
        }
        return new TgaRun(label, t, temp, m, TgaRun.MassBasis.KILOGRAM);
    }

    private ErrorKind kindOf(String content) {
        return assertThrows(InputException.class, () -> reader.read("bad.csv", content)).kind();
    }

    @Test
    void emptyFileIsRefused() {
        assertEquals(ErrorKind.EMPTY_FILE, kindOf(""));
        assertEquals(ErrorKind.EMPTY_FILE, kindOf("# only a comment\n\n"));
    }

    @Test
    void headerWithoutNumericRowsIsRefused() {
        assertEquals(ErrorKind.EMPTY_FILE, kindOf("time_min,temperature_C,mass_mg\n\n"));
    }

    @Test
    void missingColumnIsRefused() {
        InputException e = assertThrows(InputException.class,
                () -> reader.read("bad.csv", "time_min,mass_mg\n1,2\n"));
        assertEquals(ErrorKind.MISSING_KEY, e.kind());
        assertTrue(e.getMessage().contains("temperature"), e.getMessage());
    }

    @Test
    void missingOrUnknownUnitIsRefused() {
        assertEquals(ErrorKind.BAD_UNIT, kindOf("time,temperature_C,mass_mg\n1,2,3\n"));
        assertEquals(ErrorKind.BAD_UNIT, kindOf("time_min,temperature_F,mass_mg\n1,2,3\n"));
    }

    @Test
    void nonMonotoneTimeIsRefusedWithItsRow() {
        String csv = body("time_min,temperature_C,mass_mg", ",", false).replace("\n5.0,", "\n3.0,");
        InputException e = assertThrows(InputException.class, () -> reader.read("bad.csv", csv));
        assertEquals(ErrorKind.INCONSISTENT, e.kind());
        assertEquals(7, e.line());
        assertTrue(e.getMessage().contains("column 1"), e.getMessage());
    }

    @Test
    void nanIsRefusedWithRowAndColumn() {
        String csv = body("time_min,temperature_C,mass_mg", ",", false).replace("\n4.0,140.25,", "\n4.0,NaN,");
        InputException e = assertThrows(InputException.class, () -> reader.read("bad.csv", csv));
        assertEquals(ErrorKind.BAD_NUMBER, e.kind());
        assertEquals(6, e.line());
        assertTrue(e.getMessage().contains("column 2 'temperature_C'"), e.getMessage());
    }

    @Test
    void decimalCommaWithCommaSeparatorIsASyntaxOrNumberError() {
        // "1,5" with ',' separators splits into too many fields; a short row is a syntax error.
        assertEquals(ErrorKind.SYNTAX, kindOf("time_min,temperature_C,mass_mg\n1,2\n"));
    }

    @Test
    void tooFewRowsAreRefused() {
        StringBuilder sb = new StringBuilder("time_min,temperature_C,mass_mg\n");
        for (int i = 0; i < 5; i++) {
            sb.append(i).append(',').append(100 + i).append(",1\n");
        }
        assertEquals(ErrorKind.OUT_OF_RANGE, kindOf(sb.toString()));
    }

    @Test
    void oversizedFileIsRefusedBeforeReading(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("big.csv");
        Files.writeString(f, body("time_min,temperature_C,mass_mg", ",", false));
        InputException e = assertThrows(InputException.class, () -> new TgaCsvReader(100).read(f));
        assertEquals(ErrorKind.TOO_LARGE, e.kind());
    }

    @Test
    void missingFileIsUnreadable(@TempDir Path dir) {
        assertEquals(ErrorKind.FILE_UNREADABLE,
                assertThrows(InputException.class, () -> reader.read(dir.resolve("none.csv"))).kind());
    }
}
