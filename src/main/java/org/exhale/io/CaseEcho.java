package org.exhale.io;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Every value of a case file as written, with its kind of quantity and its SI value, in file
 * order. Meant for a file that {@link CaseYamlReader} has already accepted: it uses the same
 * unit tables ({@link Quantities}), so the SI value is the one the reader understood.
 */
public final class CaseEcho {
    /**
     * One value.
     *
     * @param path  key path, e.g. {@code polymer.components[1].Ea} (list items counted from 1)
     * @param given the text as written
     * @param kind  the kind of quantity, or null for names and choices
     * @param si    the value in SI units (NaN for names and choices)
     */
    public record Entry(String path, String given, UnitKind kind, double si) {
        /** The SI unit symbol ("" for plain numbers, names and choices). */
        public String siUnit() {
            return kind == null ? "" : kind.siSymbol();
        }
    }

    /** Kind of every quantity by key path with list indices removed. */
    private static final Map<String, UnitKind> KINDS = Map.ofEntries(
            Map.entry("polymer.density", UnitKind.DENSITY),
            Map.entry("polymer.free_volume", UnitKind.NUMBER),
            Map.entry("polymer.seed", UnitKind.NUMBER),
            Map.entry("polymer.components[].fraction", UnitKind.NUMBER),
            Map.entry("polymer.components[].n", UnitKind.NUMBER),
            Map.entry("polymer.components[].m", UnitKind.NUMBER),
            Map.entry("polymer.components[].A", UnitKind.FREQUENCY),
            Map.entry("polymer.components[].Ea", UnitKind.MOLAR_ENERGY),
            Map.entry("polymer.components[].char", UnitKind.NUMBER),
            Map.entry("polymer.components[].product.molar_mass", UnitKind.MOLAR_MASS),
            Map.entry("polymer.components[].product.diameter", UnitKind.LENGTH),
            Map.entry("polymer.components[].product.diffusivity", UnitKind.DIFFUSIVITY),
            Map.entry("cavity.width", UnitKind.LENGTH),
            Map.entry("cavity.height", UnitKind.LENGTH),
            Map.entry("cavity.length", UnitKind.LENGTH),
            Map.entry("cap.thickness", UnitKind.LENGTH),
            Map.entry("cap.porosity", UnitKind.NUMBER),
            Map.entry("cap.pore_radius", UnitKind.LENGTH),
            Map.entry("cap.permeability.Pi0", UnitKind.PERMEABILITY),
            Map.entry("cap.permeability.Ea", UnitKind.MOLAR_ENERGY),
            Map.entry("cap.youngs_modulus", UnitKind.STRESS),
            Map.entry("cap.poisson", UnitKind.NUMBER),
            Map.entry("cap.cte", UnitKind.THERMAL_EXPANSION),
            Map.entry("cap.stress_free_temperature", UnitKind.TEMPERATURE),
            Map.entry("cap.intrinsic_stress", UnitKind.STRESS),
            Map.entry("cap.strength", UnitKind.STRESS),
            Map.entry("cap.cohesive_energy", UnitKind.ENERGY_PER_AREA),
            Map.entry("cap.interface_energy", UnitKind.ENERGY_PER_AREA),
            Map.entry("substrate.cte", UnitKind.THERMAL_EXPANSION),
            Map.entry("ambient.pressure", UnitKind.PRESSURE),
            Map.entry("ambient.viscosity", UnitKind.VISCOSITY),
            Map.entry("ambient.diffusivity.D", UnitKind.DIFFUSIVITY),
            Map.entry("ambient.diffusivity.temperature", UnitKind.TEMPERATURE),
            Map.entry("ambient.diffusivity.pressure", UnitKind.PRESSURE),
            Map.entry("wafer.lag", UnitKind.TIME),
            Map.entry("wafer.spread", UnitKind.TEMPERATURE_DIFFERENCE),
            Map.entry("limits.ceiling", UnitKind.TEMPERATURE),
            Map.entry("limits.residue", UnitKind.FRACTION),
            Map.entry("limits.max_pressure", UnitKind.PRESSURE),
            Map.entry("limits.safety_factor", UnitKind.NUMBER),
            Map.entry("limits.max_deflection", UnitKind.LENGTH),
            Map.entry("limits.thermal_dose.Ea", UnitKind.MOLAR_ENERGY),
            Map.entry("limits.thermal_dose.reference", UnitKind.TEMPERATURE),
            Map.entry("limits.thermal_dose.max", UnitKind.TIME),
            Map.entry("tool.max_ramp_up", UnitKind.HEATING_RATE),
            Map.entry("tool.max_ramp_down", UnitKind.HEATING_RATE),
            Map.entry("tool.setpoint_step", UnitKind.TEMPERATURE_DIFFERENCE),
            Map.entry("tool.time_step", UnitKind.TIME),
            Map.entry("tool.min_step", UnitKind.TIME),
            Map.entry("tool.max_steps", UnitKind.NUMBER),
            Map.entry("tool.unload", UnitKind.TEMPERATURE),
            Map.entry("recipe.start", UnitKind.TEMPERATURE),
            Map.entry("recipe.steps[].ramp.to", UnitKind.TEMPERATURE),
            Map.entry("recipe.steps[].ramp.rate", UnitKind.HEATING_RATE),
            Map.entry("recipe.steps[].hold", UnitKind.TIME));

    private CaseEcho() {
    }

    /** The values of a case file's text, in file order. */
    public static List<Entry> entries(byte[] bytes) {
        String text = new String(bytes, StandardCharsets.UTF_8);
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        LoaderOptions options = new LoaderOptions();
        options.setMaxAliasesForCollections(20);
        options.setNestingDepthLimit(20);
        Node root = new Yaml(options).compose(new StringReader(text));
        List<Entry> out = new ArrayList<>();
        if (root != null) {
            walk(root, "", "", out);
        }
        return out;
    }

    /** Every key path with a unit kind that a case file may hold (list indices removed, e.g. {@code recipe.steps[].hold}). */
    public static java.util.Set<String> knownPaths() {
        return KINDS.keySet();
    }

    /** The key path of an entry with list indices removed. */
    public static String pattern(String path) {
        return path.replaceAll("\\[\\d+]", "[]");
    }

    /** The kind of quantity at a key path (list indices removed), or null. */
    public static UnitKind kindAt(String pathWithoutIndices) {
        return KINDS.get(pathWithoutIndices);
    }

    private static void walk(Node node, String path, String pattern, List<Entry> out) {
        if (node instanceof MappingNode m) {
            for (NodeTuple t : m.getValue()) {
                String key = ((ScalarNode) t.getKeyNode()).getValue();
                walk(t.getValueNode(), path.isEmpty() ? key : path + "." + key,
                        pattern.isEmpty() ? key : pattern + "." + key, out);
            }
        } else if (node instanceof SequenceNode s) {
            int i = 0;
            for (Node n : s.getValue()) {
                walk(n, path + "[" + (++i) + "]", pattern + "[]", out);
            }
        } else if (node instanceof ScalarNode s) {
            UnitKind kind = KINDS.get(pattern);
            double si = Double.NaN;
            if (kind != null) {
                try {
                    si = Quantities.parse(s.getValue(), kind, false);
                } catch (IllegalArgumentException notAQuantity) {
                    kind = null;   // e.g. tortuosity: bruggeman; shown as written
                }
            }
            out.add(new Entry(path, s.getValue(), kind, si));
        }
    }
}
