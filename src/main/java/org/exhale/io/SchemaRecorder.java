package org.exhale.io;

import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Records what the case reader asks of each key while it reads, so that the JSON Schema of the
 * case file is generated from the reader itself rather than written twice. The reader is run
 * over complete cases (every key present, see {@code /schema/complete-*.yaml}) with a recorder;
 * {@link CaseSchema} turns the record into a schema.
 */
public final class SchemaRecorder {
    /** What a key holds. */
    public enum Type { OBJECT, ARRAY, TEXT, NAME, NUMBER, QUANTITY }

    /** One key: its types (a scalar may be read as text and as a number), unit kind, choices, range, and whether it must be given. */
    public static final class Entry {
        final Set<Type> types = new LinkedHashSet<>();
        UnitKind kind;
        List<String> choices;
        double lo = Double.NaN;
        double hi = Double.NaN;
        String range = "";
        boolean required;
        boolean optional;
    }

    private final Map<String, Entry> entries = new LinkedHashMap<>();

    static String normalise(String path) {
        return path.replaceAll("\\[\\d+]", "[]");
    }

    Entry at(String path) {
        return entries.computeIfAbsent(normalise(path), p -> new Entry());
    }

    void type(String path, Type t) {
        at(path).types.add(t);
    }

    void asked(String path, boolean required) {
        Entry e = at(path);
        if (required && !e.optional) {
            e.required = true;
        }
    }

    void optional(String path) {
        Entry e = at(path);
        e.optional = true;
        e.required = false;
    }

    public Map<String, Entry> entries() {
        return entries;
    }
}
