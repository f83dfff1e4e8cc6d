package org.exhale.recipe;

/**
 * Where a recipe's residue target applies (MODEL.md §9): the end of the final hold, the conversion
 * during the cool-down after it not counted. The final hold is the recipe's last hold when only
 * cooling ramps follow it. A recipe without one (no hold, or a heating ramp after the last hold) is
 * judged at the end of its last step before the trailing cooling ramps; a recipe of cooling ramps
 * only, at its end.
 *
 * @param stepIndex the step (0-based) at whose end the residue is read
 * @param timeS     the time of that instant from the start of the recipe [s]
 * @param finalHold true when that step is the final hold
 */
public record ResidueCheckpoint(int stepIndex, double timeS, boolean finalHold) {
    public ResidueCheckpoint {
        if (stepIndex < 0 || !(timeS >= 0)) {
            throw new IllegalArgumentException("residue checkpoint needs a step and a time, got step " + stepIndex
                    + " at " + timeS + " s");
        }
    }

    /** Finds the checkpoint of a recipe. */
    public static ResidueCheckpoint of(Recipe recipe) {
        var steps = recipe.steps();
        var segments = recipe.segments();
        int last = steps.size() - 1;
        // strip the trailing cooling ramps
        while (last >= 0 && steps.get(last) instanceof Step.Ramp && segments.get(last).endK() < segments.get(last).startK()) {
            last--;
        }
        if (last < 0) {
            int end = steps.size() - 1;
            return new ResidueCheckpoint(end, segments.get(end).endTimeS(), false);
        }
        return new ResidueCheckpoint(last, segments.get(last).endTimeS(), steps.get(last) instanceof Step.Hold);
    }

    /** Words for outputs: "end of the final hold (step 4)" or why it is read elsewhere. */
    public String describe() {
        return finalHold ? "end of the final hold (step " + (stepIndex + 1) + ")"
                : "end of step " + (stepIndex + 1) + " (no final hold)";
    }
}
