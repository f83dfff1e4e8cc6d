package org.exhale.planning;

import java.util.Arrays;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;

/**
 * A joint minimum-time lower bound over the conversions of the components (two of them jointly; with
 * three, the third is left out of the state), for the quasi-steady gas regime (MODEL.md §9; the proof is in docs/model.md, "Lower bounds").
 *
 * <p>The state is the hot corner's conversions. The component with the smallest activation energy
 * is the clock: its conversion α_q rises strictly, so every trajectory crosses each level a_i of a
 * grid in α_q exactly once, and at that instant the other components lie in some cell c of their
 * own grids. τ(i, c) is a lower bound on the instant any recipe crosses level i with the others in
 * cell c. A move from (i, c) to (i+1, c') keeps every conversion inside the box
 * [a_i, a_{i+1}] × [lo(c), hi(c')]; on it no admissible temperature exceeds T_top, the highest at
 * which the monotone limits hold with the least gas any state of the box generates (at both corners,
 * the cold corner 2ΔT lower with its least gas), and the temperature cap. The cold corner's
 * conversions are bounded above level by level through k(T)/k(T − 2ΔT) at each level's hottest move
 * (the current level's bound guessed, then checked), and below through that ratio at a split
 * temperature, which gives gas where f rises from the seed. Each level is cut into parts with their
 * own floors. In reduced time
 * F_j = ∫dα/f_j the move is exact: ΔF_j = ∫ρ_j(T) dF_q with ρ_j = k_j/k_q, and Δt = ∫dF_q/k_q(T).
 * By Jensen's inequality (1/k_q is a convex function of ρ_j along the Arrhenius curve) the move
 * takes at least ΔF_q/k_q(T*), T* the highest temperature ≤ T_top consistent with the others
 * ending in c'. Grids are finite, F is rounded outward, the admissible temperature upward: every
 * discretisation error lowers the bound.
 */
final class JointBound {
    private static final double R = PhysicalConstants.GAS_CONSTANT;
    private static final double HORIZON_S = 2 * 86_400;

    /** The bound [s], the clock component, the grid sizes and the margin evaluations spent. */
    record Outcome(double boundS, int clock, int levels, int cells, long evaluations) {
    }

    private final InstantLimits limits;
    private final TemperatureCap cap;
    private final double spread;
    private final double hotCeilingK;
    private final double floorK;
    /** Parts of each clock level, each with its own floors (the level's own steps are coarse to keep the cells few). */
    private final int parts;
    private final double startK;
    private final int k;
    private final Component[] comps;
    private final ReducedTime[] rt;
    private final double[] w;
    private final double target;
    private final int q;
    private final int[] others;
    private final double[] levels;
    private final double[][] cells;
    private final double[] rhoCold;
    private final int[] stride;
    private final int cellCount;
    private final double[] gen;
    private final double[] genCold;
    private long evaluations;
    private final CappedClock capped;
    /** Per other component and grid point: lower and upper F, f, and ρ at the hot ceiling. */
    private final double[][] cellLo;
    private final double[][] cellHi;
    private final double[][] cellF;
    private final double[] rhoTop;
    /** Per other component and grid point: a lower bound on the cold corner's conversion when the hot one is there. */
    private final double[][] cellColdLo;
    /** Stored gas (null when the gas is quasi-steady): each corner's storage and venting, docs/model.md bound 5. */
    private final StoredGas storage;
    /** With stored gas: per clock level, the corner whose stored gas is followed (0 hot, 1 cold); any choice is rigorous. */
    private final int[] tracked;
    /** Quasi-steady: per clock level, the corner whose limits bound the leading node's moves (0 hot, 1 cold). */
    private int[] binding;
    /** Bins of the hot corner's stored gas (1 when quasi-steady) and their width [mol/m²]. */
    private final int bins;
    private final double binWidth;
    /** With stored gas: the hottest temperature at which the monotone limits hold at both corners with no gas [K]. */
    private double hardK = Double.NaN;

    /**
     * @param clockDelta the largest relative change of the clock's f between levels
     * @param cellDelta  the largest relative change of another component's f across a cell
     * @param cellWidth  the widest cell of another component in reduced time
     * @param parts      parts of each clock level (equal steps in α), each with its own floors and admissible temperature
     */
    JointBound(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread, double clockDelta, double cellDelta,
               double cellWidth, int parts) {
        this(bake, limits, cap, spread, clockDelta, cellDelta, cellWidth, parts, 0, null);
    }

    /**
     * @param storedBins 0 for quasi-steady gas; otherwise the gas may be stored, and one corner's stored gas is
     *                   followed in this many bins (the pressure limits then enter only through storage and venting)
     * @param tracked    with stored gas, per clock level the corner followed (0 hot, 1 cold; null: the hot one); where
     *                   it changes, the newly followed corner is taken to hold no gas (which only lowers the bound)
     */
    JointBound(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread, double clockDelta, double cellDelta,
               double cellWidth, int parts, int storedBins, int[] tracked) {
        this(bake, limits, cap, spread, clockDelta, cellDelta, cellWidth, 0, cellWidth, parts, storedBins, tracked);
    }

    /**
     * @param widthPerF where positive, a cell starting at the other component's reduced time F is at most
     *                  max(minWidth, min(cellWidth, widthPerF × F)) wide: narrow where that component moves little
     *                  per clock level (early in the bake), which is where re-placing it within its cell costs most
     * @param minWidth  the narrowest cell that rule gives
     */
    JointBound(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread, double clockDelta, double cellDelta,
               double cellWidth, double widthPerF, double minWidth, int parts, int storedBins, int[] tracked) {
        this.limits = limits;
        this.cap = cap;
        this.spread = spread;
        this.hotCeilingK = cap.capK() + spread;
        this.floorK = bake.recipeStartK() - 100;
        this.parts = parts;
        this.startK = bake.recipeStartK();
        this.k = limits.size();
        this.comps = bake.polymer().components().toArray(new Component[0]);
        this.rt = new ReducedTime[k];
        this.w = new double[k];
        this.rhoCold = new double[k];
        for (int j = 0; j < k; j++) {
            rt[j] = new ReducedTime(comps[j].model(), bake.polymer().initialConversion(j));
            w[j] = comps[j].fraction();
            // the cold corner, 2ΔT lower, gains reduced time at least this much slower at every temperature it can
            // have (k(T)/k(T − 2ΔT) falls with T; the hot corner is at most at the ceiling)
            rhoCold[j] = spread > 0 ? comps[j].rateConstant(hotCeilingK) / comps[j].rateConstant(hotCeilingK - 2 * spread) : 1;
        }
        this.target = bake.limits().residue();
        int clock = 0;
        for (int j = 1; j < k; j++) {
            double e = comps[j].activationEnergyJPerMol();
            double eq = comps[clock].activationEnergyJPerMol();
            if (e < eq || (e == eq && w[j] > w[clock])) {
                clock = j;
            }
        }
        this.q = clock;
        // the clock and one other component: with three, the one of larger weight; the third is left out of the state
        // (its gas taken as none and its residue as gone, both of which only lower the bound)
        int other = -1;
        for (int j = 0; j < k; j++) {
            if (j != q && (other < 0 || w[j] > w[other])) {
                other = j;
            }
        }
        this.others = other < 0 ? new int[0] : new int[]{other};
        this.levels = grid(rt[q], top(q), clockDelta, Double.POSITIVE_INFINITY, false);
        this.cells = new double[others.length][];
        this.stride = new int[others.length];
        int count = 1;
        for (int o = 0; o < others.length; o++) {
            cells[o] = grid(rt[others[o]], top(others[o]), cellDelta, cellWidth, widthPerF, minWidth, true);
            stride[o] = count;
            count *= cells[o].length - 1;
        }
        this.cellCount = count;
        this.gen = new double[k];
        this.genCold = new double[k];
        this.capped = new CappedClock(comps[q], cap, spread);
        if (storedBins > 0) {
            this.storage = new StoredGas(bake, limits, comps, q, hotCeilingK, 2 * spread);
            // below the recipe's start temperature a move gains too little to matter: its hulls are coarse there
            storage.cold.resolveFrom(comps[q].rateConstant(startK));
            this.bins = storedBins;
            this.binWidth = storage.maxStoredMolPerM2 / storedBins;
            this.liveBins = new int[storedBins];
            this.landLo = new double[storedBins];
            this.landHi = new double[storedBins];
            this.land2Lo = new double[storedBins];
            this.land2Hi = new double[storedBins];
            this.landScratch = new double[4][2 * storedBins - 1];
            this.landHelps = new boolean[storedBins];
            this.tracked = new int[levels.length];
            for (int i = 0; i < levels.length; i++) {
                this.tracked[i] = tracked == null ? 0 : tracked[Math.min(i, tracked.length - 1)];
            }
        } else {
            this.storage = null;
            this.bins = 1;
            this.binWidth = 0;
            this.tracked = null;
        }
        this.levelHot = new double[levels.length];
        this.levelSpan = new double[levels.length];
        for (int l = 0; l + 1 < levels.length; l++) {
            levelSpan[l] = rt[q].upper(levels[l + 1]) - rt[q].lower(levels[l]);
        }
        this.fillWeight = new double[others.length][];
        this.fillCap = new double[others.length][];
        this.hiColdCache = new double[others.length][];
        this.hiColdF = new double[others.length][];
        for (int o = 0; o < others.length; o++) {
            hiColdCache[o] = new double[cells[o].length];
            hiColdF[o] = new double[cells[o].length];
        }
        cellLo = new double[others.length][];
        cellHi = new double[others.length][];
        cellF = new double[others.length][];
        rhoTop = new double[others.length];
        cellColdLo = new double[others.length][];
        cellColdLoF = new double[others.length][];
        for (int o = 0; o < others.length; o++) {
            int j = others[o];
            int n = cells[o].length;
            cellLo[o] = new double[n];
            cellHi[o] = new double[n];
            cellF[o] = new double[n];
            for (int p = 0; p < n; p++) {
                cellLo[o][p] = rt[j].lower(cells[o][p]);
                cellHi[o][p] = rt[j].upper(cells[o][p]);
                cellF[o][p] = comps[j].model().f(cells[o][p]);
            }
            rhoTop[o] = rho(j, hotCeilingK);
            cellColdLo[o] = new double[n];
            cellColdLoF[o] = new double[n];
            for (int p = 0; p < n; p++) {
                cellColdLo[o][p] = coldAtLeast(j, cellLo[o][p]);
                cellColdLoF[o][p] = comps[j].model().f(cellColdLo[o][p]);
            }
        }
    }

