package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The generated case-file schema: the committed copy is current, every demo, template and
 * example case validates against it, and the schema and the reader agree on every key.
 * The validator below covers the subset of JSON Schema the generator emits (type, properties,
 * additionalProperties, required, pattern, enum, minimum/maximum, items, min/maxProperties).
 */
class CaseSchemaTest {
    private static final JsonNode SCHEMA = CaseSchema.schema();

    static Stream<Path> cases() throws IOException {
        List<Path> all = new ArrayList<>();
        try (Stream<Path> s = Files.list(Path.of("data/demo"))) {
            s.filter(p -> p.toString().endsWith(".yaml")).forEach(all::add);
        }
        try (Stream<Path> s = Files.list(Path.of("src/main/resources/templates"))) {
            s.filter(p -> p.toString().endsWith(".yaml")).forEach(all::add);
        }
        try (Stream<Path> s = Files.list(Path.of("src/main/resources/schema"))) {
            s.filter(p -> p.toString().endsWith(".yaml")).forEach(all::add);
        }
        try (Stream<Path> s = Files.list(Path.of("src/test/resources/good-cases"))) {
            s.filter(p -> p.toString().endsWith(".yaml")).forEach(all::add);
        }
        return all.stream();
    }

    @Test
    void committedSchemaIsCurrent() throws IOException {
        assertEquals(CaseSchema.json(), Files.readString(Path.of("docs/case-file.schema.json")),
                "docs/case-file.schema.json is stale: run 'exhale schema -o docs/case-file.schema.json --force'");
    }

    @ParameterizedTest
    @MethodSource("cases")
    void everyCaseValidatesAndReads(Path file) throws IOException {
        Object doc = load(file);
        List<String> problems = new ArrayList<>();
        validate(SCHEMA, doc, "", problems);
        assertTrue(problems.isEmpty(), file + ": " + problems);
        CaseYamlReader.read(file);
    }

    @Test
    void schemaRejectsWhatTheReaderRejects() throws IOException {
        String good = Files.readString(Path.of("data/demo/porous-line.yaml"));
        for (String[] edit : new String[][]{
                {"thickness: 120 nm", "thicknes: 120 nm"},          // unknown key
                {"thickness: 120 nm", "thickness: 120 C"},          // wrong unit kind
                {"model: nth-order", "model: nth-ordr"},            // unknown model
                {"shape: line", "shape: lane"},                     // unknown shape
                {"density: 1.15 g/cm3\n", "\n"}}) {                  // missing required key
            String bad = good.replace(edit[0], edit[1]);
            assertFalse(bad.equals(good), "edit did not apply: " + edit[0]);
            Object doc = new Yaml(new SafeConstructor(new LoaderOptions())).load(bad);
            List<String> problems = new ArrayList<>();
            validate(SCHEMA, doc, "", problems);
            assertFalse(problems.isEmpty(), "schema accepts " + edit[1]);
            boolean readerRejects;
            try {
                CaseYamlReader.parse("edited.yaml", bad.getBytes(java.nio.charset.StandardCharsets.UTF_8));
                readerRejects = false;
            } catch (InputException e) {
                readerRejects = true;
            }
            assertTrue(readerRejects, "reader accepts " + edit[1]);
        }
    }

    @Test
    void everyKeyOfTheSchemaIsOneTheReaderAsksFor() {
        // the schema is the reader's own record, so every property must be known to the reader: a case holding
        // only that key's section must not fail with UNKNOWN_KEY at that key
        List<String> paths = new ArrayList<>();
        collect(SCHEMA, "", paths);
        assertTrue(paths.size() > 100, "too few keys: " + paths.size());
        for (String must : new String[]{"polymer.components[].product.molar_mass", "cap.youngs_modulus", "tool.max_ramp_up",
                                         "chamber.lel_fraction", "uncertainty.components.*.Ea_sd", "recipe.steps[].hold",
                                         "limits.thermal_dose.reference", "cavity.length"}) {
            assertTrue(paths.contains(must), "schema lacks " + must + ": " + paths);
        }
    }

