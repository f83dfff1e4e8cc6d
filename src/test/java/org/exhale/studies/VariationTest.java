package org.exhale.studies;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;
import org.junit.jupiter.api.Test;

/** Value lists and ranges of --vary (common practice, no source: the arithmetic is checked by hand). */
class VariationTest {
    @Test
    void inclusiveRangeOfPorosityHasSevenValues() {
        Variation v = Variation.parse("cap.porosity=0.2:0.5:0.05");
        assertEquals(StudyKey.CAP_POROSITY, v.key());
        assertEquals(7, v.values().size());
        assertEquals(0.2, v.values().get(0), 1e-15);
        assertEquals(0.35, v.values().get(3), 1e-12);
        assertEquals(0.5, v.values().get(6), 0); // the end is hit exactly, not 0.49999999
    }

    @Test
    void lengthsTakeTheirUnits() {
        assertEquals(List.of(80e-9, 120e-9, 160e-9, 200e-9), rounded(Variation.parse("cap.thickness=80nm:200nm:40nm").values()));
        assertEquals(List.of(1e-9, 2e-9, 3e-9), rounded(Variation.parse("cap.pore_radius=1nm, 2 nm,0.003um").values()));
        // A list may mix single values and ranges.
        assertEquals(4, Variation.parse("cap.pore_radius=1nm,2nm:4nm:1nm").values().size());
    }

    @Test
    void temperatureRangeStepsByADifference() {
        Variation v = Variation.parse("limits.ceiling=380C:400C:5K");
        assertEquals(5, v.values().size());
        assertEquals(380 + PhysicalConstants.ZERO_CELSIUS_K, v.values().get(0), 1e-9);
        assertEquals(400 + PhysicalConstants.ZERO_CELSIUS_K, v.values().get(4), 1e-9);
        assertEquals(400, v.key().display(v.values().get(4)), 1e-9);
    }

    @Test
    void purgeAndPercent() {
        Variation p = Variation.parse("chamber.purge=5slm:20slm:5slm");
        assertEquals(4, p.values().size());
        assertEquals(20, p.key().display(p.values().get(3)), 1e-9);
        assertEquals(List.of(0.2, 0.3), rounded(Variation.parse("cap.porosity=20%,30%").values()));
    }

    @Test
    void errorsHaveTheirKinds() {
        assertKind(ErrorKind.UNKNOWN_KEY, "cap.porosty=0.2");
        InputException e = assertThrows(InputException.class, () -> Variation.parse("cap.porosty=0.2"));
        assertTrue(e.getMessage().contains("did you mean 'cap.porosity'"), e.getMessage());
        assertKind(ErrorKind.BAD_UNIT, "cap.thickness=100");
        assertKind(ErrorKind.BAD_UNIT, "cap.thickness=100 kPa");
        assertKind(ErrorKind.BAD_NUMBER, "cap.porosity=abc");
        assertKind(ErrorKind.OUT_OF_RANGE, "cap.porosity=0.2:0.5:0");
        assertKind(ErrorKind.INCONSISTENT, "cap.porosity=0.5:0.2:0.05");
        assertKind(ErrorKind.INCONSISTENT, "cap.porosity=0.2,0.2");
        assertKind(ErrorKind.BAD_ARGUMENT, "cap.porosity");
        assertKind(ErrorKind.BAD_ARGUMENT, "cap.porosity=0.2:0.5");
        assertKind(ErrorKind.BAD_ARGUMENT, "cap.porosity=0.2,,0.3");
        assertKind(ErrorKind.OUT_OF_RANGE, "cap.porosity=0:1000:0.001");
    }

    @Test
    void combinationsVaryTheFirstKeySlowest() {
        List<List<Double>> c = Compare.combinations(List.of(Variation.parse("cap.porosity=0.2,0.3"),
                Variation.parse("wafer.spread=1K,2K,3K")));
        assertEquals(6, c.size());
        assertEquals(List.of(0.2, 1.0), c.get(0));
        assertEquals(List.of(0.2, 3.0), c.get(2));
        assertEquals(List.of(0.3, 1.0), c.get(3));
    }

    private static void assertKind(ErrorKind kind, String spec) {
        InputException e = assertThrows(InputException.class, () -> Variation.parse(spec), spec);
        assertEquals(kind, e.kind(), spec + ": " + e.getMessage());
    }

    private static List<Double> rounded(List<Double> v) {
        return v.stream().map(x -> Math.round(x * 1e15) / 1e15).toList();
    }
}
