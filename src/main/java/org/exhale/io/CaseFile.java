package org.exhale.io;

import java.util.List;

import org.exhale.planning.Tool;
import org.exhale.simulation.BakeCase;
import org.exhale.studies.Uncertainty;

/**
 * A case file as read: the bake case, the tool (null if absent), the defaults that were filled in,
 * the warnings about legal but implausible values, and the uncertainty section for robustness
 * studies (null if absent).
 */
public record CaseFile(String path, BakeCase bake, Tool tool, List<String> defaults, List<String> warnings,
                       Uncertainty uncertainty) {
    public CaseFile {
        defaults = List.copyOf(defaults);
        warnings = List.copyOf(warnings);
    }

    /** A case file without an uncertainty section. */
    public CaseFile(String path, BakeCase bake, Tool tool, List<String> defaults, List<String> warnings) {
        this(path, bake, tool, defaults, warnings, null);
    }
}
