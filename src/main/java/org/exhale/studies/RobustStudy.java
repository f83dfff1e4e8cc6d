package org.exhale.studies;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.function.Consumer;

import org.exhale.planning.PlanResult;
import org.exhale.planning.Planner;
import org.exhale.planning.Tool;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.Chamber;
import org.exhale.simulation.Limits;
import org.exhale.simulation.Margin;
import org.exhale.simulation.ThermalDose;

/**
 * A Monte Carlo robustness study of one recipe, and a planner that holds every limit at a chosen
 * quantile.
 *
 * <p>The robust planner: plan nominally; run the plan's recipe over the samples; for every limit
 * violated in more than a fraction 1 − q of the samples, tighten the limit the planner sees by
 * the sample distribution of its margin (a ratio limit's allowed value times the (1 − q)-quantile
 * of its margin, the ceiling lowered by the (1 − q)-quantile of its headroom's shortfall) and plan
 * again; repeat until every limit is met at the quantile. The same samples are used in every
 * round (common random numbers), so rounds differ only by the recipe.
 */
public final class RobustStudy {
    /** Most planning rounds of the robust planner. */
    public static final int MAX_ROUNDS = 8;
    /** A little more tightening than the samples ask for, so that the rounds converge from one side. */
    static final double EXTRA = 0.01;

    private RobustStudy() {
    }

    /** The limits a case reports, in the order of its nominal simulation. */
    public static List<String> limitNames(BakeCase withRecipe) {
        return BakeSimulator.simulate(withRecipe, MonteCarlo.SETTINGS).margins().stream().map(Margin::limit).toList();
    }

    /** The risk of one limit over the samples. */
    public record LimitRisk(String limit, boolean headroom, int violations, int n, double probability,
                            double standardError, double upper95IfNone, double marginMedian, double marginAtAlpha,
                            double marginToPass) {
    }

    /** Rank correlations of one parameter with the smallest slack, the time to target and each limit's slack. */
    public record Sensitivity(String parameter, double smallestMargin, double timeToTarget, double[] perLimit) {
    }

    /**
     * A study's figures.
     *
     * @param n             samples evaluated
     * @param risks         per limit
     * @param anyViolations samples violating at least one limit
     * @param p50S          median time to target [s] (+∞ when most samples do not reach it)
     * @param p95S          95th percentile [s]
     * @param pqS           the study's quantile [s]
     * @param notReached    samples that never reach the residue target
     * @param sensitivities ranked by |ρ| with the smallest slack, then with the time to target
     */
    public record Summary(int n, double quantile, List<LimitRisk> risks, int anyViolations, double p50S, double p95S,
                          double pqS, int notReached, List<Sensitivity> sensitivities, double[] timesToTargetS) {
        /**
         * Samples that reach the residue target after {@code checkpointS} (the end of the final hold) or never:
         * exactly those that violate the residue limit.
         */
        public int lateSamples(double checkpointS) {
            int late = 0;
            for (double t : timesToTargetS) {
                if (Double.isNaN(t) || t > checkpointS) {
                    late++;
                }
            }
            return late;
        }

        public double anyProbability() {
            return n == 0 ? Double.NaN : (double) anyViolations / n;
        }

        /** True when no limit is violated in more than a fraction 1 − q of the samples. */
        public boolean meetsQuantile() {
            return risks.stream().allMatch(r -> r.probability() <= 1 - quantile + 1e-12);
        }

        public LimitRisk risk(String limit) {
            return risks.stream().filter(r -> r.limit().equals(limit)).findFirst().orElse(null);
        }
    }

    /** Runs the samples of a case with its recipe; the runs are handed to {@code started} (for Ctrl-C). */
    public static List<MonteCarlo.Outcome> evaluate(BakeCase withRecipe, List<MonteCarlo.Parameter> ps, List<String> limits,
                                                    long seed, int n, int threads, ParallelRuns.Listener listener,
                                                    Consumer<ParallelRuns<MonteCarlo.Outcome>> started) {
        ParallelRuns<MonteCarlo.Outcome> runs = new ParallelRuns<>(n, threads,
                i -> MonteCarlo.run(withRecipe, ps, limits, seed, i));
        if (started != null) {
            started.accept(runs);
        }
        return runs.run(listener);
    }

