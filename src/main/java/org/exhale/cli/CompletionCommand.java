package org.exhale.cli;

import java.util.concurrent.Callable;

import picocli.AutoComplete;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/** {@code exhale completion}: prints a bash/zsh completion script made from the command definitions. */
@Command(name = "completion", mixinStandardHelpOptions = true,
        header = "Print a bash and zsh completion script for exhale.",
        description = {"The script is generated from the command definitions, so it always matches this version.",
                "bash (or save the script to /etc/bash_completion.d/exhale):",
                "  source <(exhale completion)",
                "zsh (through its bash-completion emulation):",
                "  autoload -U +X compinit && compinit",
                "  autoload -U +X bashcompinit && bashcompinit",
                "  source <(exhale completion)",
                "It completes the command 'exhale'; if you run 'java -jar exhale.jar', define an alias or a "
                        + "wrapper script named exhale first."})
final class CompletionCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        CommandLine root = spec.commandLine();
        while (root.getParent() != null) {
            root = root.getParent();
        }
        String script = AutoComplete.bash("exhale", root);
        spec.commandLine().getOut().print(script);
        spec.commandLine().getOut().flush();
        return Main.OK;
    }
}
