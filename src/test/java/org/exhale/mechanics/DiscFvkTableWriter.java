package org.exhale.mechanics;

import java.io.BufferedOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.zip.GZIPOutputStream;

/**
 * Regenerates the bundled disc table (src/main/resources/org/exhale/mechanics/disc-fvk-response.bin.gz,
 * {@link DiscFvkTable}) from {@link AxisymmetricFvk}; see DEVELOPERS.md for the command. About seven
 * minutes on one core.
 *
 * <p>For each Poisson's ratio and pre-force row the load is continued upward through the Q nodes
 * (Newton from the last node's solution, sub-steps where a direct step fails) on 200 and 400
 * intervals and Richardson-extrapolated; the row is redone on 400/800, then 800/1600 intervals where
 * the two grids differ by more than 1e-4 in a face stress or the deflection.
 */
public final class DiscFvkTableWriter {
    private DiscFvkTableWriter() {
    }

    public static void main(String[] args) throws IOException {
        Path out = Path.of(args.length > 0 ? args[0]
                : "src/main/resources/org/exhale/mechanics/" + DiscFvkTable.RESOURCE);
        Files.createDirectories(out.getParent());
        Path tmp = out.resolveSibling(out.getFileName() + ".tmp");
        long t0 = System.nanoTime();
        try (DataOutputStream w = new DataOutputStream(new BufferedOutputStream(new GZIPOutputStream(Files.newOutputStream(tmp))))) {
            for (int v : DiscFvkTable.headerInts()) {
                w.writeInt(v);
            }
            for (double v : DiscFvkTable.headerDoubles()) {
                w.writeDouble(v);
            }
            for (int k = 0; k < DiscFvkTable.NNU; k++) {
                double nu = k * DiscFvkTable.NU_STEP;
                for (int j = 0; j < DiscFvkTable.NY; j++) {
                    for (double[] node : row(j, nu)) {
                        for (double v : node) {
                            w.writeFloat((float) v);
                        }
                    }
                }
                System.out.printf(Locale.ROOT, "nu %.1f done, %.0f s%n", nu, (System.nanoTime() - t0) / 1e9);
            }
        }
        Files.move(tmp, out, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        System.out.println("wrote " + out);
    }

    /** Row j of the slice of Poisson's ratio ν: [i][part], the logarithms {@link DiscFvkTable} holds. */
    static double[][] row(int j, double nu) {
        double n0 = DiscFvkTable.n0At(j);
        int intervals = 200;
        while (true) {
            double[][] row = row(n0, nu, intervals);
            if (row != null) {
                return row;
            }
            if (intervals >= 1600) {
                throw new IllegalStateException("FvK table: no converged row at n0 = " + n0 + ", ν = " + nu);
            }
            intervals *= 2;
        }
    }

    /** One row; null if the grids disagree by more than 1e-4 anywhere (the caller refines). */
    private static double[][] row(double n0, double nu, int intervals) {
        AxisymmetricFvk coarse = new AxisymmetricFvk(intervals, nu);
        AxisymmetricFvk fine = new AxisymmetricFvk(2 * intervals, nu);
        double c = 6 * (1 + nu);
        double[][] row = new double[DiscFvkTable.NX][];
        double lastQ = 0;
        for (int i = 0; i < DiscFvkTable.NX; i++) {
            double q = DiscFvkTable.qAt(i);
            AxisymmetricFvk.Solution a = null;
            AxisymmetricFvk.Solution b = null;
            // from the last node in sub-steps if a direct Newton step fails
            for (int sub = 1; sub <= 64 && (a == null || b == null); sub *= 4) {
                for (int m = 1; m <= sub; m++) {
                    double qm = lastQ + (q - lastQ) * m / sub;
                    a = coarse.solve(n0, qm);
                    b = fine.solve(n0, qm);
                    if (a == null || b == null) {
                        break;
                    }
                }
            }
            if (a == null || b == null) {
                throw new IllegalStateException("FvK table: Newton failed at Q = " + q + ", n0 = " + n0 + ", ν = " + nu);
            }
            lastQ = q;
            double change = Math.max(rel(a.edgeFaceStress(), b.edgeFaceStress(), n0),
                    Math.max(rel(a.centreFaceStress(), b.centreFaceStress(), n0), rel(a.deflection(), b.deflection(), 0)));
            if (change > 1e-4 && intervals < 1600) {
                return null;
            }
            double s = CapStructure.solveTension(true, c, n0, q);
            double[] v = {
                rich(b.edgeStretch(), a.edgeStretch()) / (q * q),
                rich(b.centreStretch(), a.centreStretch()) / (q * q),
                Math.abs(rich(b.edgeSlopeDerivative(), a.edgeSlopeDerivative())) / q,
                Math.abs(rich(b.centreSlopeDerivative(), a.centreSlopeDerivative())) / q,
                rich(b.deflection(), a.deflection()) / q,
                c * MembraneFunctions.discStretch(s)};     // (s − n0)/Q² at the model's root, without cancellation
            row[i] = new double[DiscFvkTable.PARTS];
            for (int p = 0; p < v.length; p++) {
                if (!(v[p] > 0 && Double.isFinite(v[p]))) {
                    throw new IllegalStateException("FvK table: part " + p + " is " + v[p] + " at Q = " + q + ", n0 = " + n0
                            + ", ν = " + nu + " (a logarithm needs a positive value)");
                }
                row[i][p] = Math.log(v[p]);
            }
        }
        return row;
    }

    private static double rel(double a, double b, double n0) {
        return Math.abs(a - b) / Math.max(Math.abs(b), Math.max(Math.abs(n0), 1e-300));
    }

    private static double rich(double fine, double coarse) {
        return fine + (fine - coarse) / 3;
    }
}