    /**
     * The clock's reduced time gained under the rising cap, C(s) = ∫_0^s k_q(cap(u) + ΔT) du, tabulated
     * on a 1 s grid as an upper Riemann sum (the integrand never falls), for the arrival of a move
     * while the cap still rises.
     */
    static final class CappedClock {
        private final Component clock;
        private final double[] cum;
        private final double[] hot;

        CappedClock(Component clock, TemperatureCap cap, double spread) {
            this.clock = clock;
            int n = (int) Math.ceil(cap.settledS()) + 2;
            cum = new double[n + 1];
            hot = new double[n + 1];
            hot[0] = cap.wafer(0) + spread;
            for (int i = 1; i <= n; i++) {
                hot[i] = cap.wafer(i) + spread;
                cum[i] = cum[i - 1] + clock.rateConstant(hot[i]) * (1 + 1e-12);
            }
        }

        /**
         * An upper bound on the clock's reduced time gained over [t0, s] by a corner never hotter than
         * min(top, cap(u) + ΔT): every grid second that [t0, s] touches counted whole, at its larger end.
         */
        double gainedAtMost(double t0, double s, double top) {
            int n = cum.length - 1;
            double kTop = clock.rateConstant(top) * (1 + 1e-12);
            int a = Math.max(0, Math.min((int) Math.floor(t0), n));
            int b = (int) Math.ceil(s);
            double sum = 0;
            for (int g = a + 1; g <= Math.min(b, n); g++) {
                sum += Math.min(cum[g] - cum[g - 1], kTop);
            }
            if (b > n) {
                sum += (b - Math.max(a, n)) * kTop;   // beyond the table the cap has settled: at most k(top)
            }
            return sum * (1 + 1e-12);
        }

        /**
         * A lower bound on when a move that gains reduced time f, starts at t0 or later and is never
         * hotter than min(top, cap(s) + ΔT), can end. Per grid second the move gains at most the
         * larger end's k (the cap rises), and from the second the cap reaches top at most k(top).
         */
        double arrival(double t0, double top, double f) {
            int n = cum.length - 1;
            double kTop = clock.rateConstant(top) * (1 + 1e-12);
            int s0 = Math.min((int) Math.floor(t0), n);
            // the first grid second at or after s0 from which the cap is at least top (n if never within the table)
            int lo = s0;
            int hi = n;
            if (hot[hi] < top) {
                lo = n;
            } else {
                while (lo < hi) {
                    int mid = (lo + hi) >>> 1;
                    if (hot[mid] >= top) {
                        hi = mid;
                    } else {
                        lo = mid + 1;
                    }
                }
            }
            int sTop = lo;
            // the reduced time gained from t0 to the end of its grid second is at most that second's share
            double base = s0 < n ? cum[s0] + (t0 - s0) * (cum[s0 + 1] - cum[s0]) : cum[n];
            if (cum[sTop] - base >= f && sTop > s0) {
                int a = s0 + 1;
                int b = sTop;
                while (a < b) {
                    int mid = (a + b) >>> 1;
                    if (cum[mid] - base >= f) {
                        b = mid;
                    } else {
                        a = mid + 1;
                    }
                }
                double step = cum[a] - cum[a - 1];
                return Math.max(t0, a - 1 + (f - (cum[a - 1] - base)) / step);
            }
            return Math.max(t0, sTop + (f - (cum[sTop] - base)) / kTop);
        }
    }

    /** Conversion above which a component's residue is 2 % of the target: beyond it the grid need not go. */
    private double top(int j) {
        double a = 1 - 0.02 * target / w[j];
        return Math.max(a, Math.min(rt[j].alpha0() + 1e-6, 0.5 * (1 + rt[j].alpha0())));
    }

    /**
     * Grid points from α0 to top over which f varies by at most a factor 1 + delta, α by at most 0.05 and
     * the reduced time by at most {@code width} (as far as the 0.002 logit sub-steps resolve it) between neighbours;
     * with {@code toOne}, 1 closes the last cell.
     */
    static double[] grid(ReducedTime r, double top, double delta, double width, boolean toOne) {
        return grid(r, top, delta, width, 0, width, toOne);
    }

    /** As above; where {@code perF} is positive, a cell starting at F is at most max(minWidth, min(width, perF F)) wide. */
    static double[] grid(ReducedTime r, double top, double delta, double width, double perF, double minWidth,
                         boolean toOne) {
        double a0 = r.alpha0();
        double s0 = ReducedTime.logit(Math.max(a0, 1e-9));
        double s1 = ReducedTime.logit(top);
        double[] out = new double[64];
        int n = 0;
        out[n++] = a0;
        double x = a0;
        double prev = a0;
        for (double s = s0 + 0.002; s < s1; s += 0.002) {
            double c = ReducedTime.sigmoid(s);
            if (c <= x) {
                continue;
            }
            double fmax = r.maxF(x, c);
            double fmin = r.minF(x, c);
            double wide = perF > 0 ? Math.max(minWidth, Math.min(width, perF * r.lower(x))) : width;
            if ((fmax > (1 + delta) * fmin || c - x > 0.05 || r.upper(c) - r.lower(x) > wide) && prev > x) {
                if (n == out.length) {
                    out = Arrays.copyOf(out, 2 * n);
                }
                out[n++] = prev;
                x = prev;
            }
            prev = c;
        }
        if (n + 2 > out.length) {
            out = Arrays.copyOf(out, n + 2);
        }
        if (top > x) {
            out[n++] = top;
        }
        if (toOne) {
            out[n++] = 1;
        }
        return Arrays.copyOf(out, n);
    }

