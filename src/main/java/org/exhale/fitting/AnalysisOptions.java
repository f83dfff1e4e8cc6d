package org.exhale.fitting;

/**
 * Settings of the pre-processing and of the isoconversional grid.
 *
 * @param alphaMin          lowest conversion analysed (default 0.05)
 * @param alphaMax          highest conversion analysed (default 0.95)
 * @param alphaStep         spacing of the conversion grid (default 0.01)
 * @param residueFraction   final mass as a fraction of the initial mass, or NaN to take the final
 *                          plateau of each run
 * @param plateauFraction   share of the points at each end averaged for the plateaus (default 0.02)
 * @param smoothingFraction half-width of the local-polynomial window as a share of the points in
 *                          the reaction range (default 0.02; at least 3 points each side)
 * @param confidence        two-sided confidence level of all intervals (default 0.95)
 */
public record AnalysisOptions(double alphaMin, double alphaMax, double alphaStep, double residueFraction,
                              double plateauFraction, double smoothingFraction, double confidence) {

    public static final AnalysisOptions DEFAULT = new AnalysisOptions(0.05, 0.95, 0.01, Double.NaN, 0.02, 0.02, 0.95);

    public AnalysisOptions {
        if (!(alphaMin > 0 && alphaMin < alphaMax && alphaMax < 1)) {
            throw new IllegalArgumentException("conversion range must satisfy 0 < min < max < 1, got "
                    + alphaMin + ":" + alphaMax);
        }
        if (!(alphaStep > 0 && alphaStep <= (alphaMax - alphaMin))) {
            throw new IllegalArgumentException("conversion step must be in (0, " + (alphaMax - alphaMin)
                    + "], got " + alphaStep);
        }
        if (!Double.isNaN(residueFraction) && !(residueFraction >= 0 && residueFraction < 0.95)) {
            throw new IllegalArgumentException("residue must be in [0, 95) % of the initial mass, got "
                    + residueFraction * 100 + " %");
        }
        if (!(plateauFraction > 0 && plateauFraction <= 0.2)) {
            throw new IllegalArgumentException("plateau share must be in (0, 0.2], got " + plateauFraction);
        }
        if (!(smoothingFraction >= 0 && smoothingFraction <= 0.2)) {
            throw new IllegalArgumentException("smoothing share must be in [0, 0.2], got " + smoothingFraction);
        }
        if (!(confidence > 0.5 && confidence < 1)) {
            throw new IllegalArgumentException("confidence level must be in (0.5, 1), got " + confidence);
        }
    }

    public AnalysisOptions withRange(double min, double max) {
        return new AnalysisOptions(min, max, Math.min(alphaStep, max - min), residueFraction, plateauFraction,
                smoothingFraction, confidence);
    }

    public AnalysisOptions withResidue(double residue) {
        return new AnalysisOptions(alphaMin, alphaMax, alphaStep, residue, plateauFraction, smoothingFraction, confidence);
    }

    public AnalysisOptions withSmoothing(double share) {
        return new AnalysisOptions(alphaMin, alphaMax, alphaStep, residueFraction, plateauFraction, share, confidence);
    }

    /** The conversion levels alphaMin, alphaMin + step, …, up to alphaMax (inclusive within 1e-9). */
    public double[] grid() {
        int n = (int) Math.floor((alphaMax - alphaMin) / alphaStep + 1e-9) + 1;
        double[] g = new double[n];
        for (int i = 0; i < n; i++) {
            g[i] = alphaMin + i * alphaStep;
        }
        return g;
    }
}