    /** The figures of the outcomes done (null entries are skipped). */
    public static Summary summarize(List<MonteCarlo.Parameter> ps, List<String> limits, List<MonteCarlo.Outcome> all,
                                    double quantile) {
        List<MonteCarlo.Outcome> out = all.stream().filter(o -> o != null).toList();
        int n = out.size();
        double alpha = 1 - quantile;
        List<LimitRisk> risks = new ArrayList<>();
        for (int l = 0; l < limits.size(); l++) {
            int k = 0;
            double[] m = new double[n];
            for (int i = 0; i < n; i++) {
                if (!out.get(i).holds()[l]) {
                    k++;
                }
                m[i] = out.get(i).margins()[l];
            }
            boolean headroom = limits.get(l).equals("ceiling");
            risks.add(new LimitRisk(limits.get(l), headroom, k, n, n == 0 ? Double.NaN : (double) k / n,
                    SampleStatistics.binomialStandardError(k, n), k == 0 ? SampleStatistics.ruleOfThree(n) : Double.NaN,
                    SampleStatistics.quantile(m, 0.5), SampleStatistics.quantile(m, alpha), orderStatistic(m, alpha)));
        }
        int any = (int) out.stream().filter(o -> !o.feasible()).count();
        double[] t = out.stream().mapToDouble(MonteCarlo.Outcome::timeToTargetS).toArray();
        int notReached = (int) out.stream().filter(o -> Double.isNaN(o.timeToTargetS())).count();
        double[] smallest = out.stream().mapToDouble(MonteCarlo.Outcome::smallestSlack).toArray();
        List<Sensitivity> sens = new ArrayList<>();
        for (int p = 0; p < ps.size(); p++) {
            final int pp = p;
            double[] x = out.stream().mapToDouble(o -> o.values()[pp]).toArray();
            double[] per = new double[limits.size()];
            for (int l = 0; l < limits.size(); l++) {
                final int ll = l;
                per[l] = SampleStatistics.spearman(x, out.stream().mapToDouble(o -> o.margins()[ll]).toArray());
            }
            sens.add(new Sensitivity(ps.get(p).name(), SampleStatistics.spearman(x, smallest),
                    SampleStatistics.spearman(x, t), per));
        }
        sens.sort(Comparator.comparingDouble((Sensitivity s) -> Double.isNaN(s.smallestMargin()) ? -1 : -Math.abs(s.smallestMargin()))
                .thenComparingDouble(s -> Double.isNaN(s.timeToTarget()) ? 0 : -Math.abs(s.timeToTarget())));
        return new Summary(n, quantile, risks, any, SampleStatistics.quantile(t, 0.5), SampleStatistics.quantile(t, 0.95),
                SampleStatistics.quantile(t, quantile), notReached, sens, t.clone());
    }

    /**
     * The margin of the sample that must hold for at most a fraction α of the samples to fail: the
     * (⌊α n⌋ + 1)-th smallest. The interpolated quantile can lie above 1 while the count still fails.
     */
    static double orderStatistic(double[] margins, double alpha) {
        double[] m = java.util.Arrays.stream(margins).filter(v -> !Double.isNaN(v)).sorted().toArray();
        if (m.length == 0) {
            return Double.NaN;
        }
        int i = (int) Math.floor(alpha * m.length + 1e-12);
        return m[Math.min(i, m.length - 1)];
    }

    // ------------------------------------------------------------------ robust planning

    /**
     * One round of the robust planner.
     *
     * @param planningCase the nominal case with the limits the planner was given this round
     * @param plan         its plan
     * @param summary      the plan's recipe over the samples (with the case's own limits); null when infeasible
     * @param tightened    what was tightened for this round (empty for the nominal round)
     */
    public record Round(int round, BakeCase planningCase, PlanResult plan, Summary summary, List<MonteCarlo.Outcome> outcomes,
                        List<String> tightened) {
    }