    Outcome compute() {
        int nl = levels.length;
        if (storage != null && !storage.applicable()) {
            // no finite pressure limit somewhere, or rate constants not convex in the clock's: nothing is claimed
            return new Outcome(0, q, levels.length, cellCount, 0);
        }
        binding = storage == null ? new int[levels.length] : null;
        levelLeast = new double[nl];
        Arrays.fill(levelLeast, Double.POSITIVE_INFINITY);
        levelLeast[0] = 0;
        double[] tau = new double[cellCount * bins];
        Arrays.fill(tau, Double.POSITIVE_INFINITY);
        tau[0] = 0;
        double[] next = new double[cellCount * bins];
        // with stored gas, each bin's label is affine in the stored gas: τ at the bin's top (above) and at its bottom (here)
        if (storage != null) {
            tauBottom = new double[cellCount * bins];
            Arrays.fill(tauBottom, Double.POSITIVE_INFINITY);
            tauBottom[0] = 0;
            nextBottom = new double[cellCount * bins];
        }
        java.util.HashMap<Long, Double> memoPrev = null;
        // H: an upper bound on the hot corner's temperature so far, over every move of a recipe whose path has run
        // through regular nodes only (docs/model.md, "Lower bounds", 2); at the start the wafer is at its setpoint
        double hotSoFar = startK + spread;
        double lastHottest = hotSoFar;
        double lastRise = 0;
        best = Double.POSITIVE_INFINITY;
        boolean live = true;
        // with stored gas, where the followed corner changes, the corner left is still followed for a while beside it (the
        // secondary programme), and after every level each programme's nodes are raised to the other's least τ in the
        // same cell: both are lower bounds on the same crossing
        double[] tau2 = null;
        double[] tau2Bottom = null;
        double[] next2 = null;
        double[] next2Bottom = null;
        int corner2 = -1;
        int until2 = -1;
        for (int i = 0; i + 1 < nl && live; i++) {
            followed = tracked == null ? 0 : tracked[i];
            // guess a bound G on the hot corner over this level's moves, evaluate them with the cold corner bounded through
            // ρ(G + slack), and accept the level only if no move's admissible temperature exceeds G (else guess again)
            // (the guess follows the last level's rise, so that a level is seldom evaluated twice)
            double guessK = Math.max(hotSoFar, lastHottest) + Math.max(GUESS_K, 1.5 * lastRise);
            if (storage != null && i > 0 && tracked[i] != tracked[i - 1]) {
                if (lockLevels > 0) {
                    tau2 = tau.clone();
                    tau2Bottom = tauBottom.clone();
                    next2 = new double[tau.length];
                    next2Bottom = new double[tau.length];
                    corner2 = tracked[i - 1];
                    until2 = i + lockLevels;
                }
                // the newly followed corner's gas is only known to be ≥ 0: every node starts again from its earliest label
                for (int flat = 0; flat < cellCount; flat++) {
                    double t = Double.POSITIVE_INFINITY;
                    for (int m = 0; m < bins; m++) {
                        t = Math.min(t, tau[flat * bins + m]);
                    }
                    // (in every bin, so that each bin's label covers the recipes whose gas lies in it; the lowest
                    // dominates the others)
                    Arrays.fill(tau, flat * bins, (flat + 1) * bins, t);
                    Arrays.fill(tauBottom, flat * bins, (flat + 1) * bins, t);
                }
            }
            java.util.HashMap<Long, Double> memo;
            double acceptedK = Double.NaN;
            while (true) {
                memo = new java.util.HashMap<>();
                Arrays.fill(next, Double.POSITIVE_INFINITY);
                if (nextBottom != null) {
                    Arrays.fill(nextBottom, Double.POSITIVE_INFINITY);
                }
                Level lv = level(i, tau, next, guessK + SLACK_K, memo, memoPrev);
                if (!lv.any) {
                    live = false;
                    break;
                }
                if (lv.hottest <= guessK || guessK >= hotCeilingK) {
                    acceptedK = guessK + SLACK_K;
                    lastRise = Math.max(0, lv.hottest - lastHottest);
                    hotSoFar = Math.max(hotSoFar, lv.hottest);
                    lastHottest = lv.hottest;
                    levelHot[i] = Math.min(lv.hottest, hotCeilingK);
                    break;
                }
                guessK = lv.hottest + Math.max(GUESS_K, lv.hottest - guessK);
            }
            if (!live) {
                break;
            }
            if (tau2 != null) {
                // the secondary programme's level, with the hot corner bounded as the primary's accepted level
                Arrays.fill(next2, Double.POSITIVE_INFINITY);
                Arrays.fill(next2Bottom, Double.POSITIVE_INFINITY);
                double[] keepBottom = tauBottom;
                double[] keepNextBottom = nextBottom;
                tauBottom = tau2Bottom;
                nextBottom = next2Bottom;
                followed = corner2;
                secondary = true;
                level(i, tau2, next2, acceptedK, memo, memoPrev);
                secondary = false;
                followed = tracked[i];
                tauBottom = keepBottom;
                nextBottom = keepNextBottom;
                double[] least = leastByCell(next);
                double[] least2 = leastByCell(next2);
                raise(next, nextBottom, least2);
                raise(next2, next2Bottom, least);
                double[] swap = tau2;
                tau2 = next2;
                next2 = swap;
                swap = tau2Bottom;
                tau2Bottom = next2Bottom;
                next2Bottom = swap;
                if (i + 1 >= until2) {
                    tau2 = null;
                }
            }
            memoPrev = memo;
            double least = Double.POSITIVE_INFINITY;
            for (double t : next) {
                least = Math.min(least, t);
            }
            levelLeast[i + 1] = least;
            double[] swap = tau;
            tau = next;
            next = swap;
            if (tauBottom != null) {
                swap = tauBottom;
                tauBottom = nextBottom;
                nextBottom = swap;
            }
        }
        // nodes at the top level: any recipe that reaches the target later crossed one of them
        for (double t : tau) {
            best = Math.min(best, t);
        }
        return new Outcome(best > HORIZON_S ? Double.POSITIVE_INFINITY : best, q, levels.length, cellCount, evaluations);
    }

    /** Each cell's least τ over its bins. */
    private double[] leastByCell(double[] t) {
        double[] out = new double[cellCount];
        for (int flat = 0; flat < cellCount; flat++) {
            double v = Double.POSITIVE_INFINITY;
            for (int m = 0; m < bins; m++) {
                v = Math.min(v, t[flat * bins + m]);
            }
            out[flat] = v;
        }
        return out;
    }

    /**
     * Raises each bin's label to a cell's least τ from the other programme where that is later: the label becomes the
     * flat line at that τ where it lies above the label's middle (the larger of a line and a constant is not a line;
     * either alone is a valid lower bound).
     */
    private void raise(double[] top, double[] bottom, double[] least) {
        for (int flat = 0; flat < cellCount; flat++) {
            double v = least[flat];
            for (int m = 0; m < bins; m++) {
                int idx = flat * bins + m;
                if (v > top[idx] && v > 0.5 * (top[idx] + bottom[idx])) {
                    top[idx] = v;
                    bottom[idx] = v;
                }
            }
        }
    }

    /** With stored gas: the corner followed by the programme being evaluated (0 hot, 1 cold). */
    private int followed;
    /** Whether the programme being evaluated is the secondary one (its finishing nodes leave the bound alone). */
    private boolean secondary;
    /** Levels for which the corner left at a change of the followed corner is still followed beside the new one. */
    int lockLevels = LOCK_LEVELS;
    static final int LOCK_LEVELS = 5;

    /** How far above the last level's hottest move the next level's bound is first guessed [K]. */
    private static final double GUESS_K = 1;
    /** The cold corner is bounded with ρ this much above the guess, which the continuity argument needs [K]. */
    private static final double SLACK_K = 0.5;

    /** The least τ of the nodes from which the target may be reached within a move (updated as levels are processed). */
    private double best;
    /** Per clock level, the earliest label of any node there (filled by {@link #compute()}). */
    private double[] levelLeast;

    /** What one level's moves gave: whether any node was live, and the hottest admissible temperature of its moves. */
    private record Level(boolean any, double hottest) {
    }

