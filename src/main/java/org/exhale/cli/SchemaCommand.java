package org.exhale.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.exhale.io.CaseSchema;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

@Command(name = "schema", mixinStandardHelpOptions = true,
        header = "Print the JSON Schema of the case file, for editors.",
        description = {"The schema is generated from the case reader itself (it reads bundled complete cases and records "
                + "every key, unit kind, range and choice it asks for). The repository keeps a copy in "
                + "docs/case-file.schema.json; point your editor's YAML support at it."})
final class SchemaCommand implements Callable<Integer> {
    @Option(names = {"-o", "--output"}, paramLabel = "FILE", description = "Write to FILE instead of standard output.")
    Path output;

    @Mixin
    CommonOptions common;

    @Override
    public Integer call() {
        String json = CaseSchema.json();
        if (output == null) {
            System.out.print(json);
        } else {
            if (java.nio.file.Files.exists(output) && !common.force) {
                throw new org.exhale.io.InputException(org.exhale.io.ErrorKind.OUTPUT, output.toString(), "", 0,
                        "exists; use --force to overwrite");
            }
            org.exhale.io.AtomicFiles.write(output, json.getBytes(java.nio.charset.StandardCharsets.UTF_8), common.force);
        }
        return Main.OK;
    }
}
