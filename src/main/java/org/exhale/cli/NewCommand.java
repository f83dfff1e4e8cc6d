package org.exhale.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.exhale.io.AtomicFiles;
import org.exhale.io.CaseTemplates;
import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code exhale new}: writes a commented case file to start from. */
@Command(name = "new", mixinStandardHelpOptions = true,
        header = "Write a complete, commented case file to start from.",
        description = {"Writes a case file of an invented demo scenario for the chosen cavity shape: every key with "
                + "its unit and a one-line meaning, valid as written. Edit it, then run 'exhale check FILE'.",
                "Porous caps (the default) vent through nanometre pores in nitrogen; --dense gives a MEMS-sized "
                + "cavity under a dense cap that vents only by permeation, baked in vacuum."},
        footer = {"", "Examples:", "  exhale new line                 writes line.yaml",
                "  exhale new disc --dense -o mems.yaml", "  exhale new rectangle -o -       prints to stdout"})
final class NewCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "KIND", description = "Cavity shape: ${COMPLETION-CANDIDATES}.")
    CaseTemplates.Kind kind;

    @Option(names = "--dense", description = "A dense cap over a MEMS-sized cavity, baked in vacuum.")
    boolean dense;

    @Option(names = {"-o", "--output"}, paramLabel = "FILE",
            description = "File to write; '-' for stdout (default: KIND.yaml, or KIND-dense.yaml, in the current folder).")
    Path output;

    @Option(names = "--force", description = CommonOptions.FORCE)
    boolean force;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        String text = CaseTemplates.text(kind, dense);
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (output != null && output.toString().equals("-")) {
            out.print(text);
            out.flush();
            return Main.OK;
        }
        Path target = output != null ? output : Path.of(kind.fileName(dense));
        if (Files.exists(target) && !force) {
            throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0,
                    "the file exists; pass --force to overwrite it or choose another with -o");
        }
        if (Files.isDirectory(target)) {
            throw new InputException(ErrorKind.OUTPUT, target.toString(), "", 0, "is a folder; -o takes a file name");
        }
        AtomicFiles.write(target, text.getBytes(java.nio.charset.StandardCharsets.UTF_8), force);
        err.println("wrote " + target + " (" + kind + (dense ? ", dense cap" : ", porous cap")
                + ", an invented demo scenario); next: exhale check " + target);
        return Main.OK;
    }
}