    /**
     * The moves out of level i's live nodes, their arrivals recorded in {@code next}; the cold corner's conversions
     * are bounded with ρ at {@code hotMaxK}, taken to bound the hot corner's temperature over every move up to and
     * including this level's (the caller checks the claim).
     */
    private Level level(int i, double[] tau, double[] next, double hotMaxK, java.util.HashMap<Long, Double> memo,
                        java.util.HashMap<Long, Double> memoPrev) {
        int[] c = new int[others.length];
        int[] cp = new int[others.length];
        double[] rhoNow = new double[k];
        for (int j = 0; j < k; j++) {
            rhoNow[j] = rhoColdAt(j, hotMaxK);
        }
        currentHotMaxK = hotMaxK;
        coldTables(i, rhoNow);
        for (int o = 0; o < others.length; o++) {
            for (int p = 0; p < cells[o].length; p++) {
                hiColdCache[o][p] = otherColdAtMost(o, cells[o][p]);
                hiColdF[o][p] = comps[others[o]].model().f(hiColdCache[o][p]);
            }
        }
        double fLo = Math.max(0, rt[q].lower(levels[i + 1]) - rt[q].upper(levels[i]));
        double fHi = rt[q].upper(levels[i + 1]) - rt[q].lower(levels[i]);
        // the level split into equal steps in α: while the clock crosses part s, its conversion lies in
        // [b_s, b_{s+1}] and the others' in their box, so the part has its own floors, admissible temperature and least duration
        double[] clockFloor = new double[parts];
        double[] clockColdFloor = new double[parts];
        double[] partF = new double[parts];
        for (int s = 0; s < parts; s++) {
            double b0 = s == 0 ? levels[i] : levels[i] + (levels[i + 1] - levels[i]) * s / parts;
            double b1 = s == parts - 1 ? levels[i + 1] : levels[i] + (levels[i + 1] - levels[i]) * (s + 1) / parts;
            clockFloor[s] = rt[q].minF(b0, b1);
            clockColdFloor[s] = rt[q].minF(coldAtLeast(q, rt[q].lower(b0)), clockColdAtMost(i, b1, rhoNow[q]));
            partF[s] = Math.max(0, rt[q].lower(b1) - rt[q].upper(b0));
        }
        double[] partAdm = new double[parts];
        boolean any = false;
        double hottest = floorK;
        int nb = bins;
        LevelMemo phiMemo = storage == null ? null : new LevelMemo();
        // the leading node (earliest τ): which corner's limits bound its moves (quasi-steady; guides the stored-gas bound)
        int leader = -1;
        double leadT = Double.POSITIVE_INFINITY;
        for (int flat = 0; flat < cellCount; flat++) {
            if (tau[flat * nb] < leadT) {
                leadT = tau[flat * nb];
                leader = flat;
            }
        }
        int hotVotes = 0;
        int coldVotes = 0;
        double[] dv = new double[2 * nb - 1];
        double clockGas = limits.gasifiable(q) * (levels[i + 1] - levels[i]);
        // the nodes earliest first: their arrivals come first, so that later nodes' moves that lower nothing are seen early
        // (this can leave out a node whose τ is no earlier than a finishing node's, which the order by index processed: its
        // moves could lower nothing, but under quasi-steady gas its admissible temperature no longer counts towards the
        // level's hottest move; rigorous either way, as such a node is not regular; measured: no bound changed)
        double[] start = leastByCell(tau);
        Integer[] order = new Integer[cellCount];
        for (int flat = 0; flat < cellCount; flat++) {
            order[flat] = flat;
        }
        Arrays.sort(order, (x, y) -> Double.compare(start[x], start[y]));
        for (int n = 0; n < cellCount; n++) {
            int flat = order[n];
            double t0 = start[flat];
            if (!(t0 < best) || t0 > HORIZON_S) {
                continue;
            }
            any = true;
            decode(flat, c);
            // could the target be reached during a move out of this node? (the others can advance at most
            // ρ_j(hottest) ΔF_q in reduced time while the clock rises to the next level)
            if (capable(i, c, fHi)) {
                if (!secondary) {
                    best = Math.min(best, t0);
                }
                continue;
            }
            // landing cells c' ≥ c, dimension by dimension while the move can still be made
            System.arraycopy(c, 0, cp, 0, c.length);
            while (true) {
                // the move is nowhere hotter than its hottest part allows
                double adm = floorK;
                for (int s = 0; s < parts; s++) {
                    partAdm[s] = admissible(s, c, cp, clockFloor[s], clockColdFloor[s], rhoNow, memo, memoPrev);
                    adm = Math.max(adm, partAdm[s]);
                    if (flat == leader && storage == null && spread > 0) {
                        if (coldBinds(partAdm[s], c, cp, clockFloor[s], clockColdFloor[s])) {
                            coldVotes++;
                        } else {
                            hotVotes++;
                        }
                    }
                }
                hottest = Math.max(hottest, Math.min(adm, hotCeilingK));
                double d = duration(c, cp, Math.min(adm, hotCeilingK), fLo, fHi);
                if (d >= 0) {
                    // each part takes at least its clock reduced time at the part's own admissible temperature
                    double byParts = 0;
                    for (int s = 0; s < parts; s++) {
                        double kq = comps[q].rateConstant(Math.min(partAdm[s], hotCeilingK));
                        byParts += kq > 0 ? partF[s] / kq : (partF[s] > 0 ? Double.POSITIVE_INFINITY : 0);
                    }
                    d = Math.max(d, byParts * (1 - 1e-12));
                    // while the cap still rises, the clock's own reduced time: a move that starts at t ≥ t0 and ends at
                    // e gains ΔF_q ≤ ∫_t^e k_q(min(T_top, cap(s))) ds ≤ Λ(t0, e), so e is at least the root of
                    // Λ(t0, e) = ΔF_q (a later start only ends later)
                    double arrival = adm > cap.wafer(t0) + spread ? capped.arrival(t0, adm, fLo) : Double.NEGATIVE_INFINITY;
                    int to = encode(cp);
                    if (storage == null) {
                        next[to] = Math.min(next[to], Math.max(t0 + d, arrival));
                    } else {
                        storedMoves(i, c, cp, flat, to, tau, next, d * (1 - 1e-12), arrival, clockGas, fLo, fHi,
                                comps[q].rateConstant(Math.min(adm, hotCeilingK)) * (1 + 1e-12), minOf(clockColdFloor),
                                dv, phiMemo, Math.min(adm, hotCeilingK));
                    }
                }
                // advance cp like an odometer; a dimension stops once its x_lo exceeds what the hottest move gives
                int o = 0;
                while (o < others.length) {
                    if (cp[o] + 1 < cells[o].length - 1 && reachable(i, o, c[o], cp[o] + 1, fHi)) {
                        cp[o]++;
                        break;
                    }
                    cp[o] = c[o];
                    o++;
                }
                if (o == others.length) {
                    break;
                }
            }
        }
        if (binding != null) {
            binding[i] = coldVotes > hotVotes ? 1 : 0;
        }
        return new Level(any, hottest);
    }

    /** The least f of each component on a move from cells c into cells cp, at the hot corner and at the cold one. */
    private void floors(int[] c, int[] cp, double clockFloor, double clockColdFloor, double[] floors, double[] coldFloors) {
        floors[q] = clockFloor;
        coldFloors[q] = clockColdFloor;
        for (int o = 0; o < others.length; o++) {
            int j = others[o];
            floors[j] = Math.min(cellF[o][c[o]], cellF[o][cp[o] + 1]);
            coldFloors[j] = Math.min(coldLowF(o, c[o], cp[o]), hiColdF[o][cp[o] + 1]);
        }
    }

    /** Whether at hot temperature t (just infeasible) the cold corner's margin is the smaller one. */
    private boolean coldBinds(double t, int[] c, int[] cp, double clockFloor, double clockColdFloor) {
        double[] floors = new double[k];
        double[] coldFloors = new double[k];
        floors(c, cp, clockFloor, clockColdFloor, floors, coldFloors);
        double hotK = Math.min(t, hotCeilingK);
        for (int j = 0; j < k; j++) {
            gen[j] = limits.gasifiable(j) * comps[j].rateConstant(hotK) * floors[j];
            genCold[j] = limits.gasifiable(j) * comps[j].rateConstant(hotK - 2 * spread) * coldFloors[j];
        }
        return limits.monotoneMargin(hotK - 2 * spread, genCold) < limits.monotoneMargin(hotK, gen);
    }

