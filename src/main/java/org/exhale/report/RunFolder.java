package org.exhale.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;

import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The files an exhale command left in one output folder, each read if present. Nothing here knows
 * which command wrote the folder: the report renders what it finds.
 *
 * @param dir        the folder
 * @param summary    summary.json (simulate, plan)
 * @param history    history.csv (simulate, plan)
 * @param recipe     recipe.csv (plan)
 * @param plan       plan.json (plan)
 * @param fit        fit.json (fit)
 * @param fitTable   fit.csv (fit)
 * @param isoconversional isoconversional.csv (fit)
 * @param kinetics   kinetics.yaml as text (fit)
 * @param compare    compare.json (compare)
 * @param options    options.csv, the ranked options (compare)
 * @param robust     robust.json (robust)
 * @param samples    samples.csv, one row per Monte Carlo sample (robust)
 */
public record RunFolder(Path dir, Optional<JsonNode> summary, Optional<CsvTable> history, Optional<CsvTable> recipe,
                        Optional<JsonNode> plan, Optional<JsonNode> fit, Optional<CsvTable> fitTable,
                        Optional<CsvTable> isoconversional, Optional<String> kinetics,
                        Optional<JsonNode> compare, Optional<CsvTable> options,
                        Optional<JsonNode> robust, Optional<CsvTable> samples) {

    private static final ObjectMapper MAPPER = new ObjectMapper();
    /** kinetics.yaml is shown verbatim; a larger one is not ours. */
    private static final long MAX_TEXT_BYTES = 1L << 20;

    public static RunFolder read(Path dir) {
        if (!Files.isDirectory(dir)) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, dir.toString(), "", 0,
                    Files.exists(dir) ? "is not a folder; expected an exhale output folder"
                            : "no such folder; expected an exhale output folder");
        }
        RunFolder f = new RunFolder(dir, json(dir, "summary.json"), csv(dir, "history.csv"), csv(dir, "recipe.csv"),
                json(dir, "plan.json"), json(dir, "fit.json"), csv(dir, "fit.csv"), csv(dir, "isoconversional.csv"),
                text(dir, "kinetics.yaml"), json(dir, "compare.json"), csv(dir, "options.csv"),
                json(dir, "robust.json"), csv(dir, "samples.csv"));
        if (f.summary.isEmpty() && f.fit.isEmpty() && f.compare.isEmpty() && f.options.isEmpty() && f.robust.isEmpty()
                && f.samples.isEmpty()) {
            throw new InputException(ErrorKind.MISSING_KEY, dir.toString(), "", 0,
                    "holds none of summary.json, fit.json, compare.json, options.csv, robust.json, samples.csv; "
                            + "expected the output folder of exhale simulate, plan, fit, compare or robust");
        }
        if (f.history.isPresent() && !f.history.get().has("time_s")) {
            throw new InputException(ErrorKind.MISSING_KEY, f.history.get().file(), "header", 1,
                    "no column 'time_s'; expected the history table of exhale simulate or plan");
        }
        return f;
    }

    private static Optional<JsonNode> json(Path dir, String name) {
        Path p = dir.resolve(name);
        if (!Files.isRegularFile(p)) {
            return Optional.empty();
        }
        try {
            if (Files.size(p) > CsvTable.MAX_BYTES) {
                throw new InputException(ErrorKind.TOO_LARGE, p.toString(), "", 0, "too large for a summary file");
            }
            JsonNode n = MAPPER.readTree(p.toFile());
            if (n == null || !n.isObject()) {
                throw new InputException(ErrorKind.WRONG_TYPE, p.toString(), "", 1, "expected a JSON object");
            }
            return Optional.of(n);
        } catch (JsonProcessingException e) {
            JsonLocation loc = e.getLocation();
            throw new InputException(ErrorKind.SYNTAX, p.toString(), "", loc == null ? 0 : loc.getLineNr(),
                    "not valid JSON (" + e.getOriginalMessage() + ")", e);
        } catch (IOException e) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, p.toString(), "", 0, "cannot read (" + org.exhale.io.Messages.of(e) + ")", e);
        }
    }

    private static Optional<CsvTable> csv(Path dir, String name) {
        Path p = dir.resolve(name);
        return Files.isRegularFile(p) ? Optional.of(CsvTable.read(p)) : Optional.empty();
    }

    private static Optional<String> text(Path dir, String name) {
        Path p = dir.resolve(name);
        if (!Files.isRegularFile(p)) {
            return Optional.empty();
        }
        try {
            if (Files.size(p) > MAX_TEXT_BYTES) {
                return Optional.empty();
            }
            return Optional.of(Files.readString(p, StandardCharsets.UTF_8));
        } catch (IOException e) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, p.toString(), "", 0, "cannot read (" + org.exhale.io.Messages.of(e) + ")", e);
        }
    }

    /** The case name from summary.json (else compare.json or robust.json: its case name, else its case file), else the folder's name. */
    public String caseName() {
        String n = summary.map(s -> s.path("case").asText("")).orElse("");
        for (Optional<JsonNode> j : java.util.List.of(compare, robust)) {
            if (n.isBlank()) {
                n = j.map(s -> s.path("case_name").isValueNode() && !s.path("case_name").asText("").isBlank()
                        ? s.path("case_name").asText("")
                        : s.path("case").isValueNode() ? s.path("case").asText("") : "").orElse("");
            }
        }
        if (n.isBlank()) {
            Path fn = dir.toAbsolutePath().normalize().getFileName();
            n = fn == null ? "" : fn.toString();
        }
        return n;
    }
}
