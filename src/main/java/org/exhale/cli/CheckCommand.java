package org.exhale.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.exhale.PhysicalConstants;
import org.exhale.io.CaseEcho;
import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;
import org.exhale.report.Cautions;
import org.exhale.simulation.BakeSimulator;
import org.exhale.studies.CaseDiagnostics;
import org.exhale.studies.CaseDiagnostics.CaseDiagnosis;
import org.exhale.studies.CaseDiagnostics.Mechanics;
import org.exhale.studies.CaseDiagnostics.ProductTransport;
import org.exhale.studies.CaseDiagnostics.TransportAt;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code exhale check}: validates a case without simulating and prints what an engineer judges it by. */
@Command(name = "check", mixinStandardHelpOptions = true,
        header = "Validate a case file without simulating and show the figures to judge it by.",
        description = {"Reads the case as 'simulate' would and prints every value as given and in SI units, the "
                + "defaults that were filled in, the warnings, and derived figures: mean free path and Knudsen "
                + "number in the pores, Knudsen, molecular and effective diffusivities and the permeance of every "
                + "product, the gas relaxation time under the cap and the gas regime to expect, the polymer load, "
                + "the cap's buckling and thermal-mismatch stresses, and where each component starts to decompose.",
                "Exit 0 when the case is valid, 2 when it is not (the message names the file, key and line)."})