    /** Quasi-steady only: after {@link #compute()}, per clock level the corner whose limits bound the leading node. */
    int[] bindingCorners() {
        return binding == null ? null : binding.clone();
    }

    /**
     * The arrivals of one move with one corner's stored gas followed in bins (docs/model.md, "Lower bounds", 5). A
     * bin's label is affine in the stored gas S over the bin: no recipe crosses the node with S in [s_m, s_{m+1}]
     * earlier than the line from τ at the bin's bottom ({@link #tauBottom}) to τ at its top ({@code tau}). A move from
     * S to S' takes at least D(S' − S): the larger of its kinetic duration {@code d} and the least duration with room
     * S' − S − c ({@link StoredGas.Phi#leastDuration}; c the gas counted exactly: the clock's increment at the hot
     * corner). D falls and is convex in the room (the least d over a convex set — the perspective d φ(F/d) of the
     * convex φ is jointly convex — as a function of the room); it is known at the bin differences. Over the span of
     * S' − S a move from one bin into another covers, a secant of D from just beyond that span, extended into it, lies
     * below D; with the source's affine label that gives an affine lower bound of the arrival over the landing bin
     * (each source's best line at the bin's middle, or the constant of the most room and the earliest start). The
     * least of such lines is concave, so the line between its values at the bin's ends lies below it: the landing
     * label. The move also ends no sooner than {@code arrival}.
     */
    private void storedMoves(int i, int[] c, int[] cp, int from, int to, double[] tau, double[] next, double d,
                             double arrival, double clockGas, double fLo, double fHi, double uMax, double clockColdFloor,
                             double[] dv, LevelMemo phiMemo, double topK) {
        int nb = bins;
        int first = -1;
        int last = -1;
        for (int m = 0; m < nb; m++) {
            if (Double.isFinite(tau[from * nb + m])) {
                last = m;
                if (first < 0) {
                    first = m;
                }
            }
        }
        if (first < 0) {
            return;
        }
        boolean hotCorner = followed == 0;
        // the gas weights a_j = n0_j × (least f_j) of the followed corner over the move, memoised by what they depend on
        long key = hotCorner ? 1 : 2;
        double[] a = new double[k];
        for (int o = 0; o < others.length; o++) {
            int j = others[o];
            int n = cells[o].length;
            if (hotCorner) {
                int e = cellF[o][c[o]] <= cellF[o][cp[o] + 1] ? c[o] : cp[o] + 1;
                a[j] = limits.gasifiable(j) * cellF[o][e];
                key = key * (n + 1) + e;
            } else {
                // the floor is f at the cold lower bound of the cell left, or at the cold upper bound of the top of the
                // cell entered, whichever is smaller: 2n possible values
                double fLoCold = coldLowF(o, c[o], cp[o]);
                boolean fromLeft = fLoCold < hiColdF[o][cp[o] + 1];
                a[j] = limits.gasifiable(j) * (fromLeft ? fLoCold : hiColdF[o][cp[o] + 1]);
                int which = fromLeft ? c[o] : n + cp[o] + 1;
                key = key * (2L * n + 2) + which;
            }
        }
        double exact = 0;
        if (hotCorner) {
            exact = clockGas;   // the clock's own gas, counted exactly (its rate term is left out of φ)
        } else {
            a[q] = limits.gasifiable(q) * clockColdFloor;
        }
        final long memoKey = key * 0x9E3779B97F4A7C15L;
        final double exactGas = exact;
        // the least durations by bin difference with the rate count, memoised for the level (fLo, fHi, the clock's gas and
        // the cap on u are the level's); the hot corner's φ depends on the cells only and is kept for every level
        double[] base = phiMemo.dv.get(memoKey);
        if (base == null) {
            StoredGas.Phi phi = hotCorner ? hotPhis.computeIfAbsent(memoKey, z -> storage.hot.phi(a, null))
                    : storage.cold.phi(a, null);
            base = new double[2 * nb - 1];
            for (int diff = -(nb - 1); diff <= nb - 1; diff++) {
                base[diff + nb - 1] = phi.leastDuration((1 - diff) * binWidth - exactGas, fLo, fHi, uMax) * (1 - 1e-12);
            }
            // more room never takes longer (the least duration falls as the room grows); made exact against rounding by
            // lowering a duration to any with less room (only lowers the bound)
            for (int x = 2 * nb - 3; x >= 0; x--) {
                base[x] = Math.min(base[x], base[x + 1]);
            }
            phiMemo.dv.put(memoKey, base);
        }
        // a bin is dominated by a lower one whose label at its bottom is no later than this one's at its top: every S of
        // the lower bin is below every S of this one (more room) and no later, so the lower bin's arrivals bound this one's
        int live = 0;
        double lowestBottom = Double.POSITIVE_INFINITY;
        for (int m = first; m <= last; m++) {
            double t = tau[from * nb + m];
            if (t < lowestBottom) {
                liveBins[live++] = m;
                lowestBottom = Math.min(lowestBottom, tauBottom[from * nb + m]);
            }
        }
        // the stored gas at the end of the move is at most what the cavity holds at the move's highest conversions (the
        // cold corner's conversions never exceed the hot one's)
        double[] alphaHi = new double[k];
        java.util.Arrays.fill(alphaHi, 1);
        alphaHi[q] = levels[i + 1];
        for (int o = 0; o < others.length; o++) {
            alphaHi[others[o]] = cells[o][cp[o] + 1];
        }
        int top = (int) Math.min(nb - 1, Math.floor(storage.capacity(alphaHi) / binWidth));
        // every landing label is at least the least source label plus D's least sample (the most room): where that is
        // no earlier than what every landing bin holds at both ends, or than the least τ of a finishing node, the move
        // can change nothing
        double threshold = Double.NEGATIVE_INFINITY;
        for (int mp = 0; mp <= top; mp++) {
            threshold = Math.max(threshold, Math.max(next[to * nb + mp], nextBottom[to * nb + mp]));
        }
        threshold = Math.min(threshold, best);
        double leastSource = Double.POSITIVE_INFINITY;
        for (int l = 0; l < live; l++) {
            leastSource = Math.min(leastSource, tau[from * nb + liveBins[l]]);
        }
        // (a label from the secant of [k0 − 2, k0 − 1] extended to k0 + 1 is at least the source's top plus that extension,
        // 3 D(k0 − 1) − 2 D(k0 − 2))
        double floor = Math.max(d, base[0]);
        for (int k0 = 4 - nb; k0 <= nb - 1; k0++) {
            double da = Math.max(d, base[nb - (k0 - 2)]);
            if (da < Double.POSITIVE_INFINITY) {
                floor = Math.min(floor, 3 * Math.max(d, base[nb - (k0 - 1)]) - 2 * da);
            }
        }
        double earliest = leastSource + floor;
        if (earliest - 1e-8 * Math.abs(earliest) >= threshold && pruneMoves) {
            return;
        }
        // the first count's landing labels; the second count below can only lengthen moves, and its labels are taken only
        // where no lower than the first's at both ends of a bin: where the first count's labels lower no node (or arrive no
        // earlier than the least τ of a finishing node), the move can change nothing
        landing(base, d, arrival, nb, liveBins, live, tau, tauBottom, from * nb, top, landLo, landHi, landScratch, null);
        boolean helps = false;
        for (int mp = 0; mp <= top; mp++) {
            landHelps[mp] = landHi[mp] < best && (landHi[mp] < next[to * nb + mp] || landLo[mp] < nextBottom[to * nb + mp]);
            helps |= landHelps[mp];
        }
        if (!helps && pruneMoves) {
            return;
        }
        // a second count of the others' gas: at the hot corner their least increments from the cells left and entered; at
        // the cold corner their hot reduced time θ_j ≥ θ_lo paid up front with λ_j = a_j/ρ_j(T_top) (any λ ≥ 0 is valid);
        // with nothing to pay it is the weaker of the two and left out
        double paid = 0;
        double[] lambda = hotCorner ? null : new double[k];
        for (int o = 0; o < others.length; o++) {
            int j = others[o];
            if (hotCorner) {
                paid += limits.gasifiable(j) * Math.max(0, cells[o][cp[o]] - cells[o][c[o] + 1]);
            } else {
                lambda[j] = a[j] / rhoColdAbove(j, hotCeilingK);
                paid += lambda[j] * Math.max(0, cellLo[o][cp[o]] - cellHi[o][c[o] + 1]);
            }
        }
        if (paid > 0) {
            StoredGas.Phi second = hotCorner ? hotPhis.computeIfAbsent(0L, z -> storage.hot.phi(new double[k], null))
                    : phiMemo.phi.computeIfAbsent(memoKey, z -> storage.cold.phi(a, lambda));
            for (int diff = -(nb - 1); diff <= nb - 1; diff++) {
                double room = (1 - diff) * binWidth - exact;
                dv[diff + nb - 1] = Math.max(base[diff + nb - 1],
                        second.leastDuration(room - paid, fLo, fHi, uMax) * (1 - 1e-12));
            }
            // (only where the first count's labels could lower the bin: elsewhere the second's, no lower, change nothing)
            landing(dv, d, arrival, nb, liveBins, live, tau, tauBottom, from * nb, top, land2Lo, land2Hi, landScratch,
                    pruneMoves ? landHelps : null);
            for (int mp = 0; mp <= top; mp++) {
                if (land2Lo[mp] >= landLo[mp] && land2Hi[mp] >= landHi[mp]) {
                    landLo[mp] = land2Lo[mp];
                    landHi[mp] = land2Hi[mp];
                }
            }
        }
        // out of the start the cap still rises and the bake is forced cool: the programme's φ would credit venting there
        // that the empty cavity cannot do; with nothing vented over [s, e] beyond what is made there and stored at the
        // end, each landing bin gets a flat bound (taken where it lies above the label's middle; either is valid)
        if (splitStart && i == 0) {
            // (level 0 has one live node, the start, with its labels at 0: every recipe starts its first move at t = 0)
            StoredGas.Phi phi = hotCorner ? hotPhis.computeIfAbsent(memoKey, z -> storage.hot.phi(a, null))
                    : storage.cold.phi(a, null);
            for (int mp = 0; mp <= top; mp++) {
                double e = splitArrival(phi, (mp + 1) * binWidth, hotCorner, fLo, fHi, uMax, topK);
                if (e > 0.5 * (landLo[mp] + landHi[mp])) {
                    landLo[mp] = e;
                    landHi[mp] = e;
                }
            }
        }
        for (int mp = 0; mp <= top; mp++) {
            int idx = to * nb + mp;
            next[idx] = Math.min(next[idx], landHi[mp]);
            nextBottom[idx] = Math.min(nextBottom[idx], landLo[mp]);
        }
    }