    /**
     * The result of robust planning.
     *
     * @param rounds the rounds; the first is the nominal plan
     * @param met    the last round's recipe holds every limit at the quantile
     * @param note   why it stopped
     */
    public record RobustPlan(List<Round> rounds, boolean met, String note) {
        public Round nominal() {
            return rounds.get(0);
        }

        public Round last() {
            return rounds.get(rounds.size() - 1);
        }

        /** The robust recipe's extra time over the nominal plan [s]; NaN when not met. */
        public double costS() {
            return met ? last().plan().durationS() - nominal().plan().durationS() : Double.NaN;
        }
    }

    /** Evaluates a recipe over the samples; returns the outcomes (null entries when stopped early). */
    public interface Evaluator {
        List<MonteCarlo.Outcome> evaluate(BakeCase withRecipe, int round);
    }

    public static RobustPlan plan(BakeCase nominal, Tool tool, List<MonteCarlo.Parameter> ps, List<String> limits,
                                  double quantile, Evaluator evaluator, Consumer<RobustPlan> progress) {
        List<Round> rounds = new ArrayList<>();
        BakeCase planning = nominal;
        List<String> tightened = List.of();
        for (int round = 0; round < MAX_ROUNDS; round++) {
            PlanResult p = Planner.plan(planning, tool);
            if (!p.feasible()) {
                rounds.add(new Round(round, planning, p, null, List.of(), tightened));
                String why = p.infeasibility() == null ? "" : ": " + p.infeasibility().reason();
                return new RobustPlan(rounds, false, round == 0 ? "no nominal plan" + why
                        : "no recipe meets the tightened limits" + why);
            }
            List<MonteCarlo.Outcome> out = evaluator.evaluate(nominal.withRecipe(p.recipe()), round);
            Summary s = summarize(ps, limits, out, quantile);
            rounds.add(new Round(round, planning, p, s, out, tightened));
            if (progress != null) {
                progress.accept(new RobustPlan(List.copyOf(rounds), false, "in progress"));
            }
            if (out.stream().anyMatch(o -> o == null)) {
                return new RobustPlan(rounds, false, "stopped before the samples were done");
            }
            if (s.meetsQuantile()) {
                return new RobustPlan(rounds, true, round == 0 ? "the nominal plan already holds every limit at the quantile"
                        : "every limit holds at the quantile after " + round + " re-plan(s)");
            }
            List<String> what = new ArrayList<>();
            BakeCase next = tighten(nominal, planning, rounds.get(0).plan().verification(), p.verification(), s, what);
            if (next == null) {
                return new RobustPlan(rounds, false, what.get(what.size() - 1));
            }
            planning = next;
            tightened = what;
        }
        return new RobustPlan(rounds, false, "not met within " + MAX_ROUNDS + " rounds");
    }

