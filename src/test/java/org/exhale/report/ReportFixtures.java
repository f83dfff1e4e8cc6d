package org.exhale.report;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import javax.xml.XMLConstants;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;

import org.w3c.dom.Document;
import org.w3c.dom.NodeList;

/** Small output folders written by hand, shaped like those of exhale simulate and exhale fit. */
final class ReportFixtures {
    private ReportFixtures() {
    }

    static final String HOSTILE = "<script>alert(1)</script>";
    static final double R = 8.314462618;

    /** A bake folder: two corners, two components (one with a hostile name), cap mechanics. */
    static Path bake(Path dir, String caseName, String component, boolean mechanics) throws IOException {
        Files.createDirectories(dir);
        StringBuilder h = new StringBuilder("corner,time_s,setpoint_C,wafer_C,alpha_a,alpha_" + component
                + ",unconverted,excess_pressure_Pa,p_a_Pa,p_" + component + "_Pa,thermal_dose_s");
        if (mechanics) {
            h.append(",film_stress_Pa,bending_stress_Pa,membrane_stress_Pa,edge_stress_Pa,deflection_m,"
                    + "crack_release_J_m2,delamination_release_J_m2,compression_Pa");
        }
        h.append('\n');
        for (String corner : new String[]{"hot", "cold"}) {
            double off = corner.equals("hot") ? 2 : -2;
            for (int i = 0; i <= 60; i++) {
                double t = i * 60.0;
                double sp = Math.min(150 + 4 * i, 380) + off;
                double u = Math.exp(-Math.pow(i / 25.0, 3));
                double p = 1e5 * Math.exp(-Math.pow((i - 30) / 8.0, 2));
                h.append(String.format(Locale.ROOT, "%s,%.1f,%.3f,%.3f,%.6f,%.6f,%.6e,%.6e,%.6e,%.6e,%.3f", corner, t, sp,
                        sp - 0.5, 1 - u, 1 - u, u, p, 0.6 * p, 0.4 * p, t / 2));
                if (mechanics) {
                    h.append(String.format(Locale.ROOT, ",%.6e,%.6e,%.6e,%.6e,%.6e,%.6e,%.6e,0", 5e7, p * 1000, 0.0,
                            5e7 + p * 1000, p * 1e-11, 0.1 + p * 1e-5, 0.03 + p * 2e-6));
                }
                h.append('\n');
            }
        }
        Files.writeString(dir.resolve("history.csv"), h.toString());
        String mech = !mechanics ? "" : """
                    ,"strength" : {"allowed" : 3.0E8, "actual" : 1.5E8, "unit" : "Pa", "margin" : 2.0, "holds" : true,
                      "time_s" : 1800.0, "corner" : "hot", "dominant" : "bending"}
                    ,"cracking" : {"allowed" : 5.0, "actual" : 1.1, "unit" : "J/m2", "margin" : 4.5, "holds" : true,
                      "time_s" : 1800.0, "corner" : "hot", "dominant" : "bending"}
                    ,"delamination" : {"allowed" : 2.0, "actual" : 0.23, "unit" : "J/m2", "margin" : 8.7, "holds" : true,
                      "time_s" : 1800.0, "corner" : "hot", "dominant" : "bending"}
                    ,"buckling" : {"allowed" : 6.0E7, "actual" : 0.0, "unit" : "Pa", "margin" : null, "holds" : true,
                      "time_s" : 0.0, "corner" : "hot", "dominant" : "thermal"}
                    ,"deflection" : {"allowed" : 5.0E-6, "actual" : 1.0E-6, "unit" : "m", "margin" : 5.0, "holds" : true,
                      "time_s" : 1800.0, "corner" : "hot", "dominant" : "bending"}
                """;
        String json = """
                {
                  "case" : %s,
                  "peak_excess_pressure_Pa" : 100000.0,
                  "time_to_target_s" : 2900.0,
                  "final_unconverted" : 1.0E-7,
                  "max_wafer_temperature_C" : 381.5,
                  "gas_regime" : "full-gas",
                  "all_limits_met" : true,
                  "margins" : {
                    "ceiling" : {"allowed" : 400.0, "actual" : 382.0, "unit" : "C", "headroom_K" : 18.0, "holds" : true,
                      "time_s" : 3000.0, "corner" : "hot"},
                    "residue" : {"allowed" : 0.005, "actual" : 1.0E-7, "unit" : "", "margin" : 50000.0, "holds" : true,
                      "time_s" : 3600.0, "corner" : "cold"},
                    "pressure" : {"allowed" : 120000.0, "actual" : 100000.0, "unit" : "Pa", "margin" : 1.2, "holds" : true,
                      "time_s" : 1800.0, "corner" : "hot"}
                    %s
                  },
                  "corners" : [ {"corner" : "hot", "offset_K" : 2.0, "final_unconverted" : 1.0E-7},
                                {"corner" : "cold", "offset_K" : -2.0, "final_unconverted" : 2.0E-7} ],
                  "warnings" : [ %s ],
                  "cautions" : [ "Confirm every recipe on test wafers." ]
                }
                """.formatted(jsonString(caseName), mech, jsonString("warning about " + caseName));
        Files.writeString(dir.resolve("summary.json"), json);
        return dir;
    }

