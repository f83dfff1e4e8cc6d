package org.exhale.fitting;

/**
 * Settings of the model fit.
 *
 * @param components      number of parallel components, 1 to 3
 * @param model           reaction-model family of every component
 * @param maxPointsPerRun the fit uses at most this many evenly spaced samples of each run (default
 *                        600); the temperature history between them is taken as linear
 * @param seedConversion  α(0) for models with f(0) = 0 or infinite (default 1e-4)
 * @param confidence      two-sided confidence level of the intervals
 * @param maxIterations   Levenberg–Marquardt iteration limit
 */
public record ModelFitOptions(int components, ModelKind model, int maxPointsPerRun, double seedConversion,
                              double confidence, int maxIterations) {
    public ModelFitOptions {
        if (components < 1 || components > 3) {
            throw new IllegalArgumentException("components must be 1, 2 or 3, got " + components);
        }
        if (model == null) {
            throw new IllegalArgumentException("model family is required");
        }
        if (maxPointsPerRun < 50) {
            throw new IllegalArgumentException("at least 50 points per run are needed for the fit, got " + maxPointsPerRun);
        }
        if (!(seedConversion > 0 && seedConversion <= 1e-2)) {
            throw new IllegalArgumentException("seed conversion must be in (0, 0.01], got " + seedConversion);
        }
        if (!(confidence > 0.5 && confidence < 1)) {
            throw new IllegalArgumentException("confidence must be in (0.5, 1), got " + confidence);
        }
        if (maxIterations < 1) {
            throw new IllegalArgumentException("iteration limit must be positive");
        }
    }

    public static ModelFitOptions of(int components, ModelKind model) {
        return new ModelFitOptions(components, model, 600, 1e-4, 0.95, 300);
    }

    public ModelFitOptions withMaxIterations(int n) {
        return new ModelFitOptions(components, model, maxPointsPerRun, seedConversion, confidence, n);
    }

    public ModelFitOptions withComponents(int k) {
        return new ModelFitOptions(k, model, maxPointsPerRun, seedConversion, confidence, maxIterations);
    }
}
