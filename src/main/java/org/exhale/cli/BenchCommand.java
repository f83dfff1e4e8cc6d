package org.exhale.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.function.Supplier;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.planning.LowerBound;
import org.exhale.planning.PlanResult;
import org.exhale.planning.Planner;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeSimulator;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

@Command(name = "bench", mixinStandardHelpOptions = true,
        header = "Measure simulation, planning and lower-bound speed on the demo and bench cases.",
        description = {"Times, side by side in one run, one simulation of each demo case (with and without the cap "
                + "mechanics) and one plan of each, after a warm-up; prints the median, the quartiles and the ratios. "
                + "Then the lower bounds of the demo cases and of the bench cases (data/bench), each marked rigorous or "
                + "an estimate for the case's gas regime, with the median time to compute them; the plans' quality "
                + "(bound, ride, plan); and 'exhale plan' on each demo case in fresh JVMs, for the wall time a user sees. "
                + "The machines are noisy: compare figures from one run only."})
final class BenchCommand implements Callable<Integer> {
    @Option(names = "--data", paramLabel = "DIR", defaultValue = "data/demo", description = "Folder of the demo cases.")
    Path data;

    @Option(names = "--bench-data", paramLabel = "DIR", defaultValue = "data/bench",
            description = "Folder of further planning cases: their lower bounds are timed, and plan, ride and bound are reported for each (default ${DEFAULT-VALUE}).")
    Path benchData;

    @Option(names = "--repeats", defaultValue = "30", description = "Timed repetitions of each simulation (default ${DEFAULT-VALUE}).")
    int repeats;

    @Option(names = "--plan-repeats", defaultValue = "5", description = "Timed repetitions of each plan (default ${DEFAULT-VALUE}).")
    int planRepeats;

    @Option(names = "--bound-repeats", defaultValue = "5", description = "Timed repetitions of each lower bound (default ${DEFAULT-VALUE}).")
    int boundRepeats;

    @Option(names = "--cold-repeats", defaultValue = "5",
            description = "Runs of 'exhale plan' on each demo case in a fresh JVM, as the launcher target/exhale runs it and with this JVM's options, interleaved, for the wall time with the JVM's start (0 for none; default ${DEFAULT-VALUE}).")
    int coldRepeats;