    /**
     * The planning case with every limit violated too often tightened; null (with the reason as
     * the last entry of {@code what}) when such a limit cannot be tightened through the limits.
     *
     * <p>A ratio limit's samples are taken to scale with the nominal value: sample actual =
     * nominal actual · (nominal margin / sample margin). To bring the (1 − q)-quantile of the
     * margin m_α to 1, the recipe's nominal actual must fall by the factor m_α, so the planner is
     * given the allowed value (nominal actual of this round's recipe) · m_α. The ceiling likewise:
     * the nominal peak plus the (1 − q)-quantile of the headroom (negative), less half a kelvin.
     * The residue does not scale so (it decays exponentially with hold time), so its target is
     * multiplied by m_α from the current one. No limit is ever loosened from one round to the next.
     */
    static BakeCase tighten(BakeCase original, BakeCase b, BakeResult originalVerification, BakeResult verification,
                            Summary s, List<String> what) {
        double alpha = 1 - s.quantile();
        Limits l = b.limits();
        double ceiling = l.ceilingK();
        double residue = l.residue();
        double pmax = l.maxPressurePa();
        double sf = l.safetyFactor();
        double dmax = l.maxDeflectionM();
        ThermalDose dose = l.dose();
        Chamber ch = b.chamber();
        for (LimitRisk r : s.risks()) {
            if (r.probability() <= alpha + 1e-12) {
                continue;
            }
            Margin now = verification.margin(r.limit());
            Margin orig = originalVerification.margin(r.limit());
            if (now == null || orig == null) {
                what.add("'" + r.limit() + "' has no nominal value to tighten from");
                return null;
            }
            double m = r.marginAtAlpha() * (1 - EXTRA);
            // The allowed value for the planner as a fraction of the case's own.
            double f = now.actual() * m / orig.allowed();
            switch (r.limit()) {
                case "ceiling" -> {
                    double c = now.actual() + r.marginAtAlpha() - 0.5;
                    if (c < ceiling) {
                        what.add("ceiling " + round(c - org.exhale.PhysicalConstants.ZERO_CELSIUS_K) + " C");
                        ceiling = c;
                    }
                }
                case "residue" -> {
                    // the residue decays with hold time rather than scaling with the recipe, and the samples'
                    // spread grows with it: tighten by the sample that must pass (not the interpolated quantile)
                    // (a slower sample's residue falls more slowly than the nominal one's as the hold grows: its
                    // shortfall is squared, and at least 10 % is taken off, so the rounds do not stall on the
                    // tool's time step)
                    double pass = r.marginToPass();
                    residue *= Math.min(Math.min(m, pass * pass), 0.9);
                    what.add("residue target " + round(residue * 100) + " %");
                }
                case "pressure" -> {
                    pmax = Math.min(pmax, original.limits().maxPressurePa() * f);
                    what.add("max_pressure " + round(pmax / 1e3) + " kPa");
                }
                case "deflection" -> {
                    dmax = Math.min(dmax, original.limits().maxDeflectionM() * f);
                    what.add("max_deflection " + round(dmax * 1e9) + " nm");
                }
                case "thermal_dose" -> {
                    double max = Math.min(dose.maxS(), original.limits().dose().maxS() * f);
                    dose = new ThermalDose(dose.activationEnergyJPerMol(), dose.referenceK(), max);
                    what.add("thermal dose max " + round(max) + " s");
                }
                case "chamber" -> {
                    double lim = Math.min(ch.limitFraction(), original.chamber().limitFraction() * f);
                    ch = new Chamber(ch.wafers(), ch.waferDiameterM(), ch.patternFraction(), ch.cavityFraction(),
                            ch.volumeM3(), ch.temperatureK(), ch.pressurePa(), ch.purgeMolPerS(), lim, ch.limitLabel());
                    what.add("chamber limit " + round(lim * 1e6) + " ppm");
                }
                case "strength", "cracking", "delamination" -> {
                    sf = Math.max(sf, original.limits().safetyFactor() / f);
                    what.add("safety factor " + round(sf) + " (for " + r.limit() + ")");
                }
                default -> {
                    what.add("'" + r.limit() + "' is violated in " + round(r.probability() * 100) + " % of the samples and "
                            + "cannot be tightened through the limits the planner holds");
                    return null;
                }
            }
        }
        if (sf >= 100) {
            what.add("the safety factor would reach " + round(sf) + ": the cap's strength limits cannot be held at this quantile");
            return null;
        }
        try {
            BakeCase out = b.withLimits(new Limits(ceiling, residue, pmax, dose, sf, dmax));
            return ch == null ? out : out.withChamber(ch);
        } catch (IllegalArgumentException e) {
            what.add("the tightened limits are out of range: " + e.getMessage());
            return null;
        }
    }

    private static String round(double v) {
        return org.exhale.io.Numbers.sig(v, 3);
    }

    /** The nominal result of a recipe (for reports). */
    public static BakeResult nominal(BakeCase withRecipe) {
        return BakeSimulator.simulate(withRecipe, MonteCarlo.SETTINGS);
    }
}
