package org.exhale.io;

import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * A located view of a composed YAML node: every accessor knows the file, the key path and the
 * line, so that every error names all three. Mappings remember which keys were read; {@link #finish()}
 * rejects the rest as unknown keys with a did-you-mean.
 */
public final class YamlNode {
    private final String file;
    private final String path;
    private final Node node;
    private final Map<String, NodeTuple> entries;
    private final Set<String> allowed = new LinkedHashSet<>();
    private final Set<Node> seen;
    /** Children already handed out, so that reading a key twice is not mistaken for an alias. */
    private final Map<String, YamlNode> children = new LinkedHashMap<>();
    private List<YamlNode> itemList;
    /** Records what is asked of every key, for the generated schema; null when not recording. */
    private final SchemaRecorder recorder;

    private YamlNode(String file, String path, Node node, Set<Node> seen, SchemaRecorder recorder) {
        this.file = file;
        this.path = path;
        this.node = node;
        this.seen = seen;
        this.recorder = recorder;
        refuseCustomTag(node);
        if (!seen.add(node) && !(node instanceof ScalarNode)) {
            throw error(ErrorKind.TOO_LARGE, "YAML aliases of mappings and lists are not accepted");
        }
        if (node instanceof MappingNode m) {
            entries = new LinkedHashMap<>();
            for (NodeTuple t : m.getValue()) {
                refuseCustomTag(t.getKeyNode());
                if (!(t.getKeyNode() instanceof ScalarNode k)) {
                    throw new InputException(ErrorKind.WRONG_TYPE, file, path, line(t.getKeyNode()),
                            "keys must be plain names");
                }
                if (entries.put(k.getValue(), t) != null) {
                    throw new InputException(ErrorKind.DUPLICATE_KEY, file, join(path, k.getValue()), line(k),
                            "key '" + k.getValue() + "' appears twice");
                }
            }
        } else {
            entries = Map.of();
        }
    }

    /**
     * A tag other than YAML's own (`!mytag 300 nm`, `!`) asks for a meaning this reader does not give:
     * it is refused rather than silently read as text.
     */
    private void refuseCustomTag(Node n) {
        org.yaml.snakeyaml.nodes.Tag tag = n.getTag();
        if (tag != null && !tag.getValue().startsWith(org.yaml.snakeyaml.nodes.Tag.PREFIX)) {
            throw new InputException(ErrorKind.SYNTAX, file, path, line(n), "YAML tag '" + tag.getValue()
                    + "' is not accepted; a case file uses no tags, write the value alone");
        }
    }

    static YamlNode root(String file, Node node) {
        return root(file, node, null);
    }

    static YamlNode root(String file, Node node, SchemaRecorder recorder) {
        YamlNode r = new YamlNode(file, "", node, java.util.Collections.newSetFromMap(new IdentityHashMap<>()), recorder);
        if (recorder != null) {
            recorder.type("", SchemaRecorder.Type.OBJECT);
        }
        return r;
    }

    private void record(SchemaRecorder.Type t) {
        if (recorder != null) {
            recorder.type(path, t);
        }
    }

    private static String join(String path, String key) {
        return path.isEmpty() ? key : path + "." + key;
    }

    private static int line(Node n) {
        return n.getStartMark() == null ? 0 : n.getStartMark().getLine() + 1;
    }

    public String file() {
        return file;
    }

    public String path() {
        return path;
    }

    public int line() {
        return line(node);
    }

    public InputException error(ErrorKind kind, String what) {
        return new InputException(kind, file, path, line(), what);
    }

    public boolean isMapping() {
        return node instanceof MappingNode;
    }

    public boolean isList() {
        return node instanceof SequenceNode;
    }

    public boolean isScalar() {
        return node instanceof ScalarNode;
    }

    /** Declares keys that are allowed here even when not read. */
    public YamlNode allow(String... keys) {
        allowed.addAll(List.of(keys));
        return this;
    }

    public boolean has(String key) {
        allowed.add(key);
        if (recorder != null) {
            recorder.optional(join(path, key));
        }
        NodeTuple t = entries.get(key);
        if (t != null && isNull(t.getValueNode())) {
            // an empty value must never quietly mean "use the default" (that could switch a limit off)
            throw new InputException(ErrorKind.MISSING_KEY, file, join(path, key), line(t.getKeyNode()),
                    "key '" + key + "' has no value; give one, or remove the key to use the default");
        }
        return t != null;
    }

    private static boolean isNull(Node n) {
        return n instanceof ScalarNode s && s.getTag().getValue().endsWith(":null");
    }

    public Set<String> keys() {
        return entries.keySet();
    }

    /** The child at {@code key}; it must be present. */
    public YamlNode get(String key) {
        allowed.add(key);
        NodeTuple t = entries.get(key);
        if (t != null && isNull(t.getValueNode())) {
            // `cte:`, `cte: null`, `cte: ~`: the key is there, its value is not; say so at the key's own line
            throw new InputException(ErrorKind.MISSING_KEY, file, join(path, key), line(t.getKeyNode()),
                    "key '" + key + "' has no value; expected a value here");
        }
        if (t == null) {
            if (!isMapping()) {
                throw error(ErrorKind.WRONG_TYPE, "expected a mapping of keys, found " + describe());
            }
            throw missing(key);
        }
        if (recorder != null) {
            recorder.asked(join(path, key), true);
        }
        return children.computeIfAbsent(key, k -> new YamlNode(file, join(path, k), t.getValueNode(), seen, recorder));
    }

    /** A mapping child; must be present and be a mapping. */
    public YamlNode section(String key) {
        YamlNode c = get(key);
        if (!c.isMapping()) {
            throw c.error(ErrorKind.WRONG_TYPE, "expected a mapping of keys, found " + c.describe());
        }
        c.record(SchemaRecorder.Type.OBJECT);
        return c;
    }

    /** The list items; must be present and be a list. */
    public List<YamlNode> list(String key) {
        YamlNode c = get(key);
        return c.items();
    }

    public List<YamlNode> items() {
        if (!(node instanceof SequenceNode s)) {
            throw error(ErrorKind.WRONG_TYPE, "expected a list, found " + describe());
        }
        record(SchemaRecorder.Type.ARRAY);
        if (itemList == null) {
            List<YamlNode> out = new ArrayList<>();
            int i = 0;
            for (Node n : s.getValue()) {
                YamlNode item = new YamlNode(file, path + "[" + (++i) + "]", n, seen, recorder);
                if (recorder != null && item.isMapping()) {
                    recorder.type(item.path, SchemaRecorder.Type.OBJECT);
                }
                out.add(item);
            }
            itemList = List.copyOf(out);
        }
        return itemList;
    }

    /**
     * A required key is absent. If an unread key here is a near miss of it ("thicknes",
     * "Height"), that key is reported as unknown with a did-you-mean, at its own line; short
     * keys (under 3 letters) are too alike to guess from.
     */
    private InputException missing(String key) {
        if (key.length() >= 3) {
            for (Map.Entry<String, NodeTuple> e : entries.entrySet()) {
                String k = e.getKey();
                if (!allowed.contains(k) && Names.closest(k, List.of(key)) != null) {
                    return new InputException(ErrorKind.UNKNOWN_KEY, file, join(path, k), line(e.getValue().getKeyNode()),
                            "unknown key '" + k + "' (did you mean '" + key + "'?)");
                }
            }
        }
        return error(ErrorKind.MISSING_KEY, "missing key '" + key + "'");
    }

    /** This node's text; must be a scalar. */
    public String text() {
        if (!(node instanceof ScalarNode s)) {
            throw error(ErrorKind.WRONG_TYPE, "expected a single value, found " + describe());
        }
        if (recorder != null && recorder.at(path).types.isEmpty()) {
            recorder.type(path, SchemaRecorder.Type.TEXT);
        }
        return s.getValue();
    }

    /** Records that this scalar must carry a unit even where its kind would allow a bare number. */
    void unitRequired() {
        if (recorder != null) {
            recorder.at(path).unitRequired = true;
        }
    }

    /** Marks this mapping's keys as names chosen by the user (component names), not fixed keys. */
    public YamlNode keyedByName() {
        if (recorder != null) {
            recorder.keyedByName(path);
        }
        return this;
    }

    /** A name from a fixed list; the reader checks it (with a did-you-mean), the schema lists the choices. */
    public String name(String key, List<String> choices) {
        YamlNode c = get(key);
        String v = c.text().trim();
        if (recorder != null) {
            SchemaRecorder.Entry e = recorder.at(c.path);
            e.types.remove(SchemaRecorder.Type.TEXT);
            e.types.add(SchemaRecorder.Type.NAME);
            e.choices = List.copyOf(choices);
        }
        return v;
    }

    public String string(String key) {
        return get(key).text();
    }

    public String string(String key, String fallback) {
        return has(key) ? string(key) : fallback;
    }

    /** A quantity of the given kind, converted to SI. */
    public double quantity(UnitKind kind) {
        if (recorder != null) {
            SchemaRecorder.Entry e = recorder.at(path);
            e.types.remove(SchemaRecorder.Type.TEXT);
            e.types.add(SchemaRecorder.Type.QUANTITY);
            e.kind = kind;
        }
        try {
            return Quantities.parse(text(), kind, false);
        } catch (Quantities.BadQuantity e) {
            throw error(e.kind(), e.getMessage());
        }
    }

    public double quantity(String key, UnitKind kind) {
        return get(key).quantity(kind);
    }

    public double quantity(String key, UnitKind kind, double fallback) {
        return has(key) ? quantity(key, kind) : fallback;
    }

    /** A quantity within [lo, hi] (SI), with the message saying the allowed range in the user's words. */
    public double quantity(String key, UnitKind kind, double fallback, double lo, double hi, String range) {
        if (!has(key)) {
            return fallback;
        }
        YamlNode c = get(key);
        double v = c.quantity(kind);
        if (recorder != null) {
            recorder.at(c.path).range = range;
        }
        if (!(v >= lo && v <= hi)) {
            throw c.error(ErrorKind.OUT_OF_RANGE, "'" + c.text() + "' is out of range, expected " + range);
        }
        return v;
    }

    public double requiredQuantity(String key, UnitKind kind, double lo, double hi, String range) {
        get(key);
        return quantity(key, kind, Double.NaN, lo, hi, range);
    }

    /** A plain number (no unit) within [lo, hi]. */
    public double number(String key, double fallback, double lo, double hi) {
        if (!has(key)) {
            return fallback;
        }
        YamlNode c = get(key);
        if (recorder != null) {
            SchemaRecorder.Entry e = recorder.at(c.path);
            e.types.remove(SchemaRecorder.Type.TEXT);
            e.types.add(SchemaRecorder.Type.NUMBER);
            e.lo = lo;
            e.hi = hi;
        }
        double v;
        try {
            v = Quantities.parseNumber(c.text());
        } catch (IllegalArgumentException e) {
            throw c.error(ErrorKind.BAD_NUMBER, e.getMessage());
        }
        if (!(v >= lo && v <= hi)) {
            throw c.error(ErrorKind.OUT_OF_RANGE, "'" + c.text() + "' is out of range, expected a number in ["
                    + fmt(lo) + ", " + fmt(hi) + "]");
        }
        return v;
    }

    private static String fmt(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? String.valueOf((long) v) : String.valueOf(v);
    }

    /** A required plain number within [lo, hi]. */
    public double requiredNumber(String key, double lo, double hi) {
        get(key);
        return number(key, Double.NaN, lo, hi);
    }

    /** Rejects keys of this mapping that were never asked for. */
    public void finish() {
        for (Map.Entry<String, NodeTuple> e : entries.entrySet()) {
            if (!allowed.contains(e.getKey())) {
                String best = Names.closest(e.getKey(), allowed);
                throw new InputException(ErrorKind.UNKNOWN_KEY, file, join(path, e.getKey()),
                        line(e.getValue().getKeyNode()), "unknown key '" + e.getKey() + "'"
                        + (best != null ? " (did you mean '" + best + "'?)" : "")
                        + (allowed.isEmpty() ? "" : "; known keys: " + String.join(", ", allowed)));
            }
        }
    }

    public String describe() {
        if (node instanceof MappingNode) {
            return "a mapping";
        }
        if (node instanceof SequenceNode) {
            return "a list";
        }
        return "'" + ((ScalarNode) node).getValue() + "'";
    }
}
