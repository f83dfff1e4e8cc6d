package org.exhale.io;

import java.util.Locale;
import org.exhale.fitting.ModelFitResult;
import org.exhale.fitting.RunFit;

/** Measured against model conversion: {@code run,time_s,temperature_K,alpha_measured,alpha_model,residual}. */
public final class FitCsvWriter {
    private FitCsvWriter() {
    }

    public static String format(ModelFitResult fit) {
        StringBuilder sb = new StringBuilder("run,time_s,temperature_K,alpha_measured,alpha_model,residual\n");
        for (RunFit r : fit.runs()) {
            double[] t = r.timeS(), temp = r.temperatureK(), a = r.measured(), m = r.model();
            String label = r.label().replace(',', '_');
            for (int i = 0; i < t.length; i++) {
                sb.append(label).append(',').append(String.format(Locale.ROOT, "%.3f,%.4f,%.6f,%.6f,%.3e",
                        t[i], temp[i], a[i], m[i], a[i] - m[i])).append('\n');
            }
        }
        return sb.toString();
    }
}