final class CheckCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "CASE", description = "Case file (YAML).")
    Path casePath;

    @Option(names = "--values", negatable = true, defaultValue = "true", fallbackValue = "true",
            description = "List every value as given and in SI (default: on; --no-values to leave it out).")
    boolean values;

    @Option(names = "--debug", description = "Print stack traces of errors.")
    boolean debug;

    @Spec
    CommandSpec spec;

    private static final double C0 = PhysicalConstants.ZERO_CELSIUS_K;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        CaseFile cf = CaseYamlReader.read(casePath);
        CaseDiagnosis d = CaseDiagnostics.diagnose(cf.bake());
        out.println("Case " + casePath + (cf.bake().name().isEmpty() ? "" : " (" + cf.bake().name() + ")")
                + ": valid" + (cf.bake().recipe() == null ? ", no recipe (plan one, or add one to simulate)" : ""));
        if (values) {
            printValues(out);
        }
        out.println();
        out.println("Defaults filled in:" + (cf.defaults().isEmpty() ? " none" : ""));
        cf.defaults().forEach(s -> out.println("  " + s));
        out.println("Warnings:" + (cf.warnings().isEmpty() ? " none" : ""));
        cf.warnings().forEach(s -> out.println("  warning: " + s));
        out.println();
        printDiagnosis(out, d, cf);
        out.println();
        out.println(Cautions.terminal(cf.bake().chamber() != null));
        out.flush();
        return Main.OK;
    }

    private void printValues(PrintWriter out) {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(casePath);
        } catch (IOException e) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, casePath.toString(), "", 0, "cannot read: " + org.exhale.io.Messages.of(e));
        }
        List<CaseEcho.Entry> entries = CaseEcho.entries(bytes);
        out.println();
        out.println("Values as understood (as given = SI):");
        int width = entries.stream().mapToInt(e -> e.path().length()).max().orElse(10);
        int gw = Math.min(28, entries.stream().mapToInt(e -> e.given().length()).max().orElse(10));
        for (CaseEcho.Entry e : entries) {
            String si = e.kind() == null ? "" : "= " + g(e.si(), 6) + (e.siUnit().isEmpty() ? "" : " " + e.siUnit());
            out.println(String.format(Locale.ROOT, "  %-" + width + "s  %-" + gw + "s  %s", e.path(), e.given(), si)
                    .stripTrailing());
        }
    }

    static void printDiagnosis(PrintWriter out, CaseDiagnosis d, CaseFile cf) {
        out.println("Derived figures (no simulation):");
        boolean vacuum = d.ambientPressurePa() == 0;
        out.println("  Ambient gas taken as nitrogen, collision diameter " + sig(d.ambientDiameterM() * 1e9)
                + " nm; it gives a mean free path of 66.8 nm for air at 25 °C and 1 atm, against 66.5 nm measured (Jennings 1988).");
        if (vacuum) {
            out.println("  Vacuum: no ambient gas, mean free path unbounded, no molecular diffusion.");
        } else {
            out.println("  Mean free path of the ambient gas at " + sig(d.ambientPressurePa() / 1e3) + " kPa: "
                    + sig(d.meanFreePathRoomM() * 1e9) + " nm at 25 C, " + sig(d.meanFreePathCeilingM() * 1e9)
                    + " nm at the ceiling " + c(d.ceilingK()) + "   [lambda = kT/(sqrt2 pi d^2 p)]");
        }
        if (Double.isNaN(d.knudsenRoom())) {
            out.println("  Dense cap (porosity 0): no pores; gas leaves by permeation through the solid only.");
        } else {
            out.println("  Knudsen number in the pores, lambda/(2 r_p): " + sig(d.knudsenRoom()) + " at 25 C, "
                    + sig(d.knudsenCeiling()) + " at the ceiling (" + regime(d.knudsenCeiling()) + ")");
        }
        out.println("  Initial polymer load m0 = rho d: " + sig(d.initialLoadKgPerM2()) + " kg/m2 ("
                + sig(d.initialLoadKgPerM2() * 1e5) + " ug/cm2)");
        out.println("  Gas volume under the cap per area: " + sig(d.initialGasVolumeM3PerM2()) + " m3/m2 at the start, "
                + sig(d.freedGasVolumeM3PerM2()) + " m3/m2 once the polymer is gone");
        for (ProductTransport p : d.products()) {
            out.println("  Product of '" + p.component() + "' (" + sig(p.molarMassKgPerMol() * 1e3) + " g/mol, "
                    + sig(p.kineticDiameterM() * 1e9) + " nm)" + (Double.isNaN(d.knudsenRoom()) ? ""
                    : ": steric factor (1 - sigma/(2 r_p))^2 = " + sig(p.stericFactor())));
            out.println("    permeation through the solid: Pi0 " + sig(p.permeabilityPi0()) + " mol/(m s Pa), Ea "
                    + sig(p.permeationActivationJPerMol() / 1e3) + " kJ/mol ("
                    + (p.ownPermeability() ? "its own, product.permeability" : "the cap's, cap.permeability") + ")");
            out.println(String.format(Locale.ROOT, "    %-8s %9s %11s %11s %11s %11s %13s %13s %11s", "at", "T [C]",
                    "D_K [m2/s]", "D_m [m2/s]", "D_pore", "D_eff", "Pi/h", "K [mol/m2sPa]", "tau_g [s]"));
            for (TransportAt t : p.at()) {
                out.println(String.format(Locale.ROOT, "    %-8s %9s %11s %11s %11s %11s %13s %13s %11s", t.label(),
                        Numbers4.fixed1(t.temperatureK() - C0), sig(t.knudsenM2PerS()), sig(t.molecularM2PerS()),
                        sig(t.poreM2PerS()), sig(t.effectiveM2PerS()), sig(t.solidPermeance()), sig(t.permeance()),
                        sig(t.relaxationTimeS())));
            }
        }
        out.println("    (D_m inf: vacuum; Pi/h: permeance through the solid, K = D_eff/(R T h) + Pi/h; tau_g = V_g/(R T K) "
                + "with the freed cavity, the longest; viscous flow left out)");
        for (CaseDiagnostics.Onset o : d.onsets()) {
            out.println("  Component '" + o.component() + "' reaches k = 1e-3 1/s at " + c(o.temperatureK())
                    + (o.temperatureK() > d.ceilingK() ? "  -- above the ceiling: it will hardly decompose" : ""));
        }
        out.println("  Expected gas regime: " + d.expectedRegime().label() + " (largest tau_g at onset x 1e-3 1/s = "
                + sig(d.regimeIndicator()) + ", threshold " + sig(BakeSimulator.QUASI_STEADY_ERROR)
                + "); 'simulate' decides along the actual recipe");
        Mechanics m = d.mechanics();
        if (m == null) {
            out.println("  Cap mechanics: not given (no youngs_modulus etc.); stresses are not checked.");
        } else {
            out.println("  Cap: plane-strain modulus " + sig(m.planeStrainModulusPa() / 1e9) + " GPa; buckling stress of "
                    + "the freed cap " + sig(m.bucklingStressPa() / 1e6) + " MPa");
            out.println("  Thermal-mismatch stress (tension positive): " + mpa(m.thermalStressRoomPa()) + " at 25 C, "
                    + (Double.isNaN(m.thermalStressStartPa()) ? "" : mpa(m.thermalStressStartPa()) + " at the start "
                    + c(d.startK()) + ", ") + mpa(m.thermalStressCeilingPa()) + " at the ceiling");
            for (double s : new double[] {m.thermalStressStartPa(), m.thermalStressCeilingPa()}) {
                if (Mechanics.buckles(s, m.bucklingStressPa())) {
                    out.println("  warning: the freed cap is compressed beyond its buckling stress ("
                            + mpa(s) + " against -" + sig(m.bucklingStressPa() / 1e6) + " MPa)");
                    break;
                }
            }
        }
    }

    private static String regime(double kn) {
        // Usual bounds of the flow regimes (common practice, no source).
        if (kn > 10) {
            return "Knudsen diffusion dominates";
        }
        return kn > 0.1 ? "transition: Knudsen and molecular diffusion both count" : "molecular diffusion dominates";
    }

    private static String mpa(double pa) {
        return sig(pa / 1e6) + " MPa";
    }

    private static String c(double k) {
        return Numbers4.fixed1(k - C0) + " C";
    }

    private static String sig(double v) {
        return g(v, 4);
    }

    /** v to the given significant digits, trailing zeros dropped, exponent without padding (1.5e-9, 1150, inf). */
    static String g(double v, int digits) {
        if (!Double.isFinite(v)) {
            return Double.isNaN(v) ? "n/a" : v > 0 ? "inf" : "-inf";
        }
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        String s = a >= 1e-3 && a < 1e6 ? String.format(Locale.ROOT, "%." + digits + "g", v)
                : String.format(Locale.ROOT, "%." + (digits - 1) + "e", v);
        String mantissa = s;
        String exponent = "";
        int e = s.indexOf('e');
        if (e >= 0) {
            mantissa = s.substring(0, e);
            exponent = "e" + Integer.parseInt(s.substring(e + 1).replace("+", ""));
        }
        if (mantissa.contains(".")) {
            mantissa = mantissa.replaceFirst("0+$", "").replaceFirst("\\.$", "");
        }
        return mantissa + exponent;
    }

    private static final class Numbers4 {
        static String fixed1(double v) {
            return org.exhale.io.Numbers.fixed(v, 1);
        }
    }
}
