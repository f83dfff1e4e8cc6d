package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Seeded random damage to valid cases: values are swapped for hostile or edge values (bounds of
 * the reader's ranges, wrong types, wrong units), lines are dropped or doubled. Whatever the
 * damage, the reader either accepts the file or throws an {@link InputException} with a one-line
 * message naming the file. Any other exception (a raw IllegalArgumentException from a record's
 * constructor, NullPointerException, ClassCastException ...) is a bug. The seed is in every
 * failure message.
 */
class CaseMutationTest {
    private static final long SEED = 20240601L;
    private static final int MUTANTS = 1500;

    private static final String[] VALUES = {"", "~", "[]", "{}", "[1, 2]", "{a: 1}", "-1", "0", "1", "0.5", "0.999",
            "99", "1000", "1e400", "-1e400", "1e-400", ".nan", ".inf", "-.inf", "NaN", "0x10", "1,5", "1.5.5", "'",
            "\"\"", "*x", "&x", "!!binary AAAA", "yes", "null", "+", ".", "e5", "5e nm", "\u00e9",
            "9".repeat(400) + " nm", "|\n  x", "? x",
            // edge values of the reader's ranges, in the units the keys use
            "1e-300 nm", "1 nm", "0.01 nm", "10 nm", "1e-4 m", "0.1 m", "1e-12 m", "1 K", "3000 K", "-273.15 C",
            "1500 C", "20 C", "0 K", "1e5 s", "1e7 s", "9999999 s", "0 s", "1 s", "1e8 s", "1e-9 C/min", "6000 C/min",
            "100 K/s", "1e-10 1/s", "1e40 1/s", "1 kJ/mol", "1000 kJ/mol", "1e6 J/mol", "2 g/mol", "10 kg/mol",
            "0.01 g/cm3", "30 g/cm3", "0 Pa", "1e8 Pa", "1e10 Pa", "1 MPa", "2000 GPa", "-10 GPa", "1e-4 J/m2",
            "1e4 J/m2", "-1e-4 1/K", "1e-3 1/K", "1e-12 m2/s", "1 m2/s", "1e-7 Pa s", "1 mol/(m s Pa)", "199 K",
            "50 %", "1e-9", "0.499", "2", "100",
            "c1", "c2", "nth-order", "avrami-erofeev", "sestak-berggren", "rectangle", "disc", "line", "bruggeman"};

    /** Replaces one "key: value" of the line (block or flow style) with a value from the pool. */
    private static String replaceValue(String line, Random rnd) {
        List<int[]> spots = new ArrayList<>();
        for (int c = line.indexOf(": "); c >= 0; c = line.indexOf(": ", c + 1)) {
            int e = c + 2;
            while (e < line.length() && ",}".indexOf(line.charAt(e)) < 0) {
                e++;
            }
            if (c + 2 < line.length() && line.charAt(c + 2) != '{') {
                spots.add(new int[]{c + 2, e});
            }
        }
        if (spots.isEmpty()) {
            return line;
        }
        int[] s = spots.get(rnd.nextInt(spots.size()));
        return line.substring(0, s[0]) + VALUES[rnd.nextInt(VALUES.length)] + line.substring(s[1]);
    }

    private static String mutate(List<String> original, Random rnd) {
        List<String> l = new ArrayList<>(original);
        for (int k = 0, n = 1 + rnd.nextInt(3); k < n; k++) {
            int i = rnd.nextInt(l.size());
            switch (rnd.nextInt(8)) {
                case 0 -> l.remove(i);
                case 1 -> l.add(i, l.get(i));
                default -> l.set(i, replaceValue(l.get(i), rnd));
            }
        }
        return String.join("\n", l);
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"data/demo/porous-line.yaml", "data/demo/dense-disc.yaml",
            "src/test/resources/good-cases/base.yaml"})
    void damagedCasesGiveOnlyInputExceptions(String file) throws IOException {
        Random rnd = new Random(SEED);
        List<String> original = List.of(Files.readString(Path.of(file)).split("\n", -1));
        int refused = 0;
        for (int i = 0; i < MUTANTS; i++) {
            String text = mutate(original, rnd);
            try {
                CaseYamlReader.parse("m.yaml", text.getBytes(StandardCharsets.UTF_8));
            } catch (InputException e) {
                refused++;
                assertTrue(e.getMessage().startsWith("m.yaml"), e.getMessage());
                assertFalse(e.getMessage().contains("\n"), e.getMessage());
            } catch (RuntimeException | StackOverflowError e) {
                fail("seed " + SEED + ", mutant " + i + ": " + e + " escaped for\n" + text, e);
            }
        }
        // A check on the mutator, not a target: most mutants must really be damaged.
        assertTrue(refused > MUTANTS / 2, "only " + refused + " of " + MUTANTS + " mutants refused");
    }
}
