package org.exhale.planning;

import java.util.List;

import org.exhale.recipe.Recipe;
import org.exhale.simulation.BakeResult;

/**
 * The outcome of planning.
 *
 * @param recipe            the planned recipe, rounded to the tool's resolution (null when infeasible)
 * @param verification      the simulation of that recipe at every corner (null when infeasible)
 * @param durationS         recipe duration up to the end of the final hold (cool-down excluded) [s]
 * @param totalS            duration including the cool-down [s]
 * @param lowerBound        the §9 lower bound
 * @param boundRigorous     whether the bound with pressure-driven limits is rigorous here (quasi-steady gas)
 * @param verified          true only if the rounded recipe met every limit at every corner
 * @param binding           per recipe step, the limit that binds it
 * @param evaluations       simulations the search ran
 * @param notes             what the planner did and why (seed used, back-offs)
 * @param infeasibility     null, or why no recipe meets the limits and what would help
 * @param rideS             time to target of the closed-loop ride with unlimited steps (the planner's
 *                          backbone), NaN where the plan did not need one (only the ceiling and the
 *                          ramp bind) or none was found [s]
 * @param rideAdmissible    whether that ride kept every limit all the way; where it did not (somewhere no setpoint
 *                          could hold and it cooled as the limits allowed), its time is a reference only, not a time
 *                          any recipe is known to reach, and bound ≤ ride need not hold; false, and meaningless, where
 *                          there is no ride (rideS NaN)
 */
public record PlanResult(Recipe recipe, BakeResult verification, double durationS, double totalS,
                         LowerBound.Result lowerBound, boolean boundRigorous, boolean verified, List<String> binding,
                         int evaluations, List<String> notes, Infeasibility infeasibility,
                         double rideS, boolean rideAdmissible) {

    /** Why the target cannot be met, and what would help. */
    public record Infeasibility(String limit, String reason, double bestResidue, double withinS, String suggestion) {
    }

    public double boundRatio() {
        return lowerBound.boundS() > 0 && Double.isFinite(lowerBound.boundS()) ? durationS / lowerBound.boundS()
                : Double.NaN;
    }

    /** Planned time over the ride's: how much the tool's few steps cost against unlimited ones. */
    public double rideRatio() {
        return rideS > 0 && Double.isFinite(rideS) ? durationS / rideS : Double.NaN;
    }

    /** The same outcome with another lower bound (the planner's stored-gas bound arrives after its search). */
    public PlanResult withLowerBound(LowerBound.Result bound) {
        return new PlanResult(recipe, verification, durationS, totalS, bound, boundRigorous, verified, binding, evaluations,
                notes, infeasibility, rideS, rideAdmissible);
    }

    public boolean feasible() {
        return infeasibility == null && recipe != null;
    }
}
