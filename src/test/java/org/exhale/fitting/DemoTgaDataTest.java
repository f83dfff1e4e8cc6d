package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class DemoTgaDataTest {
    @Test
    void committedDemoRunsAreReproducible() throws Exception {
        // Reproducibility check, common practice, no source: the seeded generator must recreate the files byte for byte.
        for (String[] f : DemoTgaData.files()) {
            Path p = Path.of("data/demo/tga").resolve(f[0]);
            assertEquals(f[1], Files.readString(p), p + " differs from the generator; rerun DemoTgaData.main");
        }
    }
}