    /**
     * A fit folder: runs whose peak temperatures obey the Kissinger relation exactly for the given
     * Ea and A (solved by bisection), a conversion table and an isoconversional table.
     */
    static Path fit(Path dir, String runPrefix, double eaJPerMol, double aPerS) throws IOException {
        Files.createDirectories(dir);
        double[] rates = {2, 5, 10, 20};
        StringBuilder runs = new StringBuilder();
        StringBuilder fitCsv = new StringBuilder("run,time_s,temperature_K,alpha_measured,alpha_model,residual\n");
        for (int i = 0; i < rates.length; i++) {
            double tp = kissingerPeak(rates[i] / 60, eaJPerMol, aPerS);
            String label = runPrefix + i;
            runs.append(i > 0 ? "," : "").append(String.format(Locale.ROOT,
                    "{\"label\" : %s, \"heating_rate_K_min\" : %s, \"points\" : 100, \"peak_temperature_K\" : %s}",
                    jsonString(label), rates[i], tp));
            for (int k = 0; k < 100; k++) {
                double temp = tp - 60 + 1.2 * k;
                double model = 1 / (1 + Math.exp(-(temp - tp) / 8));
                double measured = model + 0.002 * Math.sin(k);
                fitCsv.append(String.format(Locale.ROOT, "\"%s\",%.1f,%.3f,%.6f,%.6f,%.3e%n", label.replace("\"", "\"\""),
                        k * 60.0, temp, measured, model, measured - model));
            }
        }
        Files.writeString(dir.resolve("fit.csv"), fitCsv.toString());
        StringBuilder iso = new StringBuilder("alpha,E_friedman_kJ_mol,E_friedman_ci_kJ_mol,E_kas_kJ_mol,E_kas_ci_kJ_mol\n");
        for (int k = 5; k <= 95; k += 5) {
            double a = k / 100.0;
            iso.append(String.format(Locale.ROOT, "%.2f,%.3f,%.3f,%.3f,%.3f%n", a, 150 + 25 * a, 3.0, 151 + 24 * a, 1.0));
        }
        Files.writeString(dir.resolve("isoconversional.csv"), iso.toString());
        Files.writeString(dir.resolve("fit.json"), """
                {
                  "runs" : [ %s ],
                  "kissinger" : {"Ea_kJ_mol" : %s, "Ea_ci_kJ_mol" : 2.0, "A_1_s" : %s, "lnA_ci" : 0.5, "confidence" : 0.95},
                  "model_fits" : [ {"components" : 1, "model" : "nth-order", "rms_alpha" : 0.002, "aic" : -100.0,
                    "bic" : -90.0, "confidence" : 0.95, "parts" : [ {"name" : "c1", "fraction" : 1.0, "fraction_ci" : 0.0,
                    "model" : "nth-order", "shape" : [1.0], "shape_ci" : [0.01], "Ea_kJ_mol" : 160.0,
                    "Ea_ci_kJ_mol" : 1.0, "A_1_s" : 1.0E12, "lnA_ci" : 0.1} ] } ],
                  "chosen_components" : 1,
                  "failures" : {},
                  "warnings" : [ "a warning from the fit" ],
                  "notes" : [ "a note" ]
                }
                """.formatted(runs, eaJPerMol / 1e3, aPerS));
        Files.writeString(dir.resolve("kinetics.yaml"), "polymer:\n  components: []\n");
        return dir;
    }

    /** Tp solving ln(β/Tp²) = ln(A R/E) − E/(R Tp) (Kissinger, Anal. Chem. 29 (1957) 1702), by bisection. */
    static double kissingerPeak(double betaKPerS, double e, double a) {
        double lo = 300;
        double hi = 1500;
        for (int i = 0; i < 200; i++) {
            double t = (lo + hi) / 2;
            double f = Math.log(betaKPerS / (t * t)) - Math.log(a * R / e) + e / (R * t);
            // f falls as t rises: positive means the peak lies higher
            if (f > 0) {
                lo = t;
            } else {
                hi = t;
            }
        }
        return (lo + hi) / 2;
    }

    static String jsonString(String s) {
        StringBuilder b = new StringBuilder("\"");
        for (char c : s.toCharArray()) {
            switch (c) {
                case '"' -> b.append("\\\"");
                case '\\' -> b.append("\\\\");
                default -> b.append(c);
            }
        }
        return b.append('"').toString();
    }

    /** Parses XML with a parser that fetches nothing (no DTD, no external entities). */
    static Document parseXml(String xml) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        f.setAttribute(XMLConstants.ACCESS_EXTERNAL_DTD, "");
        f.setAttribute(XMLConstants.ACCESS_EXTERNAL_SCHEMA, "");
        DocumentBuilder b = f.newDocumentBuilder();
        return b.parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
    }

    /** The text content of every text element of an SVG document. */
    static List<String> texts(Document svg) {
        NodeList n = svg.getElementsByTagNameNS("http://www.w3.org/2000/svg", "text");
        List<String> out = new ArrayList<>();
        for (int i = 0; i < n.getLength(); i++) {
            out.add(n.item(i).getTextContent());
        }
        return out;
    }
}
