package org.exhale.simulation;

import org.junit.jupiter.api.Test;

class SmokeTest {
    @Test
    void runsBothDemos() {
        for (BakeCase c : new BakeCase[]{TestCases.porousLine(), TestCases.denseDisc()}) {
            long t0 = System.nanoTime();
            BakeResult r = BakeSimulator.simulate(c);
            long t1 = System.nanoTime();
            CornerResult cr = r.corners().get(0);
            System.out.printf("%s: regime %s qsErr %.3g peak %.6g Pa at %.1f s, t1%% %.1f, target %.1f, final u %.3g, dose %.1f, mb %.3g, evals %d, relax max %.3g s, %.1f ms%n",
                    c.name(), cr.regime(), cr.quasiSteadyError(), cr.peakPressure().value(), cr.peakPressure().timeS(),
                    cr.timeTo1pctS(), cr.timeToTargetS(), cr.finalUnconverted(), cr.thermalDoseS(), cr.massBalanceError(),
                    cr.evaluations(), cr.max("relaxation_time_s").value(), (t1 - t0) / 1e6);
            r.margins().forEach(m -> System.out.println("  " + m));
        }
    }
}
