package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.exhale.fitting.TgaRun;
import org.junit.jupiter.api.Test;

/**
 * The invented instrument-export shapes of {@code src/test/resources/export-shapes} (made by its
 * generate.py: first order, E 150 kJ/mol, A 1e12 1/s, a 10.00 mg sample from 30 °C) are read to
 * the same numbers. Common practice, no source.
 */
class ExportShapesTest {
    private static final Path DIR = Path.of("src/test/resources/export-shapes");
    private static final double C0 = 273.15;

    private static TgaCsvReader.Result read(String name) {
        return new TgaCsvReader().read(DIR.resolve(name));
    }

    private static void startsAt30C(TgaRun r, double massAtStart, double massTolerance) {
        assertEquals(0, r.timeS()[0], 1e-9, r.label());
        assertEquals(30 + C0, r.temperatureK()[0], 1e-6, r.label());
        assertEquals(massAtStart, r.mass()[0], massTolerance, r.label());
    }

    @Test
    void metadataBlockIsKeptAsRunMetadata() {
        TgaCsvReader.Result r = read("metadata-block.csv");
        assertEquals(1, r.runs().size());
        startsAt30C(r.runs().get(0), 10e-6, 1e-12);
        assertEquals(6.0, r.runs().get(0).timeS()[1], 1e-9); // 0,1000 min
        assertEquals("10 K/min", r.metadata().get("metadata-block").get("Heating rate"));
        assertEquals("nitrogen, 50 mL/min", r.metadata().get("metadata-block").get("Atmosphere"));
    }

    @Test
    void unitRowUnderTheHeader() {
        TgaRun r = read("unit-row.txt").runs().get(0);
        startsAt30C(r, 10e-6, 1e-12);
        assertEquals(12.0, r.timeS()[1], 1e-9);
    }

    @Test
    void sampleTemperatureIsPreferredAndTheOtherCanBeChosen() {
        TgaCsvReader.Result r = read("two-temperatures.csv");
        startsAt30C(r.runs().get(0), 1.0, 1e-9);
        assertEquals(TgaRun.MassBasis.FRACTION, r.runs().get(0).basis());
        TgaRun programme = new TgaCsvReader().withTemperatureColumn("2").read(DIR.resolve("two-temperatures.csv")).runs().get(0);
        assertEquals(31.9 + C0, programme.temperatureK()[0], 1e-6);
        InputException e = assertThrows(InputException.class,
                () -> new TgaCsvReader().withTemperatureColumn("Mass/%").read(DIR.resolve("two-temperatures.csv")));
        assertTrue(e.getMessage().contains("Sample temperature/°C"), "lists the candidates: " + e.getMessage());
    }

    @Test
    void ambiguousTemperatureColumnsAskForAChoice() {
        String csv = "Time/min;Temperature A/°C;Temperature B/°C;Mass/mg\n" + "0;30;30;10\n".repeat(1);
        InputException e = assertThrows(InputException.class, () -> new TgaCsvReader().read("amb.csv", csv));
        assertTrue(e.getMessage().contains("--temperature-column"), e.getMessage());
    }

    @Test
    void massChangeInPercentAndMassLossInMilligrams() {
        TgaRun pct = read("mass-change-percent.csv").runs().get(0);
        assertEquals(TgaRun.MassBasis.FRACTION, pct.basis());
        assertEquals(1.0, pct.mass()[0], 1e-9);
        assertTrue(pct.mass()[pct.size() - 1] < 0.01, "ends near 0 % left");
        TgaRun mg = read("mass-loss-mg.csv").runs().get(0);
        assertEquals(TgaRun.MassBasis.KILOGRAM, mg.basis());
        assertEquals(8.5e-6, mg.mass()[0], 1e-12); // sample mass from the metadata
        String noMass = "Time/min;Temperature/°C;Mass loss/mg\n0;30;0\n";
        assertEquals(ErrorKind.MISSING_KEY,
                assertThrows(InputException.class, () -> new TgaCsvReader().read("x.csv", noMass)).kind());
    }

    @Test
    void clockTimeQuotedDecimalCommasAndFooters() {
        TgaRun hms = read("hms-time.csv").runs().get(0);
        startsAt30C(hms, 10e-6, 1e-12);
        assertEquals(30.0, hms.timeS()[1], 1e-9);
        TgaRun quoted = read("quoted-decimal-comma.csv").runs().get(0);
        startsAt30C(quoted, 10e-6, 1e-12);
        assertEquals(31 + C0, quoted.temperatureK()[1], 1e-6);
        TgaCsvReader.Result footer = read("footer.csv");
        assertEquals(quoted.size(), footer.runs().get(0).size());
        assertTrue(footer.notes().stream().anyMatch(n -> n.contains("footer")), footer.notes().toString());
    }

    @Test
    void rampsAsBlocksOrBySegmentColumnBecomeRunsAndHoldsAreSkipped() {
        TgaCsvReader.Result blocks = read("multi-ramp-blocks.csv");
        assertEquals(4, blocks.runs().size(), blocks.notes().toString());
        assertEquals("multi-ramp-blocks:block 2", blocks.runs().get(0).label());
        assertTrue(blocks.notes().stream().anyMatch(n -> n.contains("block 1") && n.contains("skipped")));
        TgaCsvReader.Result seg = read("segment-column.csv");
        assertEquals(3, seg.runs().size(), seg.notes().toString());
        assertEquals(0, seg.runs().get(2).timeS()[0], 1e-9);
        List<TgaRun> one = new TgaCsvReader().withSegment("2").read(DIR.resolve("segment-column.csv")).runs();
        assertEquals(1, one.size());
        assertEquals("segment-column:segment 2", one.get(0).label());
        assertEquals(ErrorKind.BAD_ARGUMENT, assertThrows(InputException.class,
                () -> new TgaCsvReader().withSegment("9").read(DIR.resolve("segment-column.csv"))).kind());
    }

    @Test
    void repeatedTimeStampsAreMerged() {
        TgaCsvReader.Result r = read("repeated-stamps.csv");
        TgaRun run = r.runs().get(0);
        double[] t = run.timeS();
        for (int i = 1; i < t.length; i++) {
            assertTrue(t[i] > t[i - 1]);
        }
        assertTrue(r.notes().stream().anyMatch(n -> n.contains("repeated time stamp")), r.notes().toString());
    }

    @Test
    void theReaderStaysStrictAboutNumbers() throws Exception {
        String text = Files.readString(DIR.resolve("footer.csv")).replaceFirst("\n1.0000,", "\n1.0O00,");
        InputException e = assertThrows(InputException.class, () -> new TgaCsvReader().read("bad.csv", text));
        assertEquals(ErrorKind.BAD_NUMBER, e.kind());
        assertTrue(e.getMessage().contains("fix or delete the row"), e.getMessage());
    }
}
