package org.exhale.mechanics;

import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.zip.GZIPOutputStream;

/**
 * Regenerates the bundled disc correction table (src/main/resources/org/exhale/mechanics/
 * disc-fvk-correction.tsv.gz) from {@link AxisymmetricFvk}; see DEVELOPERS.md for the command.
 * Takes a few minutes on one core.
 */
public final class DiscCorrectionWriter {
    private DiscCorrectionWriter() {
    }

    public static void main(String[] args) throws IOException {
        Path out = Path.of(args.length > 0 ? args[0]
                : "src/main/resources/org/exhale/mechanics/" + DiscCorrection.RESOURCE);
        Files.createDirectories(out.getParent());
        Path tmp = out.resolveSibling(out.getFileName() + ".tmp");
        long t0 = System.nanoTime();
        try (Writer w = new OutputStreamWriter(new GZIPOutputStream(Files.newOutputStream(tmp)), StandardCharsets.US_ASCII)) {
            w.write("# exhale: ratios of the axisymmetric FvK clamped disc to the uniform-force model (DiscCorrection)\n");
            w.write(String.format(Locale.ROOT, "# nu 0..%.1f step %.1f; y = ln(1 + n0/j11^2) from %.6f step %.2f (%d); "
                            + "x = ln Q from %.6f step %.2f (%d); parts: edge stretch, centre stretch, edge moment, centre moment, deflection%n",
                    (DiscCorrection.NNU - 1) * DiscCorrection.NU_STEP, DiscCorrection.NU_STEP, DiscCorrection.Y_MIN,
                    DiscCorrection.Y_STEP, DiscCorrection.NY, DiscCorrection.X_MIN, DiscCorrection.X_STEP, DiscCorrection.NX));
            for (int k = 0; k < DiscCorrection.NNU; k++) {
                double nu = k * DiscCorrection.NU_STEP;
                double[][][] slice = DiscCorrection.tabulate(nu);
                for (double[][] row : slice) {
                    for (double[] node : row) {
                        StringBuilder sb = new StringBuilder();
                        for (int p = 0; p < node.length; p++) {
                            sb.append(p == 0 ? "" : "\t").append(String.format(Locale.ROOT, "%.6f", node[p]));
                        }
                        w.write(sb.append('\n').toString());
                    }
                }
                System.out.printf(Locale.ROOT, "nu %.1f done, %.0f s%n", nu, (System.nanoTime() - t0) / 1e9);
            }
        }
        Files.move(tmp, out, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        System.out.println("wrote " + out);
    }
}
