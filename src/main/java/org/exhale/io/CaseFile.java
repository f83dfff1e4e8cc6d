package org.exhale.io;

import java.util.List;

import org.exhale.planning.Tool;
import org.exhale.simulation.BakeCase;

/**
 * A case file as read: the bake case, the tool (null if absent), the defaults that were filled in
 * and the warnings about legal but implausible values.
 */
public record CaseFile(String path, BakeCase bake, Tool tool, List<String> defaults, List<String> warnings) {
    public CaseFile {
        defaults = List.copyOf(defaults);
        warnings = List.copyOf(warnings);
    }
}