    /** How many cells of the other components' grids the programme has (their product). */
    int cells() {
        return cellCount;
    }

    /** After {@link #compute()}: per clock level, the earliest label of any node there (+∞ where none was reached). */
    double[] levelLeast() {
        return levelLeast == null ? new double[0] : levelLeast.clone();
    }

    /** The clock's conversion at level i. */
    double level(int i) {
        return levels[i];
    }

    private static double minOf(double[] v) {
        double m = Double.POSITIVE_INFINITY;
        for (double x : v) {
            m = Math.min(m, x);
        }
        return m;
    }

    /** Whether moves out of the start get the bound of {@link #splitArrival} (tests compare with it left out). */
    boolean splitStart = true;

    /**
     * A lower bound on when the first move (from the start, t = 0, where every recipe starts it) can end in a landing
     * bin whose top is {@code roomTop}, with no venting credited before the gas is there (docs/model.md, "Lower bounds",
     * 5, "Nothing vented before it is made"; derived here, no source). For any instant s within the move [0, e], the
     * stored gas at s is at least 0, so the gas made over [s, e] less what is vented over it is at most the stored gas
     * at the end, at most {@code roomTop}. Over [s, e] the clock still gains its reduced time less what the rising cap
     * allowed up to s (and, at the hot corner, makes its gas less what that allowed), so the move ends no sooner than s
     * plus the least duration of that remainder, nor than the cap allows from s. The bound holds for every s up to the
     * end, so the largest over a grid of s up to a bound already proved is again a bound; repeated until it stops
     * growing.
     */
    private double splitArrival(StoredGas.Phi phi, double roomTop, boolean hotCorner, double fLo, double fHi, double uMax,
                                double topK) {
        double e = 0;
        for (int iter = 0; iter < 12; iter++) {
            double grown = e;
            int n = e > 0 ? SPLIT_GRID : 0;
            for (int g = 0; g <= n; g++) {
                double s = n == 0 ? 0 : e * g / n;
                double gained = capped.gainedAtMost(0, s, topK);
                double fAfter = fLo - gained;
                if (!(fAfter > 0)) {
                    break;
                }
                double exactAfter = 0;
                if (hotCorner) {
                    double aMax = Math.min(levels[1], rt[q].conversionAtMost(rt[q].upper(levels[0]) + gained));
                    exactAfter = limits.gasifiable(q) * Math.max(0, levels[1] - aMax) * (1 - 1e-12);
                }
                double dAfter = phi.leastDuration(roomTop - exactAfter, fAfter, fHi, uMax) * (1 - 1e-12);
                grown = Math.max(grown, Math.max(s + dAfter, capped.arrival(s, topK, fAfter)));
            }
            boolean settled = !(grown > e + 1e-6) || !Double.isFinite(grown);
            e = grown;
            if (settled) {
                break;
            }
        }
        return e;
    }

    /** Instants per pass of {@link #splitArrival}. */
    private static final int SPLIT_GRID = 32;

    /**
     * The landing labels of a move from a node's live bins into bins 0..top (docs/model.md, "Lower bounds", 5): at each
     * landing bin's bottom ({@code lo}) and top ({@code hi}), the least over the sources of each source's affine lower
     * bound of the arrival. Source bin m's label runs from {@code bottom[offset + m]} at s_m to {@code topOf[offset + m]}
     * at s_{m+1}. {@code dur} holds the least duration at the bin differences (index nb − k for S' − S = k w), which with
     * the kinetic floor {@code d} gives D, falling and convex in S' − S (docs/model.md, "Lower bounds", 5: convex by
     * construction, so no sampled check is needed; the labels' deflation covers the samples' rounding).
     */
    static void landing(double[] dur, double d, double arrival, int nb, int[] liveBins, int live, double[] topOf,
                        double[] bottom, int offset, int top, double[] lo, double[] hi) {
        landing(dur, d, arrival, nb, liveBins, live, topOf, bottom, offset, top, lo, hi, new double[4][2 * nb - 1], null);
    }

