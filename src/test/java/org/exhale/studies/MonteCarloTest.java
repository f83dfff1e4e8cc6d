package org.exhale.studies;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.apache.commons.math3.special.Erf;
import org.exhale.PhysicalConstants;
import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.Wafer;
import org.junit.jupiter.api.Test;

class MonteCarloTest {
    static final double C0 = PhysicalConstants.ZERO_CELSIUS_K;

    /**
     * Only the across-wafer spread is uncertain, the wafer has no lag and the recipe peaks at
     * 390 C under a 400 C ceiling: the hot corner breaks the ceiling exactly when the spread
     * exceeds 10 K. With spread ~ N(8 K, 2 K) that is P = 1 − Φ(1). The estimate must lie within
     * four binomial standard errors of it (the binomial standard error, common practice; Φ from the
     * error function, Φ(x) = (1 + erf(x/√2))/2). Truncation at 0 K removes Φ(−4) ≈ 3e-5 of the
     * distribution, far below the tolerance.
     */
    @Test
    void ceilingViolationProbabilityMatchesNormalTail() {
        CaseFile cf = CaseYamlReader.read(Path.of("data/demo/porous-line.yaml"));
        Recipe r = new Recipe(150 + C0, List.of(new Step.Ramp(390 + C0, 10 / 60.0), new Step.Hold(300)));
        BakeCase b = cf.bake().withWafer(new Wafer(0, 8)).withRecipe(r);
        Uncertainty u = new Uncertainty(Uncertainty.Kinetics.NONE, Map.of(), 0, 0, 0, 0, 2, 0, 0, 0);
        List<MonteCarlo.Parameter> ps = MonteCarlo.parameters(b, u);
        assertEquals(1, ps.size());
        List<String> limits = RobustStudy.limitNames(b);
        int n = 400;
        List<MonteCarlo.Outcome> out = RobustStudy.evaluate(b, ps, limits, 20240611L, n, 2, null, null);
        int ceiling = limits.indexOf("ceiling");
        for (MonteCarlo.Outcome o : out) {
            // The headroom is 10 K less the sampled spread, exactly (no lag).
            assertEquals(10 - o.values()[0], o.margins()[ceiling], 1e-6);
        }
        RobustStudy.Summary s = RobustStudy.summarize(ps, limits, out, 0.95);
        double p = 1 - 0.5 * (1 + Erf.erf(1 / Math.sqrt(2)));
        double se = Math.sqrt(p * (1 - p) / n);
        double est = s.risk("ceiling").probability();
        assertTrue(Math.abs(est - p) < 4 * se, "estimated " + est + ", closed form " + p + ", 4 s.e. " + 4 * se);
        assertEquals(Math.sqrt(est * (1 - est) / n), s.risk("ceiling").standardError(), 1e-15);
        // Spread is the only uncertain value, and the ceiling is the tightest limit: a perfect negative rank correlation.
        assertEquals(-1, s.sensitivities().get(0).perLimit()[ceiling], 1e-12);
    }

    /** Identical samples and results with one and with three threads (common practice, no source). */
    @Test
    void sameSeedSameResultsWhateverTheThreads() {
        CaseFile cf = CaseYamlReader.read(Path.of("data/demo/porous-line-uncertain.yaml"));
        BakeCase b = cf.bake();
        List<MonteCarlo.Parameter> ps = MonteCarlo.parameters(b, cf.uncertainty());
        assertEquals(9, ps.size());
        List<String> limits = RobustStudy.limitNames(b);
        List<MonteCarlo.Outcome> one = RobustStudy.evaluate(b, ps, limits, 7, 12, 1, null, null);
        List<MonteCarlo.Outcome> three = RobustStudy.evaluate(b, ps, limits, 7, 12, 3, null, null);
        for (int i = 0; i < 12; i++) {
            assertArrayEquals(one.get(i).values(), three.get(i).values());
            assertArrayEquals(one.get(i).margins(), three.get(i).margins());
            assertEquals(one.get(i).timeToTargetS(), three.get(i).timeToTargetS());
        }
        double[] other = MonteCarlo.draw(ps, 8, 0);
        assertFalse(java.util.Arrays.equals(other, one.get(0).values()));
        // A sample's draw of one value does not depend on which other values are uncertain.
        Uncertainty spreadOnly = new Uncertainty(Uncertainty.Kinetics.NONE, Map.of(), 0, 0, 0, 0,
                cf.uncertainty().spreadSdK(), 0, 0, 0);
        double alone = MonteCarlo.draw(MonteCarlo.parameters(b, spreadOnly), 7, 5)[0];
        int spread = ps.stream().map(MonteCarlo.Parameter::name).toList().indexOf("spread_K");
        assertEquals(one.get(5).values()[spread], alone);
    }

    /**
     * Sample moments of the truncated draws: mean and standard deviation of 20 000 draws of a
     * value far from its range ends are within 4 standard errors of the nominal ones (standard
     * error of the mean σ/√n, of the standard deviation ≈ σ/√(2n); common practice). Correlated
     * kinetics: the sample correlation of Ea and ln A is within 0.03 of the one asked for.
     */
    @Test
    void drawsHaveTheirMomentsAndCorrelation() {
        CaseFile cf = CaseYamlReader.read(Path.of("data/demo/porous-line-uncertain.yaml"));
        List<MonteCarlo.Parameter> ps = MonteCarlo.parameters(cf.bake(), cf.uncertainty());
        int n = 20_000;
        double[][] x = new double[ps.size()][n];
        for (int i = 0; i < n; i++) {
            double[] v = MonteCarlo.draw(ps, 3, i);
            for (int p = 0; p < ps.size(); p++) {
                x[p][i] = v[p];
            }
        }
        int ea = 0;
        assertEquals("Ea[backbone]_kJ_per_mol", ps.get(ea).name());
        double mean = java.util.Arrays.stream(x[ea]).average().orElseThrow();
        double sd = Math.sqrt(java.util.Arrays.stream(x[ea]).map(v -> (v - mean) * (v - mean)).sum() / (n - 1));
        assertEquals(ps.get(ea).nominal(), mean, 4 * ps.get(ea).sd() / Math.sqrt(n));
        assertEquals(ps.get(ea).sd(), sd, 4 * ps.get(ea).sd() / Math.sqrt(2.0 * n));
        assertEquals(0.9, SampleStatistics.pearson(x[0], x[1]), 0.03);
        // Independent values are uncorrelated: |r| below 4/√n.
        assertTrue(Math.abs(SampleStatistics.pearson(x[0], x[4])) < 4 / Math.sqrt(n));
        for (double v : x[4]) {
            assertTrue(v > 0 && v < 0.999);
        }
        assertNotEquals(x[0][0], x[0][1]);
    }
}
