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
    public enum Type { OBJECT, MAP, ARRAY, TEXT, NAME, NUMBER, QUANTITY }

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
        /** A fraction that must carry '%' or 'ppm' (no bare number). */
        boolean unitRequired;
        int parentRuns;
        int requiredRuns;

        /** Required in the schema when required in every recorded case whose parent held it or could have. */
        public boolean requiredEverywhere() {
            return parentRuns > 0 && requiredRuns == parentRuns;
        }
    }

    private final Map<String, Entry> entries = new LinkedHashMap<>();
    private final Set<String> keyedByName = new LinkedHashSet<>();

    String normalise(String path) {
        String p = path.replaceAll("\\[\\d+]", "[]");
        for (String m : keyedByName) {
            if (p.startsWith(m + ".")) {
                String rest = p.substring(m.length() + 1);
                int dot = rest.indexOf('.');
                p = m + ".*" + (dot < 0 ? "" : rest.substring(dot));
            }
        }
        return p;
    }

    void keyedByName(String path) {
        String p = normalise(path);
        keyedByName.add(p);
        Entry e = at(p);
        e.types.remove(Type.OBJECT);
        e.types.add(Type.MAP);
    }

    Entry at(String path) {
        return entries.computeIfAbsent(normalise(path), p -> new Entry());
    }

    void type(String path, Type t) {
        at(path).types.add(t);
        if (t == Type.OBJECT || t == Type.MAP) {
            seen(path);
        }
    }

    void asked(String path, boolean required) {
        Entry e = at(path);
        if (required && !e.optional) {
            e.required = true;
        }
    }

    /** A key asked about with has() before it is read; one already read as required stays required. */
    void optional(String path) {
        Entry e = at(path);
        if (!e.required) {
            e.optional = true;
        }
    }

    public Map<String, Entry> entries() {
        return entries;
    }

    /** Starts recording another case: per-case requiredness is reset. */
    void beginRun() {
        for (Entry e : entries.values()) {
            e.required = false;
            e.optional = false;
        }
        seenThisRun.clear();
    }

    /** Ends a case: a key counts as required there when it was read as required, where its parent was read. */
    void endRun() {
        for (Map.Entry<String, Entry> me : entries.entrySet()) {
            String path = me.getKey();
            int dot = path.lastIndexOf('.');
            String parent = dot < 0 ? "" : path.substring(0, dot);
            if (seenThisRun.contains(parent)) {
                me.getValue().parentRuns++;
                if (me.getValue().required) {
                    me.getValue().requiredRuns++;
                }
            }
        }
    }

    private final Set<String> seenThisRun = new LinkedHashSet<>();

    void seen(String path) {
        seenThisRun.add(normalise(path));
    }
}
