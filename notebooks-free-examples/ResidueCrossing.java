// Reads the simulated history of the demo line case and finds when the unconverted polymer
// crossed 1 %, by linear interpolation between history rows, at every wafer corner; then compares
// it with the time the simulator located itself.
// Run from the project folder:  java -cp target/exhale.jar notebooks-free-examples/ResidueCrossing.java
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import org.exhale.Exhale;
import org.exhale.report.Cautions;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.CornerResult;

public class ResidueCrossing {
    public static void main(String[] args) {
        BakeResult r = Exhale.simulate(Exhale.loadCase(Path.of(args.length > 0 ? args[0] : "data/demo/porous-line.yaml")).bake());
        for (CornerResult c : r.corners()) {
            int time = c.column("time_s");
            int u = c.column("unconverted");
            int wafer = c.column("wafer_K");
            List<double[]> rows = c.history();
            double crossing = Double.NaN;
            double waferAt = Double.NaN;
            for (int i = 1; i < rows.size(); i++) {
                double[] a = rows.get(i - 1);
                double[] b = rows.get(i);
                if (a[u] > 0.01 && b[u] <= 0.01) {
                    double f = (a[u] - 0.01) / (a[u] - b[u]);
                    crossing = a[time] + f * (b[time] - a[time]);
                    waferAt = a[wafer] + f * (b[wafer] - a[wafer]) - 273.15;
                    break;
                }
            }
            System.out.println(String.format(Locale.ROOT,
                    "corner %-7s history rows %4d  residue crossed 1 %% at %7.1f s (%5.1f min, wafer %5.1f C); simulator: %7.1f s",
                    c.corner(), rows.size(), crossing, crossing / 60, waferAt, c.timeTo1pctS()));
        }
        System.out.println(String.format(Locale.ROOT, "whole wafer (slowest corner): %.1f min", r.timeTo1pctS() / 60));
        Cautions.BAKE.forEach(c -> System.out.println("Caution: " + c));
    }
}
