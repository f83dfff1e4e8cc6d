package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;

/** Inputs that could silently mean something else are refused (common practice, no source). */
class AmbiguousInputTest {
    private static InputException refuse(String from, String to) throws Exception {
        String text = Files.readString(Path.of("src/main/resources/templates/line.yaml"));
        String edited = text.replace(from, to);
        assertTrue(!edited.equals(text), "edit did not apply: " + from);
        return assertThrows(InputException.class,
                () -> CaseYamlReader.parse("edited.yaml", edited.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void anEmptyValueNeverSwitchesALimitOff() throws Exception {
        InputException e = refuse("strength: 150 MPa", "strength:");
        assertEquals(ErrorKind.MISSING_KEY, e.kind());
        assertTrue(e.getMessage().contains("cap.strength") && e.line() > 0, e.getMessage());
    }

    @Test
    void aBareResidueIsAmbiguous() throws Exception {
        InputException e = refuse("residue: 0.5 %", "residue: 0.5");
        assertEquals(ErrorKind.BAD_UNIT, e.kind());
        assertTrue(e.getMessage().contains("limits.residue"), e.getMessage());
    }
}