    @Override
    public Integer call() {
        CaseFile porous = CaseYamlReader.read(data.resolve("porous-line.yaml"));
        CaseFile dense = CaseYamlReader.read(data.resolve("dense-disc.yaml"));
        Map<String, Supplier<Object>> sims = new LinkedHashMap<>();
        sims.put("simulate porous-line (quasi-steady)", () -> BakeSimulator.simulate(porous.bake()));
        sims.put("simulate porous-line without mechanics", () -> BakeSimulator.simulate(noMechanics(porous.bake())));
        sims.put("simulate dense-disc (full gas)", () -> BakeSimulator.simulate(dense.bake()));
        sims.put("simulate dense-disc without mechanics", () -> BakeSimulator.simulate(noMechanics(dense.bake())));
        Map<String, Supplier<Object>> plans = new LinkedHashMap<>();
        plans.put("plan porous-line", () -> Planner.plan(porous.bake(), porous.tool()));
        plans.put("plan dense-disc", () -> Planner.plan(dense.bake(), dense.tool()));
        Map<String, CaseFile> planCases = new LinkedHashMap<>();
        planCases.put("porous-line", porous);
        planCases.put("dense-disc", dense);
        if (java.nio.file.Files.isDirectory(benchData)) {
            try (var files = java.nio.file.Files.list(benchData)) {
                for (Path f : files.filter(f -> f.toString().endsWith(".yaml")).sorted().toList()) {
                    CaseFile cf = CaseYamlReader.read(f);
                    String name = f.getFileName().toString().replaceFirst("\\.yaml$", "");
                    planCases.put(name, cf);
                    plans.put("plan " + name, () -> Planner.plan(cf.bake(), cf.tool()));
                }
            } catch (java.io.IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        }

        // warm-up, interleaved
        for (int i = 0; i < 20; i++) {
            sims.values().forEach(Supplier::get);
        }
        plans.values().forEach(Supplier::get);
        Map<String, double[]> times = new LinkedHashMap<>();
        sims.keySet().forEach(k -> times.put(k, new double[repeats]));
        for (int i = 0; i < repeats; i++) {
            for (Map.Entry<String, Supplier<Object>> e : sims.entrySet()) {
                times.get(e.getKey())[i] = time(e.getValue());
            }
        }
        plans.keySet().forEach(k -> times.put(k, new double[planRepeats]));
        for (int i = 0; i < planRepeats; i++) {
            for (Map.Entry<String, Supplier<Object>> e : plans.entrySet()) {
                times.get(e.getKey())[i] = time(e.getValue());
            }
        }
        System.out.printf(Locale.ROOT, "%-42s %10s %10s %10s%n", "benchmark (ms, warm, one thread)", "median", "q1", "q3");
        Map<String, Double> med = new LinkedHashMap<>();
        for (Map.Entry<String, double[]> e : times.entrySet()) {
            double[] t = e.getValue().clone();
            Arrays.sort(t);
            med.put(e.getKey(), quantile(t, 0.5));
            System.out.printf(Locale.ROOT, "%-42s %10.2f %10.2f %10.2f%n", e.getKey(), quantile(t, 0.5), quantile(t, 0.25),
                    quantile(t, 0.75));
        }
        List<String> ratios = new ArrayList<>();
        ratios.add(String.format(Locale.ROOT, "mechanics cost, porous-line: %.2fx", med.get("simulate porous-line (quasi-steady)")
                / med.get("simulate porous-line without mechanics")));
        ratios.add(String.format(Locale.ROOT, "mechanics cost, dense-disc: %.2fx", med.get("simulate dense-disc (full gas)")
                / med.get("simulate dense-disc without mechanics")));
        ratios.forEach(System.out::println);
        bounds(List.of(data.resolve("porous-line.yaml"), data.resolve("dense-disc.yaml"),
                benchData.resolve("one-component-porous.yaml"), benchData.resolve("qs-one-pressure.yaml"),
                benchData.resolve("two-component-stored.yaml")));
        // how close the plans come: lower bound <= closed-loop ride (unlimited steps) <= plan (the tool's steps)
        System.out.println();
        System.out.printf(Locale.ROOT, "%-22s %10s %9s %10s %10s %9s %9s %9s%n", "plan quality (min)", "bound", "rigorous",
                "ride", "plan", "plan/ride", "plan/bnd", "plan ms");
        for (Map.Entry<String, CaseFile> e : planCases.entrySet()) {
            PlanResult p = Planner.plan(e.getValue().bake(), e.getValue().tool());
            System.out.printf(Locale.ROOT, "%-22s %10.1f %9s %10s %10s %9s %9s %9.0f%n", e.getKey(), p.lowerBound().boundS() / 60,
                    p.boundRigorous() ? "yes" : "no", Double.isFinite(p.rideS()) ? String.format(Locale.ROOT, "%.1f", p.rideS() / 60) : "-",
                    p.feasible() ? String.format(Locale.ROOT, "%.1f", p.durationS() / 60) : "none",
                    Double.isFinite(p.rideRatio()) ? String.format(Locale.ROOT, "%.3f", p.rideRatio()) : "-",
                    Double.isFinite(p.boundRatio()) ? String.format(Locale.ROOT, "%.3f", p.boundRatio()) : "-",
                    med.get("plan " + e.getKey()));
        }
        coldPlans(List.of(data.resolve("porous-line.yaml"), data.resolve("dense-disc.yaml")));
        return Main.OK;
    }

    /**
     * The JVM options the launcher {@code target/exhale} (src/main/sh/exhale) gives every command but {@code robust} and
     * {@code bench}: the quick compiler only, which starts short runs sooner on small machines. A test reads the script
     * to keep the two the same.
     */
    static final List<String> LAUNCHER_OPTIONS = List.of("-XX:TieredStopAtLevel=1");

    /**
     * The wall time of {@code exhale plan} in a fresh JVM (start, reading, planning, writing), each case run
     * {@link #coldRepeats} times both as the launcher runs it ({@link #LAUNCHER_OPTIONS}) and with this JVM's options
     * (as {@code java -jar} does), interleaved; with this JVM's java and class path, into a scratch folder deleted
     * after (kept, with the failing run's log, when a run fails).
     */
    private void coldPlans(List<Path> files) {
        if (coldRepeats <= 0) {
            return;
        }
        String javaBin = ProcessHandle.current().info().command().orElse("java");
        List<String> jvmOptions = java.lang.management.ManagementFactory.getRuntimeMXBean().getInputArguments();
        List<String> launcherOptions = new ArrayList<>();
        for (String o : jvmOptions) {
            if (!o.startsWith("-XX:TieredStopAtLevel") && !o.equals("-XX:+TieredCompilation") && !o.equals("-XX:-TieredCompilation")) {
                launcherOptions.add(o);
            }
        }
        launcherOptions.addAll(LAUNCHER_OPTIONS);
        List<List<String>> modes = List.of(launcherOptions, jvmOptions);
        String classPath = System.getProperty("java.class.path");
        double[][] s = new double[files.size() * modes.size()][coldRepeats];
        Path scratch;
        try {
            scratch = java.nio.file.Files.createTempDirectory("exhale-bench");
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
        boolean failed = false;
        try {
            for (int i = 0; i < coldRepeats; i++) {
                for (int r = 0; r < files.size() * modes.size(); r++) {
                    int c = r / modes.size();
                    Path out = scratch.resolve("plan-" + r + "-" + i);
                    Path log = scratch.resolve("plan-" + r + "-" + i + ".log");
                    List<String> command = new ArrayList<>();
                    command.add(javaBin);
                    command.addAll(modes.get(r % modes.size()));
                    command.addAll(List.of("-cp", classPath, Main.class.getName(), "plan", files.get(c).toString(), "-o",
                            out.toString(), "--quiet"));
                    ProcessBuilder pb = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(log.toFile());
                    long t0 = System.nanoTime();
                    Process process = pb.start();
                    try {
                        if (!process.waitFor(10, java.util.concurrent.TimeUnit.MINUTES)) {
                            failed = true;
                            throw new IllegalStateException("exhale plan " + files.get(c) + " took over 10 minutes; log in " + log);
                        }
                    } finally {
                        if (process.isAlive()) {
                            process.destroyForcibly();
                        }
                    }
                    s[r][i] = (System.nanoTime() - t0) / 1e9;
                    if (process.exitValue() != Main.OK) {
                        failed = true;
                        throw new IllegalStateException("exhale plan " + files.get(c) + " exited with " + process.exitValue()
                                + "; log in " + log);
                    }
                }
            }
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return;
        } finally {
            if (!failed) {
                try (var walk = java.nio.file.Files.walk(scratch)) {
                    for (Path p : walk.sorted(java.util.Comparator.reverseOrder()).toList()) {
                        java.nio.file.Files.deleteIfExists(p);
                    }
                } catch (java.io.IOException e) {
                    System.err.println("warning: could not delete the scratch folder " + scratch + ": " + e.getMessage());
                }
            }
        }
        System.out.println();
        System.out.printf(Locale.ROOT, "%-42s %10s %10s %10s%n", "'exhale plan' in a fresh JVM (s, wall)", "median", "min", "max");
        for (int r = 0; r < files.size() * modes.size(); r++) {
            double[] t = s[r].clone();
            Arrays.sort(t);
            String how = r % modes.size() == 0 ? "target/exhale" : jvmOptions.isEmpty() ? "java -jar" : "this JVM's options";
            System.out.printf(Locale.ROOT, "%-42s %10.2f %10.2f %10.2f%n", files.get(r / modes.size()).getFileName() + " (" + how + ")",
                    quantile(t, 0.5), t[0], t[t.length - 1]);
        }
    }

    /**
     * The lower bounds of each case, each with its label (rigorous or an estimate for this gas regime), and the
     * median time to compute them all (the regime is found once beforehand by the planner's probe).
     */
    private void bounds(List<Path> files) {
        System.out.println();
        System.out.printf(Locale.ROOT, "%-46s %-12s %9s %9s %9s %9s %9s %9s %-14s %9s%n", "lower bounds (min; * = estimate)", "gas",
                "ceiling", "vent", "joint", "envelope", "jnt-stor", "bound", "bound from", "ms");
        for (Path f : files) {
            if (!java.nio.file.Files.isRegularFile(f)) {
                System.out.println(f + ": missing, skipped");
                continue;
            }
            CaseFile cf = CaseYamlReader.read(f);
            boolean qs = LowerBound.compute(cf.bake(), cf.tool()).quasiSteady();
            LowerBound.compute(cf.bake(), cf.tool(), qs);   // warm-up
            double[] ms = new double[Math.max(boundRepeats, 1)];
            LowerBound.Result r = null;
            for (int i = 0; i < ms.length; i++) {
                long t0 = System.nanoTime();
                r = LowerBound.compute(cf.bake(), cf.tool(), qs);
                ms[i] = (System.nanoTime() - t0) / 1e6;
            }
            Arrays.sort(ms);
            String name = f.getFileName().toString().replace(".yaml", "");
            System.out.printf(Locale.ROOT, "%-46s %-12s %9s %9s %9s %9s %9s %9s %-14s %9.1f%n", name, qs ? "quasi-steady" : "stored",
                    cell(r.estimate("ceiling")), cell(r.estimate("vent_capacity")), cell(r.estimate("joint")), cell(r.estimate("envelope")),
                    cell(r.estimate("joint_stored")),
                    String.format(Locale.ROOT, "%.1f", r.boundS() / 60), PlanCommand.boundKind(r), quantile(ms, 0.5));
        }
    }

    private static String cell(LowerBound.Estimate e) {
        if (e == null) {
            return "-";
        }
        String v = Double.isFinite(e.seconds()) ? String.format(Locale.ROOT, "%.1f", e.seconds() / 60) : "inf";
        return e.rigorous() ? v : v + "*";
    }

    private static BakeCase noMechanics(BakeCase b) {
        return b.withFilm(null);
    }

    private static double time(Supplier<Object> s) {
        long t0 = System.nanoTime();
        Object o = s.get();
        long t1 = System.nanoTime();
        if (o == null) {
            throw new IllegalStateException("benchmark produced nothing");
        }
        return (t1 - t0) / 1e6;
    }

    private static double quantile(double[] sorted, double q) {
        double pos = q * (sorted.length - 1);
        int i = (int) Math.floor(pos);
        int j = Math.min(i + 1, sorted.length - 1);
        return sorted[i] + (pos - i) * (sorted[j] - sorted[i]);
    }
}
