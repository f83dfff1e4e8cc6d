package org.exhale.fitting;

import org.exhale.kinetics.ReactionModel;

/** The reaction-model families the fit can use; every component of one fit uses the same family. */
public enum ModelKind {
    NTH_ORDER("nth-order", 1),
    SESTAK_BERGGREN("sestak-berggren", 2),
    AVRAMI_EROFEEV("avrami-erofeev", 1),
    RANDOM_SCISSION("random-scission", 0);

    private final String id;
    private final int shapeParameters;

    ModelKind(String id, int shapeParameters) {
        this.id = id;
        this.shapeParameters = shapeParameters;
    }

    public String id() {
        return id;
    }

    public int shapeParameters() {
        return shapeParameters;
    }

    /** The kind with this case-file name, or an exception listing the names. */
    public static ModelKind byId(String id) {
        for (ModelKind k : values()) {
            if (k.id.equalsIgnoreCase(id)) {
                return k;
            }
        }
        throw new IllegalArgumentException("unknown model '" + id
                + "', expected nth-order, sestak-berggren, avrami-erofeev or random-scission");
    }

    /** The reaction model with these shape parameters (n; m, n; n; none). */
    public ReactionModel model(double[] shape) {
        return switch (this) {
            case NTH_ORDER -> new ReactionModel.NthOrder(shape[0]);
            case SESTAK_BERGGREN -> new ReactionModel.SestakBerggren(shape[0], shape[1]);
            case AVRAMI_EROFEEV -> new ReactionModel.AvramiErofeev(shape[0]);
            case RANDOM_SCISSION -> new ReactionModel.RandomScission();
        };
    }

    /** Names of the shape parameters, as in the case file. */
    public String[] shapeNames() {
        return switch (this) {
            case NTH_ORDER, AVRAMI_EROFEEV -> new String[] {"n"};
            case SESTAK_BERGGREN -> new String[] {"m", "n"};
            case RANDOM_SCISSION -> new String[0];
        };
    }

    /**
     * Lowest allowed shape values: the case-file ranges (kinetics.ReactionModel), with a reaction
     * order kept at or above 0.05 (an order near zero is a sign of the wrong family, not a result).
     */
    double[] shapeLower() {
        return switch (this) {
            case NTH_ORDER -> new double[] {0.05};
            case SESTAK_BERGGREN -> new double[] {0, 0.05};
            case AVRAMI_EROFEEV -> new double[] {0.5};
            case RANDOM_SCISSION -> new double[0];
        };
    }

    /** Highest allowed shape values (the case-file ranges). */
    double[] shapeUpper() {
        return switch (this) {
            case NTH_ORDER -> new double[] {10};
            case SESTAK_BERGGREN -> new double[] {5, 10};
            case AVRAMI_EROFEEV -> new double[] {4};
            case RANDOM_SCISSION -> new double[0];
        };
    }

    /** Shape parameters to start from: n = 1; m = 0.5, n = 1.5; n = 1.5; none. */
    double[] initialShape() {
        return switch (this) {
            case NTH_ORDER -> new double[] {1};
            case SESTAK_BERGGREN -> new double[] {0.5, 1.5};
            case AVRAMI_EROFEEV -> new double[] {1.5};
            case RANDOM_SCISSION -> new double[0];
        };
    }
}