    private static void collect(JsonNode s, String path, List<String> out) {
        if (s.has("properties")) {
            Iterator<Map.Entry<String, JsonNode>> it = s.get("properties").fields();
            while (it.hasNext()) {
                Map.Entry<String, JsonNode> e = it.next();
                String p = path.isEmpty() ? e.getKey() : path + "." + e.getKey();
                out.add(p);
                collect(e.getValue(), p, out);
            }
        }
        if (s.has("items")) {
            collect(s.get("items"), path + "[]", out);
        }
        if (s.has("additionalProperties") && s.get("additionalProperties").isObject()) {
            collect(s.get("additionalProperties"), path + ".*", out);
        }
    }

    private static Object load(Path file) throws IOException {
        String text = Files.readString(file);
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        return new Yaml(new SafeConstructor(new LoaderOptions())).load(text);
    }

    @SuppressWarnings("unchecked")
    static void validate(JsonNode s, Object v, String at, List<String> problems) {
        if (s.has("anyOf")) {
            for (JsonNode alt : s.get("anyOf")) {
                List<String> p = new ArrayList<>();
                validate(alt, v, at, p);
                if (p.isEmpty()) {
                    return;
                }
            }
            problems.add(at + ": '" + v + "' matches none of " + s.get("anyOf"));
            return;
        }
        if (s.has("enum")) {
            boolean ok = false;
            for (JsonNode e : s.get("enum")) {
                ok |= e.asText().equals(String.valueOf(v));
            }
            if (!ok) {
                problems.add(at + ": '" + v + "' not in " + s.get("enum"));
            }
            return;
        }
        List<String> types = new ArrayList<>();
        if (s.has("type")) {
            if (s.get("type").isArray()) {
                s.get("type").forEach(t -> types.add(t.asText()));
            } else {
                types.add(s.get("type").asText());
            }
        }
        String actual = v instanceof Map ? "object" : v instanceof List ? "array" : v instanceof Number ? "number"
                : v instanceof String ? "string" : v == null ? "null" : "other";
        if (!types.isEmpty() && !types.contains(actual)) {
            problems.add(at + ": a " + actual + ", expected " + types);
            return;
        }
        if (v instanceof String str && s.has("pattern") && !java.util.regex.Pattern.compile(s.get("pattern").asText()).matcher(str).find()) {
            problems.add(at + ": '" + str + "' does not match " + s.get("pattern").asText());
        }
        if (v instanceof Number num) {
            if (s.has("minimum") && num.doubleValue() < s.get("minimum").asDouble()) {
                problems.add(at + ": below minimum");
            }
            if (s.has("maximum") && num.doubleValue() > s.get("maximum").asDouble()) {
                problems.add(at + ": above maximum");
            }
        }
        if (v instanceof Map<?, ?> m) {
            Map<String, Object> map = (Map<String, Object>) m;
            if (s.has("required")) {
                for (JsonNode r : s.get("required")) {
                    if (!map.containsKey(r.asText())) {
                        problems.add(at + ": missing " + r.asText());
                    }
                }
            }
            if (s.has("minProperties") && map.size() < s.get("minProperties").asInt()
                    || s.has("maxProperties") && map.size() > s.get("maxProperties").asInt()) {
                problems.add(at + ": " + map.size() + " keys");
            }
            for (Map.Entry<String, Object> e : map.entrySet()) {
                String p = at.isEmpty() ? e.getKey() : at + "." + e.getKey();
                JsonNode props = s.get("properties");
                if (props != null && props.has(e.getKey())) {
                    validate(props.get(e.getKey()), e.getValue(), p, problems);
                } else if (s.has("additionalProperties") && s.get("additionalProperties").isObject()) {
                    validate(s.get("additionalProperties"), e.getValue(), p, problems);
                } else if (s.has("additionalProperties") && !s.get("additionalProperties").asBoolean(true)) {
                    problems.add(p + ": unknown key");
                }
            }
        }
        if (v instanceof List<?> list && s.has("items")) {
            int i = 0;
            for (Object item : list) {
                validate(s.get("items"), item, at + "[" + (++i) + "]", problems);
            }
        }
    }
}