    /** {@link #landing}, with scratch arrays (four of 2 nb − 1), for the landing bins in {@code only} (null: all). */
    private static void landing(double[] dur, double d, double arrival, int nb, int[] liveBins, int live, double[] topOf,
                                double[] bottom, int offset, int top, double[] lo, double[] hi, double[][] scratch,
                                boolean[] only) {
        for (int mp = 0; mp <= top; mp++) {
            lo[mp] = Double.POSITIVE_INFINITY;
            hi[mp] = Double.POSITIVE_INFINITY;
        }
        // per bin difference k0 = mp − m (index k0 + nb − 1): D at k0 + 1, and the two secants' parameters (NaN: not used)
        double[] d1s = scratch[0];
        double[] slopes = scratch[1];
        double[] dbs = scratch[2];
        double[] drops = scratch[3];
        for (int k0 = 1 - nb; k0 <= nb - 1; k0++) {
            int x = k0 + nb - 1;
            double d1 = durationAt(dur, d, nb, k0 + 1);
            d1s[x] = d1;
            slopes[x] = Double.NaN;
            if (k0 + 2 <= nb && d1 < Double.POSITIVE_INFINITY) {
                // the secant of D over [k0 + 1, k0 + 2], extended down to k0 − 1: below D there (convex)
                double slope = d1 - durationAt(dur, d, nb, k0 + 2);
                if (slope >= 0) {
                    slopes[x] = slope;
                }
            }
            drops[x] = Double.NaN;
            if (k0 - 2 >= 2 - nb) {
                // the secant of D over [k0 − 2, k0 − 1], extended up to k0 + 1: below D there (convex)
                double da = durationAt(dur, d, nb, k0 - 2);
                double db = durationAt(dur, d, nb, k0 - 1);
                double drop = da - db;
                if (da < Double.POSITIVE_INFINITY && drop >= 0) {
                    dbs[x] = db;
                    drops[x] = drop;
                }
            }
        }
        for (int l = 0; l < live; l++) {
            int m = liveBins[l];
            double r = topOf[offset + m];
            double b = bottom[offset + m];
            double rise = b - r;
            for (int mp = 0; mp <= top; mp++) {
                if (only != null && !only[mp]) {
                    continue;
                }
                int x = mp - m + nb - 1;
                // S = s_m + θw in the source bin, S' = s_mp + ηw in the landing bin: S' − S = (k0 + η − θ) w
                double d1 = d1s[x];
                // the most room (θ = 0, η = 1) and the earliest start (the source's top): a constant
                double bestLo = Math.max(r + d1, arrival);
                double bestHi = bestLo;
                double slope = slopes[x];
                if (slope == slope) {
                    // r + rise(1 − θ) + d1 + slope(1 − η + θ), least over θ ∈ [0, 1]
                    double g0 = slope >= rise ? b + d1 + slope : r + d1 + 2 * slope;
                    double g1 = g0 - slope;
                    g0 -= 1e-9 * Math.abs(g0);
                    g1 -= 1e-9 * Math.abs(g1);
                    if (g0 + g1 > bestLo + bestHi) {
                        bestLo = g0;
                        bestHi = g1;
                    }
                }
                double drop = drops[x];
                if (drop == drop) {
                    // r + rise(1 − θ) + db − drop(1 + η − θ), least over θ ∈ [0, 1]
                    double db = dbs[x];
                    double g0 = drop >= rise ? b + db - drop : r + db;
                    double g1 = g0 - drop;
                    g0 -= 1e-9 * Math.abs(g0);
                    g1 -= 1e-9 * Math.abs(g1);
                    if (g0 + g1 > bestLo + bestHi) {
                        bestLo = g0;
                        bestHi = g1;
                    }
                }
                if (bestLo < lo[mp]) {
                    lo[mp] = bestLo;
                }
                if (bestHi < hi[mp]) {
                    hi[mp] = bestHi;
                }
            }
        }
    }

    /** D at the bin difference k (S' − S = k w): the larger of the kinetic floor and the least duration with that room. */
    private static double durationAt(double[] dur, double d, int nb, int k) {
        return Math.max(d, dur[nb - Math.max(k, 2 - nb)]);
    }

    /** Per level: the least durations by bin difference, and the cold corner's second φ, by gas weights. */
    private static final class LevelMemo {
        final java.util.HashMap<Long, double[]> dv = new java.util.HashMap<>();
        final java.util.HashMap<Long, StoredGas.Phi> phi = new java.util.HashMap<>();
    }

    /** Whether moves that can lower no node are skipped (they change nothing; tests compare with them kept). */
    boolean pruneMoves = true;

    /** Scratch: the bins of a node not dominated by a lower one. */
    private int[] liveBins;
    /** Scratch: a move's landing labels, at each bin's bottom and top, by the first count and by the second. */
    private double[] landLo;
    private double[] landHi;
    private double[] land2Lo;
    private double[] land2Hi;
    private double[][] landScratch;
    private boolean[] landHelps;
    /** With stored gas: each node and bin's label at the bin's bottom (the top's is in τ), this level's and the next's. */
    private double[] tauBottom;
    private double[] nextBottom;
    /** The hot corner's φ by gas weights (they depend on the cells only), for every level. */
    private final java.util.HashMap<Long, StoredGas.Phi> hotPhis = new java.util.HashMap<>();

    private int encode(int[] idx) {
        int f = 0;
        for (int o = 0; o < idx.length; o++) {
            f += idx[o] * stride[o];
        }
        return f;
    }

    private void decode(int flat, int[] idx) {
        for (int o = idx.length - 1; o >= 0; o--) {
            idx[o] = flat / stride[o];
            flat -= idx[o] * stride[o];
        }
    }

    private double rho(int j, double temperatureK) {
        return comps[j].rateConstant(temperatureK) / comps[q].rateConstant(temperatureK);
    }

    /** The temperature at which ρ_j = x (ρ_j rises with T when E_j > E_q). */
    private double rhoInverse(int j, double x) {
        double de = comps[j].activationEnergyJPerMol() - comps[q].activationEnergyJPerMol();
        double ratio = comps[j].preExponentialPerS() / comps[q].preExponentialPerS();
        double l = Math.log(ratio / x);
        return l <= 0 ? Double.POSITIVE_INFINITY : de / (R * l) * (1 + 1e-12);
    }

    /** Whether other component o can get from cell c0 into cell c1 while the clock moves one level at all. */
    private boolean reachable(int i, int o, int c0, int c1, double fHi) {
        int j = others[o];
        double lo = Math.max(0, cellLo[o][c1] - cellHi[o][c0 + 1]);
        return lo <= rhoTop[o] * fHi * (1 + 1e-12);
    }

    private boolean capable(int i, int[] c, double fHi) {
        double u = w[q] * (1 - coldAtMost(q, levels[i + 1], rhoCold[q]));
        for (int o = 0; o < others.length; o++) {
            int j = others[o];
            double reach = cellHi[o][c[o] + 1] + rhoTop[o] * fHi;
            u += w[j] * (1 - coldAtMost(j, rt[j].conversionAtMost(reach), rhoCold[j]));
        }
        return u <= target;
    }

    /**
     * An upper bound on the cold corner's conversion when the hot corner's is at most a and the hot corner has
     * been no hotter than a temperature at which k_j(T)/k_j(T − 2ΔT) is {@code rho} (the ratio falls with T).
     */
    private double coldAtMost(int j, double a, double rho) {
        if (a >= 1) {
            return 1;
        }
        return rt[j].conversionAtMost(rt[j].upper(a) / rho);
    }

    /** Per level done: the hottest its moves could be (min with the hot ceiling), the clock's reduced time it spans (upper). */
    private final double[] levelHot;
    private final double[] levelSpan;
    /** The clock's cold reduced time gained over the levels before the current one (upper bound). */
    private double clockColdBefore;
    /** Per other component: the current level's weights 1/ρ_j and caps of hot reduced time, by weight descending. */
    private double[][] fillWeight;
    private double[][] fillCap;

    /**
     * The per-level accounts of the cold corner for level i, the current level's hot corner taken to be no hotter than
     * where ρ_j is rhoNow[j] (docs/model.md, "Lower bounds", 2).
     */
    private void coldTables(int i, double[] rhoNow) {
        double sum = 0;
        for (int l = 0; l < i; l++) {
            sum += levelSpan[l] / rhoColdAt(q, levelHot[l]);
        }
        clockColdBefore = sum * (1 + 1e-12);
        double spanNow = rt[q].upper(levels[i + 1]) - rt[q].lower(levels[i]);
        for (int o = 0; o < others.length; o++) {
            int j = others[o];
            double[][] rows = new double[i + 1][];
            for (int l = 0; l < i; l++) {
                rows[l] = new double[]{1 / rhoColdAt(j, levelHot[l]), rho(j, levelHot[l]) * levelSpan[l] * (1 + 1e-12)};
            }
            double hotNow = Math.min(hotCeilingK, currentHotMaxK);
            rows[i] = new double[]{1 / rhoNow[j], rho(j, hotNow) * spanNow * (1 + 1e-12)};
            Arrays.sort(rows, (x, y) -> Double.compare(y[0], x[0]));
            fillWeight[o] = new double[i + 1];
            fillCap[o] = new double[i + 1];
            for (int l = 0; l <= i; l++) {
                fillWeight[o][l] = rows[l][0];
                fillCap[o][l] = rows[l][1];
            }
        }
    }

