package org.exhale.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

@Command(name = "demo", mixinStandardHelpOptions = true,
        header = "Run the main job on the bundled demo cases.",
        description = "Plans the shortest safe recipe for each bundled demo case of data/demo (an invented scenario: "
                + "a porous nanometre cap over interconnect lines; a dense cap over a MEMS disc cavity) and writes "
                + "the results and a report (report.html, charts/) to out/demo/<case>, replacing earlier demo results.")
final class DemoCommand implements Callable<Integer> {
    static final List<String> CASES = List.of("porous-line.yaml", "dense-disc.yaml");

    @Option(names = "--data", paramLabel = "DIR", defaultValue = "data/demo", description = "Folder of the demo cases.")
    Path data;

    @Override
    public Integer call() {
        int worst = Main.OK;
        for (String c : CASES) {
            Path p = data.resolve(c);
            if (!Files.isRegularFile(p)) {
                throw new InputException(ErrorKind.FILE_UNREADABLE, p.toString(), "", 0,
                        "demo case not found; run from the project folder or pass --data");
            }
            System.out.println("=== " + p + " ===");
            String name = c.replace(".yaml", "");
            PlanCommand plan = new PlanCommand();
            plan.cautionsElsewhere = true;
            int code = new CommandLine(plan).setExecutionExceptionHandler((e, cl, pr) -> {
                throw e;
            }).execute(p.toString(), "-o", "out/demo/" + name, "--force", "--report");
            System.out.println();
            worst = Math.max(worst, code);
        }
        System.out.println(org.exhale.report.Cautions.terminal(true));
        return worst;
    }
}
