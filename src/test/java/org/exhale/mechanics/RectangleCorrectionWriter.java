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
 * Regenerates the bundled rectangle correction table (src/main/resources/org/exhale/mechanics/
 * rectangle-fvk-correction.tsv.gz) from {@link QuarterPlateFvk}; see DEVELOPERS.md for the command.
 *
 * <p>Each row (one L/w, pre-stress and ν) is a continuation in the load through the Q nodes on two
 * grids ({@value #COARSE} and {@value #FINE} intervals across the half width, clustered at the clamped
 * edges, β = {@value #BETA}), Richardson-extrapolated (second order) part by part. Nodes far below the
 * onset of stretching, Q &lt; e⁻⁴ (s0 + λ)^{3/2}, where the plate is linear and the ratios constant,
 * take the first computed node's values.
 */
public final class RectangleCorrectionWriter {
    static final int COARSE = 16;
    static final int FINE = 24;
    static final double BETA = 0.9;

    private RectangleCorrectionWriter() {
    }

    /** Row (aspect node k, pre-stress row j, ν node m): [load node][part]. */
    static double[][] row(int k, int j, int m) {
        return row(RectangleCorrection.ASPECTS[k], RectangleCorrection.s0At(k, j), RectangleCorrection.NUS[m], COARSE, FINE);
    }

    /** The ratios at the table's load nodes for any L/w, s0 and ν, from grids of nc and nf intervals. */
    static double[][] row(double aspect, double s0, double nu, int nc, int nf) {
        int nx = RectangleCorrection.NX;
        double[][] out = new double[nx][];
        double lam = RectangleBuckling.lambda(aspect);
        double onset = Math.pow(Math.max(s0 + lam, 1e-6), 1.5) * Math.exp(-4);
        int first = (int) Math.floor((Math.log(onset) - RectangleCorrection.X_MIN) / RectangleCorrection.X_STEP);
        first = Math.max(0, Math.min(first, nx - 1));
        // in compression each grid sits as far from its own (discrete) buckling load as the plate from
        // its true one: the grids' buckling loads differ by O(h²), which near buckling would dominate
        double lamS = RectangleBuckling.symmetricLambda(aspect);
        double s0c = s0 < 0 ? s0 * symmetricBucklingFd(aspect, nu, nc) / lamS : s0;
        double s0f = s0 < 0 ? s0 * symmetricBucklingFd(aspect, nu, nf) / lamS : s0;
        QuarterPlateFvk coarse = plate(aspect, nu, s0c, nc);
        QuarterPlateFvk fine = plate(aspect, nu, s0f, nf);
        double c = 1 / ((double) nf * nf / ((double) nc * nc) - 1);
        for (int i = first; i < nx; i++) {
            double q = RectangleCorrection.qAt(i);
            double[] pc = parts(advance(coarse, q), aspect, s0, s0c, q);
            double[] pf = parts(advance(fine, q), aspect, s0, s0f, q);
            double[] p = new double[RectangleCorrection.PARTS];
            for (int n = 0; n < p.length; n++) {
                p[n] = pf[n] + (pf[n] - pc[n]) * c;
            }
            out[i] = p;
        }
        for (int i = 0; i < first; i++) {
            out[i] = out[first].clone();
        }
        return smoothed(out);
    }

    /**
     * Near buckling a long rectangle's response switches shape abruptly with the load (from the wavy
     * buckling mode to the pressure's own shape), and the two grids switch at slightly different loads:
     * a node inside that switch extrapolates to nonsense (seen once, L/w = 4 at 0.98 of buckling,
     * Q ≈ 0.05). A node whose edge moment or deflection ratio departs by more than 15 % from the mean
     * of its neighbours' (the left one already smoothed) takes that mean in every part; moments stay
     * non-negative.
     */
    static double[][] smoothed(double[][] row) {
        double[][] out = new double[row.length][];
        for (int i = 0; i < row.length; i++) {
            out[i] = row[i].clone();
            if (i > 0 && i + 1 < row.length) {
                boolean outlier = false;
                for (int p : new int[] {2, 4}) {
                    double mean = 0.5 * (out[i - 1][p] + row[i + 1][p]);
                    outlier |= Math.abs(row[i][p] - mean) > 0.15 * Math.abs(mean);
                }
                if (outlier) {
                    for (int p = 0; p < out[i].length; p++) {
                        out[i][p] = 0.5 * (out[i - 1][p] + row[i + 1][p]);
                    }
                }
            }
            out[i][2] = Math.max(0, out[i][2]);
            out[i][3] = Math.max(0, out[i][3]);
        }
        return out;
    }

    /**
     * The lowest doubly symmetric buckling load λ_s (positive) of the discrete plate of n intervals: the
     * root of a quadratic fitted to the reciprocal small-load mean deflection (the pressure's work) at
     * 0.90, 0.95 and 0.98 of the continuum value (one mode dominates there, so it is nearly linear in s0).
     */
    static double symmetricBucklingFd(double aspect, double nu, int n) {
        double lam = RectangleBuckling.symmetricLambda(aspect);
        double[] f = {0.90, 0.95, 0.98};
        double[] r = new double[3];
        for (int k = 0; k < 3; k++) {
            QuarterPlateFvk p = plate(aspect, nu, -f[k] * lam, n);
            p.solve(1e-8);
            r[k] = 1e-8 / p.meanDeflection();
        }
        // Newton on the Lagrange quadratic through (f_k, r_k), from f = 1
        double x = 1;
        for (int it = 0; it < 50; it++) {
            double v = 0;
            double d = 0;
            for (int k = 0; k < 3; k++) {
                double l = 1;
                double dl = 0;
                for (int m = 0; m < 3; m++) {
                    if (m != k) {
                        double term = (x - f[m]) / (f[k] - f[m]);
                        dl = dl * term + l / (f[k] - f[m]);
                        l *= term;
                    }
                }
                v += r[k] * l;
                d += r[k] * dl;
            }
            double dx = v / d;
            x -= dx;
            if (Math.abs(dx) < 1e-14) {
                break;
            }
        }
        return x * lam;
    }

    /**
     * Long plates close to buckling (L/w = 6 at 0.98, L/w = 10 at 0.98 and 0.95 of buckling) give rows
     * that jump by 30–50 % from node to node even after {@link #smoothed}: several wavy modes of nearly
     * the same buckling load, which these grids do not separate. A row (of any ν) whose edge moment or
     * deflection ratio departs anywhere by more than 10 % from its neighbours' mean takes, for every ν,
     * the rows of the next pre-stress towards tension (working from tension down). [row][ν][node][part]
     */
    static void reliable(double[][][][] column) {
        for (int j = column.length - 2; j >= 0; j--) {
            boolean rough = false;
            for (double[][] row : column[j]) {
                for (int i = 1; i + 1 < row.length; i++) {
                    for (int p : new int[] {2, 4}) {
                        double mean = 0.5 * (row[i - 1][p] + row[i + 1][p]);
                        rough |= Math.abs(row[i][p] - mean) > 0.1 * Math.abs(row[i][p]);
                    }
                }
            }
            if (rough) {
                for (int m = 0; m < column[j].length; m++) {
                    column[j][m] = column[j + 1][m];
                }
            }
        }
    }

    static QuarterPlateFvk plate(double aspect, double nu, double s0, int n) {
        QuarterPlateFvk p = new QuarterPlateFvk(n, QuarterPlateFvk.intervalsAlong(n, aspect), aspect, nu, s0, BETA);
        p.keepFactors = true;
        return p;
    }

    /**
     * Solves at Q from the plate's present state; where Newton fails (near buckling a long plate's
     * response can switch shape within one load step), in steps of 10 % and then 2 % with a fresh
     * Jacobian at every step.
     */
    static QuarterPlateFvk advance(QuarterPlateFvk p, double q) {
        try {
            p.solve(q);
        } catch (IllegalStateException e) {
            boolean keep = p.keepFactors;
            p.keepFactors = false;
            try {
                p.solveTo(q, 1.1);
            } catch (IllegalStateException again) {
                p.solveTo(q, 1.02);
            } finally {
                p.keepFactors = keep;
            }
        }
        return p;
    }

    /**
     * The five ratios of {@link RectangleCorrection} for the plate's present state at load Q, against
     * the base model (the strip at the scaled pre-stress).
     */
    static double[] parts(QuarterPlateFvk p, double aspect, double s0, double q) {
        return parts(p, aspect, s0, p.s0, q);
    }

    /** The same with the plate run at its own pre-stress s0Plate (matched to its discrete buckling load). */
    static double[] parts(QuarterPlateFvk p, double aspect, double s0, double s0Plate, double q) {
        double s0b = RectangleCorrection.baseS0(aspect, s0);
        double s = CapStructure.solveTension(false, 3, s0b, q);
        double stretch = 3 * q * q * MembraneFunctions.stripStretch(s);
        double fe = Math.abs(MembraneFunctions.stripEdge(s));
        double fc = Math.abs(MembraneFunctions.stripCentre(s));
        double fd = MembraneFunctions.stripDeflection(s);
        QuarterPlateFvk.Stresses st = p.stresses();
        // edge: the boundary point with the largest load-induced face stress (s0 is common to all)
        double best = Double.NEGATIVE_INFINITY;
        double eStretch = 0;
        double eM = 0;
        for (int j = 0; j < st.longEdge.length; j++) {
            double v = st.longEdgeStretch[j] / 12 + st.longEdgeM[j] / 2;
            if (v > best) {
                best = v;
                eStretch = st.longEdgeStretch[j];
                eM = st.longEdgeM[j];
            }
        }
        for (int i = 0; i < st.shortEdgeAt.length; i++) {
            double v = st.shortEdgeStretch[i] / 12 + st.shortEdgeM[i] / 2;
            if (v > best) {
                best = v;
                eStretch = st.shortEdgeStretch[i];
                eM = st.shortEdgeM[i];
            }
        }
        boolean across = st.centreX >= st.centreY;
        double cStretch = across ? st.centreStretchX : st.centreStretchY;
        double cM = across ? st.centreMX : st.centreMY;
        double edge = (s0Plate + eStretch) / 12 + eM / 2;
        double centre = Math.max(st.centreX, st.centreY);
        if (st.max > Math.max(edge, centre)) {
            // a larger principal face stress just inside the boundary: carried by the edge moment
            eM = 2 * (st.max - (s0Plate + eStretch) / 12);
        }
        return new double[] {eStretch / stretch, cStretch / stretch, eM / (q * fe), cM / (q * fc),
            p.largestDeflection() / (q * fd)};
    }

    /**
     * Writes the table to args[0] (default: the resource in src/main/resources). With args[1] = k and
     * args[2] = an existing table of the same grid, the columns of L/w below node k are copied from it
     * and only the rest computed (to resume an interrupted run).
     */
    public static void main(String[] args) throws IOException {
        Path out = Path.of(args.length > 0 ? args[0]
                : "src/main/resources/org/exhale/mechanics/" + RectangleCorrection.RESOURCE);
        int from = args.length > 2 ? Integer.parseInt(args[1]) : 0;
        java.util.List<String> kept = new java.util.ArrayList<>();
        if (from > 0) {
            try (java.io.BufferedReader in = new java.io.BufferedReader(new java.io.InputStreamReader(
                    new java.util.zip.GZIPInputStream(Files.newInputStream(Path.of(args[2]))), StandardCharsets.US_ASCII))) {
                String line;
                int lines = from * RectangleCorrection.NY * RectangleCorrection.NNU * RectangleCorrection.NX;
                while ((line = in.readLine()) != null && kept.size() < lines) {
                    if (!line.isEmpty() && line.charAt(0) != '#') {
                        kept.add(line);
                    }
                }
                if (kept.size() != lines) {
                    throw new IOException(args[2] + " holds " + kept.size() + " of the " + lines + " lines of the first " + from + " columns");
                }
            }
        }
        Files.createDirectories(out.getParent());
        Path tmp = out.resolveSibling(out.getFileName() + ".tmp");
        long t0 = System.nanoTime();
        try (Writer w = new OutputStreamWriter(new GZIPOutputStream(Files.newOutputStream(tmp)), StandardCharsets.US_ASCII)) {
            w.write("# exhale: ratios of the 2D FvK clamped rectangle to the scaled strip (RectangleCorrection)\n");
            w.write(String.format(Locale.ROOT, "# order: L/w %s; y %s; nu %s; x = ln Q from %.6f step %.2f (%d); "
                            + "parts: edge stretch, centre stretch, edge moment, centre moment, deflection%n",
                    java.util.Arrays.toString(RectangleCorrection.ASPECTS), java.util.Arrays.toString(RectangleCorrection.YS),
                    java.util.Arrays.toString(RectangleCorrection.NUS), RectangleCorrection.X_MIN, RectangleCorrection.X_STEP,
                    RectangleCorrection.NX));
            for (String line : kept) {
                w.write(line + "\n");
            }
            for (int k = from; k < RectangleCorrection.NA; k++) {
                double[][][][] column = new double[RectangleCorrection.NY][RectangleCorrection.NNU][][];
                for (int j = 0; j < RectangleCorrection.NY; j++) {
                    for (int m = 0; m < RectangleCorrection.NNU; m++) {
                        column[j][m] = row(k, j, m);
                    }
                }
                reliable(column);
                for (int j = 0; j < RectangleCorrection.NY; j++) {
                    for (int m = 0; m < RectangleCorrection.NNU; m++) {
                        double[][] row = column[j][m];
                        for (double[] node : row) {
                            StringBuilder sb = new StringBuilder();
                            for (int p = 0; p < node.length; p++) {
                                sb.append(p == 0 ? "" : "\t").append(String.format(Locale.ROOT, "%.6f", node[p]));
                            }
                            w.write(sb.append('\n').toString());
                        }
                    }
                }
                System.out.printf(Locale.ROOT, "L/w %.2f done, %.0f s%n", RectangleCorrection.ASPECTS[k], (System.nanoTime() - t0) / 1e9);
            }
        }
        Files.move(tmp, out, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        System.out.println("wrote " + out);
    }
}