    /** Per other component and grid point: its cold conversion bound in the current level's evaluation, and f there. */
    private double[][] hiColdCache;
    private double[][] hiColdF;
    /** Per other component and grid point: f at the cold corner's lower conversion bound. */
    private double[][] cellColdLoF;

    /**
     * f of other component o at the lower end of its cold conversions on a move from cell c into cell cp (the lower
     * bound from c's bottom, clipped to the upper bound from cp's top).
     */
    private double coldLowF(int o, int c, int cp) {
        return cellColdLo[o][c] <= hiColdCache[o][cp + 1] ? cellColdLoF[o][c] : hiColdF[o][cp + 1];
    }
    /** The bound taken for the current level's hot corner [K]. */
    private double currentHotMaxK;

    /** An upper bound on the clock's cold conversion while its hot conversion is at most b during level i. */
    private double clockColdAtMost(int i, double b, double rhoNowQ) {
        if (b >= 1) {
            return 1;
        }
        double v = clockColdBefore + Math.max(0, rt[q].upper(b) - rt[q].lower(levels[i])) / rhoNowQ;
        return rt[q].conversionAtMost(v * (1 + 1e-12));
    }

    /**
     * An upper bound on other component o's cold conversion while its hot conversion is at most a: its hot reduced time
     * (at most F(a)) was gained level by level, at most ρ_jq(hottest) times the clock's span on each, and each part gave
     * the cold corner at most 1/ρ_j(hottest) of itself; the largest total fills the levels of largest weight first.
     */
    private double otherColdAtMost(int o, double a) {
        if (a >= 1) {
            return 1;
        }
        int j = others[o];
        double x = rt[j].upper(a);
        double v = 0;
        double[] wts = fillWeight[o];
        double[] caps = fillCap[o];
        for (int l = 0; l < wts.length && x > 0; l++) {
            double take = Math.min(x, caps[l]);
            v += take * wts[l];
            x -= take;
        }
        // beyond every cap (no recipe gets there): the largest weight
        v += x * wts[0];
        return rt[j].conversionAtMost(v * (1 + 1e-12));
    }

    /** k_j(T)/k_j(T − 2ΔT), lowered against rounding (1 without spread). */
    private double rhoColdAt(int j, double hotK) {
        if (spread <= 0) {
            return 1;
        }
        double t = Math.min(hotK, hotCeilingK);
        return Math.max(1, comps[j].rateConstant(t) / comps[j].rateConstant(t - 2 * spread) * (1 - 1e-12));
    }

    /**
     * A lower bound on the cold corner's reduced time when the hot corner's is at least v (before the 2-day horizon):
     * the time the hot corner spends below T_s gains it at most HORIZON k_j(T_s); above T_s the cold corner gains at
     * least 1/ρ_j(T_s) of what the hot one gains. The best T_s of a 2 K grid is taken.
     */
    private double coldLeast(int j, double v) {
        if (!(v > 0) || spread <= 0) {
            return spread <= 0 ? Math.max(v, 0) : 0;
        }
        double bestLo = 0;
        for (double ts = floorK; ts <= hotCeilingK; ts += 2) {
            double lo = (v - HORIZON_S * comps[j].rateConstant(ts) * (1 + 1e-12)) / rhoColdAbove(j, ts);
            bestLo = Math.max(bestLo, lo * (1 - 1e-12));
        }
        return bestLo;
    }

    /** ρ_j at hot temperature T, raised against rounding. */
    private double rhoColdAbove(int j, double hotK) {
        return comps[j].rateConstant(hotK) / comps[j].rateConstant(hotK - 2 * spread) * (1 + 1e-12);
    }

    /** A lower bound on the cold corner's conversion when the hot corner's reduced time is at least v. */
    private double coldAtLeast(int j, double v) {
        return rt[j].conversionAtLeast(coldLeast(j, v));
    }

    private double duration(int[] c, int[] cp, double top, double fLo, double fHi) {
        double tStar = top;
        double eq = comps[q].activationEnergyJPerMol();
        for (int o = 0; o < others.length; o++) {
            int j = others[o];
            double thLo = Math.max(0, cellLo[o][cp[o]] - cellHi[o][c[o] + 1]);
            double thHi = cellHi[o][cp[o] + 1] - cellLo[o][c[o]];
            double xLo = thLo / fHi;
            double xHi = fLo > 0 ? thHi / fLo : Double.POSITIVE_INFINITY;
            double r = rho(j, top);
            if (comps[j].activationEnergyJPerMol() == eq) {
                if (xLo > r * (1 + 1e-12) || xHi < r * (1 - 1e-12)) {
                    return -1;
                }
                continue;
            }
            if (xLo > r * (1 + 1e-12)) {
                return -1;
            }
            if (xHi < r) {
                tStar = Math.min(tStar, rhoInverse(j, xHi));
            }
        }
        double kq = comps[q].rateConstant(tStar);
        return kq > 0 ? fLo / kq : (fLo > 0 ? Double.POSITIVE_INFINITY : 0);
    }

    /**
     * The highest hot-corner temperature at which the monotone limits hold with the least gas of the
     * move's box at the hot corner, and at the cold corner 2ΔT lower with the least gas its
     * conversions can give (between {@link #coldAtLeast} of the box's bottom and {@link #coldAtMost} of its
     * top), memoised by the cells the move leaves and enters.
     */
    private double admissible(int part, int[] c, int[] cp, double clockFloor, double clockColdFloor, double[] rhoNow,
                              java.util.HashMap<Long, Double> memo, java.util.HashMap<Long, Double> memoPrev) {
        if (storage != null) {
            // stored gas: the pressure limits enter through storage and venting; here only what holds with no gas
            if (Double.isNaN(hardK)) {
                double t = LowerBound.highestFeasible(temp -> margin(temp, new double[k], new double[k]), hotCeilingK,
                        floorK, Double.NaN);
                hardK = Double.isNaN(t) ? floorK : t;
            }
            return hardK;
        }
        // the floors depend on the grid point that gives the hot corner's least f, on whether the cold corner's least f is
        // at its lower end (then on the cell left) and on the cell entered
        long key = 0;
        for (int o = 0; o < others.length; o++) {
            int n = cells[o].length;
            int e = cellF[o][c[o]] <= cellF[o][cp[o] + 1] ? c[o] : cp[o] + 1;
            double fLoCold = coldLowF(o, c[o], cp[o]);
            int low = fLoCold < hiColdF[o][cp[o] + 1] ? c[o] : n;
            key = ((key * n + e) * (n + 1) + low) * n + (cp[o] + 1);
        }
        // spread the bits (a bijection: odd multiplier) so that the hash map's bins stay short
        key = (key * parts + part) * 0x9E3779B97F4A7C15L;
        Double m = memo.get(key);
        if (m != null) {
            return m;
        }
        double[] floors = new double[k];
        double[] coldFloors = new double[k];
        floors(c, cp, clockFloor, clockColdFloor, floors, coldFloors);
        Double g = memoPrev == null ? null : memoPrev.get(key);
        double t = LowerBound.highestFeasible(temp -> margin(temp, floors, coldFloors), hotCeilingK, floorK,
                g == null ? Double.NaN : g);
        if (Double.isNaN(t)) {
            t = floorK;
        }
        memo.put(key, t);
        return t;
    }

    private double margin(double hotK, double[] floors, double[] coldFloors) {
        evaluations++;
        for (int j = 0; j < k; j++) {
            gen[j] = limits.gasifiable(j) * comps[j].rateConstant(hotK) * floors[j];
        }
        double m = limits.monotoneMargin(hotK, gen);
        if (spread > 0) {
            double cold = hotK - 2 * spread;
            for (int j = 0; j < k; j++) {
                genCold[j] = limits.gasifiable(j) * comps[j].rateConstant(cold) * coldFloors[j];
            }
            m = Math.min(m, limits.monotoneMargin(cold, genCold));
        }
        return m;
    }
}
