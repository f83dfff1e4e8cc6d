package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;

/**
 * Legal but implausible values are read, with a warning. Each test changes one value of the valid
 * base case and checks that exactly one new warning appears and that it names what it is about.
 */
class CaseWarningsTest {
    private static String base() throws IOException {
        return Files.readString(BadCaseCorpusTest.resource("good-cases/base.yaml"));
    }

    private static CaseFile read(String text) {
        return CaseYamlReader.parse("warn.yaml", text.getBytes(StandardCharsets.UTF_8));
    }

    private static String newWarning(String from, String to) throws IOException {
        List<String> after = newWarnings(from, to);
        assertEquals(1, after.size(), "new warnings: " + after);
        return after.get(0);
    }

    private static List<String> newWarnings(String from, String to) throws IOException {
        String text = base();
        assertTrue(text.contains(from), from);
        List<String> before = read(text).warnings();
        List<String> after = new ArrayList<>(read(text.replace(from, to)).warnings());
        after.removeAll(before);
        return after;
    }

    @Test
    void ceilingAbove600CIsWarned() throws IOException {
        assertTrue(newWarning("  ceiling: 400 C", "  ceiling: 650 C").contains("limits.ceiling"));
    }

    @Test
    void ceilingAt600CIsNotWarned() throws IOException {
        String text = base();
        assertEquals(read(text).warnings(), read(text.replace("  ceiling: 400 C", "  ceiling: 600 C")).warnings());
    }

    @Test
    void porosityAbove0_8IsWarned() throws IOException {
        assertTrue(newWarning("  porosity: 0.30", "  porosity: 0.85").contains("cap.porosity"));
    }

    @Test
    void poreSmallerThanProductIsWarned() throws IOException {
        // Pore diameter 0.56 nm: the 0.6 nm product of 'backbone' does not fit, the 0.5 nm one does.
        assertTrue(newWarning("  pore_radius: 1.5 nm", "  pore_radius: 0.28 nm").contains("backbone"));
    }

    @Test
    void denseCapWithoutPermeabilityIsWarned() throws IOException {
        // every product without a way out is named (the base case has two components), in one or more warnings
        List<String> w = newWarnings("  porosity: 0.30\n  pore_radius: 1.5 nm\n", "  porosity: 0\n");
        String all = String.join(" ", w);
        assertTrue(!w.isEmpty() && w.stream().allMatch(x -> x.contains("dense")), "new warnings: " + w);
        assertTrue(all.contains("backbone") && all.contains("side groups"), "new warnings: " + w);
    }

    @Test
    void baseCaseDefaultsAreListed() throws IOException {
        // The base leaves ambient, wafer and residue out: the defaults say so.
        List<String> d = read(base()).defaults();
        assertTrue(d.stream().anyMatch(s -> s.startsWith("ambient")), d.toString());
        assertTrue(d.stream().anyMatch(s -> s.startsWith("limits.residue")), d.toString());
    }
}
