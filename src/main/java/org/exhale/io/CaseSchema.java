package org.exhale.io;

import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;

/**
 * The JSON Schema (draft 2020-12) of the case file, generated from the reader itself: the reader
 * reads the bundled complete cases ({@code /schema/complete-a.yaml}, {@code -b}, {@code -c},
 * which hold every key and every alternative; a key is required when every case whose section
 * holds it had to give it) with a {@link SchemaRecorder}, and the record —
 * which keys exist where, which are required, which unit kinds, ranges and names they take — is
 * written as a schema. Editors that understand JSON Schema validate and complete case files with
 * it; exhale's own reader remains the authority (it also checks what a schema cannot, such as
 * fractions summing to 1).
 */
public final class CaseSchema {
    static final String[] COMPLETE_CASES = {"/schema/complete-a.yaml", "/schema/complete-b.yaml", "/schema/complete-c.yaml"};
    private static final String NUMBER = "[+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?";
    private static final JsonNodeFactory F = JsonNodeFactory.instance;

    private CaseSchema() {
    }

    /** The schema as pretty-printed JSON text. */
    public static String json() {
        try {
            return new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(schema()) + "\n";
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Escapes regular-expression metacharacters the way ECMA-262 patterns (used by JSON Schema) read them. */
    static String escape(String unit) {
        StringBuilder sb = new StringBuilder();
        for (char c : unit.toCharArray()) {
            if ("\\^$.|?*+()[]{}/".indexOf(c) >= 0) {
                sb.append('\\');
            }
            sb.append(c);
        }
        return sb.toString();
    }

    public static ObjectNode schema() {
        SchemaRecorder recorder = new SchemaRecorder();
        for (String resource : COMPLETE_CASES) {
            try (InputStream in = CaseSchema.class.getResourceAsStream(resource)) {
                if (in == null) {
                    throw new IllegalStateException("missing resource " + resource);
                }
                recorder.beginRun();
                CaseYamlReader.record(resource, in.readAllBytes(), recorder);
                recorder.endRun();
            } catch (IOException e) {
                throw new IllegalStateException(e);
            }
        }
        ObjectNode root = node("", recorder.entries());
        ObjectNode out = F.objectNode();
        out.put("$schema", "https://json-schema.org/draft/2020-12/schema");
        out.put("title", "exhale case file");
        out.put("description", "A bake case for exhale: polymer, cavity, cap, ambient, wafer, limits, tool, recipe, "
                + "chamber and uncertainty. Values carry units as typed, e.g. '350 C', '1.5 nm', '8 GPa'. Generated from "
                + "the reader; see docs/case-file.md.");
        root.fields().forEachRemaining(e -> out.set(e.getKey(), e.getValue()));
        return out;
    }

    private static ObjectNode node(String path, Map<String, SchemaRecorder.Entry> entries) {
        SchemaRecorder.Entry e = entries.get(path);
        ObjectNode n = F.objectNode();
        if (e.types.contains(SchemaRecorder.Type.OBJECT) || e.types.contains(SchemaRecorder.Type.MAP)) {
            n.put("type", "object");
            ObjectNode props = F.objectNode();
            List<String> required = new ArrayList<>();
            Map<String, String> children = new TreeMap<>();
            String prefix = path.isEmpty() ? "" : path + ".";
            for (String p : entries.keySet()) {
                if (p.startsWith(prefix) && !p.equals(path)) {
                    String rest = p.substring(prefix.length());
                    if (!rest.contains(".") && !rest.endsWith("[]")) {
                        children.put(rest, p);
                    }
                }
            }
            if (e.types.contains(SchemaRecorder.Type.MAP)) {
                String any = prefix + "*";
                n.set("additionalProperties", entries.containsKey(any) ? node(any, entries) : F.objectNode());
                return n;
            }
            for (Map.Entry<String, String> c : children.entrySet()) {
                props.set(c.getKey(), node(c.getValue(), entries));
                if (entries.get(c.getValue()).requiredEverywhere()) {
                    required.add(c.getKey());
                }
            }
            n.set("properties", props);
            n.put("additionalProperties", false);
            if (!required.isEmpty()) {
                ArrayNode r = n.putArray("required");
                required.forEach(r::add);
            }
            if (path.endsWith("steps[]")) {
                n.put("minProperties", 1);
                n.put("maxProperties", 1);
                n.put("description", "a step: 'ramp: {to: .., rate: ..}' or 'hold: <time>'");
            }
            return n;
        }
        if (e.types.contains(SchemaRecorder.Type.ARRAY)) {
            n.put("type", "array");
            n.put("minItems", 1);
            n.set("items", node(path + "[]", entries));
            return n;
        }
        if (e.types.contains(SchemaRecorder.Type.NAME) && e.types.contains(SchemaRecorder.Type.NUMBER)) {
            // a number or a name (tortuosity: a value, or 'bruggeman')
            ArrayNode any = n.putArray("anyOf");
            ObjectNode names = F.objectNode();
            ArrayNode en = names.putArray("enum");
            e.choices.forEach(en::add);
            any.add(names);
            any.add(number(e));
            return n;
        }
        if (e.types.contains(SchemaRecorder.Type.NAME)) {
            ArrayNode en = n.putArray("enum");
            e.choices.forEach(en::add);
            return n;
        }
        if (e.types.contains(SchemaRecorder.Type.QUANTITY)) {
            UnitKind kind = e.kind;
            List<String> units = new ArrayList<>(kind.symbols());
            if (e.unitRequired) {
                units.remove("");
            }
            String alternatives = String.join("|", units.stream().filter(u -> !u.isEmpty())
                    .map(CaseSchema::escape).toList());
            boolean bare = units.contains("") && !e.unitRequired;
            String pattern = "^\\s*" + NUMBER + "\\s*" + (alternatives.isEmpty() ? "" : "(?:" + alternatives + ")"
                    + (bare ? "?" : "")) + "\\s*$";
            if (bare) {
                ArrayNode t = n.putArray("type");
                t.add("number");
                t.add("string");
            } else {
                n.put("type", "string");
            }
            n.put("pattern", pattern);
            n.put("description", kind.description() + (e.range.isEmpty() ? "" : ", " + e.range) + "; units: "
                    + String.join(", ", units.stream().map(u -> u.isEmpty() ? "none" : u).toList()));
            return n;
        }
        if (e.types.contains(SchemaRecorder.Type.NUMBER)) {
            return number(e);
        }
        n.put("type", "string");
        return n;
    }

    private static ObjectNode number(SchemaRecorder.Entry e) {
        ObjectNode n = F.objectNode();
        ArrayNode t = n.putArray("type");
        t.add("number");
        t.add("string");
        n.put("pattern", "^\\s*" + NUMBER + "\\s*$");
        if (Double.isFinite(e.lo)) {
            n.put("minimum", e.lo);
        }
        if (Double.isFinite(e.hi)) {
            n.put("maximum", e.hi);
        }
        n.put("description", "a plain number");
        return n;
    }
}
