package org.exhale.io;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Polymer;
import org.exhale.kinetics.Product;
import org.exhale.kinetics.ReactionModel;
import org.exhale.mechanics.CapStructure;
import org.exhale.mechanics.FilmProperties;
import org.exhale.mechanics.SpanGeometry.Shape;
import org.exhale.planning.Tool;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.Cavity;
import org.exhale.simulation.Limits;
import org.exhale.simulation.ThermalDose;
import org.exhale.simulation.Wafer;
import org.exhale.transport.Ambient;
import org.exhale.transport.CapFilm;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.reader.ReaderException;

/**
 * Reads a case file (YAML with engineering units, see docs/case-file.md). Loading is safe: the
 * YAML is only composed into nodes (no object construction, no tags), aliases of collections are
 * refused, nesting, size and alias counts are capped. Every error is an {@link InputException}
 * naming the file, the key path and the line.
 */
public final class CaseYamlReader {
    /** Largest case file accepted [bytes]. */
    public static final long MAX_BYTES = 1 << 20;
    static final double C0 = PhysicalConstants.ZERO_CELSIUS_K;

    private final List<String> defaults = new ArrayList<>();
    private final List<String> warnings = new ArrayList<>();

    /** Records what the reader asks of each key, for the generated schema; null when not recording. */
    private final SchemaRecorder recorder;

    private CaseYamlReader() {
        this(null);
    }

    private CaseYamlReader(SchemaRecorder recorder) {
        this.recorder = recorder;
    }

    /** Reads a case while recording every key the reader asks for (see {@link CaseSchema}). */
    static CaseFile record(String name, byte[] bytes, SchemaRecorder recorder) {
        return new CaseYamlReader(recorder).readText(name, decode(name, bytes));
    }

    public static CaseFile read(Path path) {
        return parse(path.toString(), readBytes(path, "a case file is a few KiB"));
    }

    /** The bytes of a YAML input file, refused when missing, unreadable or over {@link #MAX_BYTES}. */
    private static byte[] readBytes(Path path, String sizeHint) {
        String name = path.toString();
        try {
            if (!Files.isRegularFile(path)) {
                throw new InputException(ErrorKind.FILE_UNREADABLE, name, "", 0, notRegular(path));
            }
            if (Files.size(path) > MAX_BYTES) {
                throw new InputException(ErrorKind.TOO_LARGE, name, "", 0,
                        "file is larger than " + (MAX_BYTES >> 10) + " KiB; " + sizeHint);
            }
            return Files.readAllBytes(path);
        } catch (IOException e) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, name, "", 0, "cannot read: " + Messages.of(e));
        }
    }

    /** Why a path that is not a regular file cannot be read: absent, a folder, or a device, pipe or socket. */
    public static String notRegular(Path path) {
        if (Files.isDirectory(path)) {
            return "is a folder; expected a file";
        }
        if (Files.exists(path)) {
            return "is not a regular file (a device, pipe or socket); expected a file";
        }
        return "no such file";
    }

    public static CaseFile parse(String name, byte[] bytes) {
        if (bytes.length > MAX_BYTES) {
            throw new InputException(ErrorKind.TOO_LARGE, name, "", 0,
                    "file is larger than " + (MAX_BYTES >> 10) + " KiB; a case file is a few KiB");
        }
        String text = decode(name, bytes);
        return new CaseYamlReader().readText(name, text);
    }

    private static String decode(String name, byte[] bytes) {
        for (byte b : bytes) {
            if (b == 0) {
                throw new InputException(ErrorKind.SYNTAX, name, "", 0, "not a text file (contains NUL bytes)");
            }
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(java.nio.ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new InputException(ErrorKind.SYNTAX, name, "", 0, "not UTF-8 text");
        }
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        if (text.isBlank()) {
            throw new InputException(ErrorKind.EMPTY_FILE, name, "", 0, "the file is empty; expected a case (see 'exhale new')");
        }
        return text;
    }

    /** Composes YAML text into nodes, safely (no object construction, capped aliases, nesting and size). */
    private static Node compose(String name, String text) {
        LoaderOptions options = new LoaderOptions();
        options.setMaxAliasesForCollections(20);
        options.setNestingDepthLimit(20);
        options.setCodePointLimit((int) MAX_BYTES);
        options.setAllowDuplicateKeys(false);
        options.setProcessComments(false);
        Node node;
        try {
            node = new Yaml(options).compose(new StringReader(text));
        } catch (MarkedYAMLException e) {
            int line = e.getProblemMark() == null ? 0 : e.getProblemMark().getLine() + 1;
            String problem = e.getProblem() == null ? "invalid YAML" : e.getProblem();
            String lower = problem.toLowerCase(java.util.Locale.ROOT);
            // "found undefined alias" is a syntax error, not a bomb.
            throw new InputException(lower.contains("exceed") ? ErrorKind.TOO_LARGE : ErrorKind.SYNTAX,
                    name, "", line, "invalid YAML: " + problem);
        } catch (ReaderException e) {
            throw new InputException(ErrorKind.SYNTAX, name, "", lineAt(text, e.getPosition()), "invalid YAML: character "
                    + String.format(java.util.Locale.ROOT, "U+%04X", e.getCodePoint()) + " is not allowed in a YAML file");
        } catch (YAMLException e) {
            String msg = String.valueOf(e.getMessage());
            String lower = msg.toLowerCase(java.util.Locale.ROOT);
            throw new InputException(lower.contains("limit") || lower.contains("alias") || lower.contains("depth")
                    ? ErrorKind.TOO_LARGE : ErrorKind.SYNTAX, name, "", 0, "invalid YAML: " + firstLine(msg));
        }
        if (node == null) {
            throw new InputException(ErrorKind.EMPTY_FILE, name, "", 0, "the file holds no YAML document");
        }
        return node;
    }

    private CaseFile readText(String name, String text) {
        Node node = compose(name, text);
        YamlNode root = YamlNode.root(name, node, recorder);
        if (!root.isMapping()) {
            throw root.error(ErrorKind.WRONG_TYPE, "a case file is a mapping of sections (polymer, cavity, cap, ...), found "
                    + root.describe());
        }
        String caseName = root.string("name", "");
        Ambient ambient = ambient(root.has("ambient") ? root.section("ambient") : null);
        Polymer polymer = polymer(root.section("polymer"));
        Cavity cavity = cavity(root.section("cavity"));
        YamlNode capNode = root.section("cap");
        CapFilm cap = capFilm(capNode);
        FilmProperties film = film(capNode);
        double substrateCte = CapStructure.SILICON_CTE_PER_K;
        if (root.has("substrate")) {
            YamlNode sub = root.section("substrate");
            substrateCte = sub.quantity("cte", UnitKind.THERMAL_EXPANSION, substrateCte, -1e-4, 1e-3,
                    "a thermal expansion coefficient such as 2.6 ppm/K");
            sub.finish();
        } else if (film != null) {
            defaults.add("substrate.cte = 2.6 ppm/K (silicon)");
        }
        Wafer wafer = wafer(root.has("wafer") ? root.section("wafer") : null);
        Limits limits = limits(root.section("limits"));
        Recipe recipe = root.has("recipe") ? recipe(root.section("recipe")) : null;
        Tool tool = root.has("tool") ? tool(root.section("tool")) : null;
        org.exhale.simulation.Chamber chamber = root.has("chamber") ? chamber(root.section("chamber")) : null;
        YamlNode uncertaintyNode = root.has("uncertainty") ? root.section("uncertainty") : null;
        root.allow("name", "substrate", "ambient", "wafer", "recipe", "tool", "chamber", "uncertainty");
        root.finish();
        double cte = substrateCte;
        BakeCase bake = build(root, () -> new BakeCase(caseName, polymer, cavity, cap, film, cte,
                ambient, wafer, limits, recipe, chamber));
        // The simulation makes the cap structure; make it here once so that its checks (a cap
        // thicker than 100 spans, ...) are input errors, not an internal error mid-run.
        build(capNode.get("thickness"), bake::capStructure);
        plausibility(bake);
        org.exhale.studies.Uncertainty uncertainty = uncertaintyNode == null ? null : uncertainty(uncertaintyNode, bake);
        return new CaseFile(name, bake, tool, defaults, warnings, uncertainty);
    }

    /** The 1-based line of the code point at {@code position}, or 0 if it is out of the text. */
    private static int lineAt(String text, int position) {
        if (position < 0 || position > text.codePointCount(0, text.length())) {
            return 0;
        }
        int end = text.offsetByCodePoints(0, position);
        int line = 1;
        for (int i = 0; i < end; i++) {
            if (text.charAt(i) == '\n') {
                line++;
            }
        }
        return line;
    }

    private static String firstLine(String s) {
        int i = s.indexOf('\n');
        return i < 0 ? s : s.substring(0, i);
    }

    private static <T> T build(YamlNode at, Supplier<T> make) {
        try {
            return make.get();
        } catch (IllegalArgumentException e) {
            throw at.error(ErrorKind.INCONSISTENT, e.getMessage());
        }
    }

    /**
     * Makes a record from values read with range checks; where the record's own bound is stricter
     * (an open end the reader allows), the record's message is still an {@link ErrorKind#OUT_OF_RANGE}
     * at this node, never a raw IllegalArgumentException.
     */
    private static <T> T within(YamlNode at, Supplier<T> make) {
        try {
            return make.get();
        } catch (IllegalArgumentException e) {
            throw at.error(ErrorKind.OUT_OF_RANGE, e.getMessage());
        }
    }

    // ---------------------------------------------------------------- polymer

    private Polymer polymer(YamlNode p) {
        double density = p.requiredQuantity("density", UnitKind.DENSITY, 10, 30_000, "a density in (0.01, 30) g/cm3");
        double freeVolume = p.has("free_volume") ? p.quantity("free_volume", UnitKind.FRACTION, 0, 0, 1,
                "a fraction in [0, 1] such as 0.02 or 2 %") : Polymer.DEFAULT_FREE_VOLUME;
        if (!p.has("free_volume")) {
            defaults.add("polymer.free_volume = 0.02");
        }
        double seed = p.number("seed", Polymer.DEFAULT_SEED, 1e-12, 1e-2);
        List<YamlNode> items = p.list("components");
        if (items.isEmpty()) {
            throw p.get("components").error(ErrorKind.MISSING_KEY, "the polymer needs at least one component");
        }
        List<Component> comps = new ArrayList<>();
        java.util.Set<String> names = new java.util.HashSet<>();
        int index = 0;
        for (YamlNode c : items) {
            index++;
            Component comp = component(c, index, items.size() == 1);
            if (!names.add(comp.name())) {
                throw (c.has("name") ? c.get("name") : c).error(ErrorKind.INCONSISTENT,
                        "component name '" + comp.name() + "' is used twice");
            }
            comps.add(comp);
        }
        double sum = comps.stream().mapToDouble(Component::fraction).sum();
        if (Math.abs(sum - 1) > 1e-6) {
            throw p.get("components").error(ErrorKind.INCONSISTENT,
                    "component fractions sum to " + String.format(java.util.Locale.ROOT, "%.6g", sum) + ", expected 1");
        }
        p.allow("diffusivity");
        p.finish();
        return build(p, () -> new Polymer(density, freeVolume, comps, seed));
    }

    private Component component(YamlNode c, int index, boolean single) {
        if (!c.isMapping()) {
            throw c.error(ErrorKind.WRONG_TYPE, "a component is a mapping {name, fraction, model, A, Ea, product}, found "
                    + c.describe());
        }
        String name = c.has("name") ? c.string("name").trim() : "c" + index;
        if (name.isEmpty() || !name.matches("[A-Za-z0-9 _.+-]{1,40}")) {
            throw c.get("name").error(ErrorKind.OUT_OF_RANGE,
                    "component name '" + name + "' must be 1–40 letters, digits, spaces or _ . + -");
        }
        String fractionRange = "a fraction in (0, 1] such as 0.8 or 80 %";
        double fraction = single ? c.quantity("fraction", UnitKind.FRACTION, 1, 1e-9, 1, fractionRange)
                : c.requiredQuantity("fraction", UnitKind.FRACTION, 1e-9, 1, fractionRange);
        ReactionModel model = model(c);
        double a = c.requiredQuantity("A", UnitKind.FREQUENCY, 1e-10, 1e40, "a pre-exponential factor in (1e-10, 1e40) 1/s");
        double e = c.requiredQuantity("Ea", UnitKind.MOLAR_ENERGY, 1e3, 1e6, "an activation energy in (1, 1000) kJ/mol");
        double ch = c.quantity("char", UnitKind.FRACTION, 0, 0, 0.999, "a fraction in [0, 0.999] such as 0.05 or 5 %");
        YamlNode pr = c.section("product");
        double m = pr.requiredQuantity("molar_mass", UnitKind.MOLAR_MASS, 2e-3, 10, "a molar mass in [2, 10000] g/mol");
        double d = pr.requiredQuantity("diameter", UnitKind.LENGTH, 1e-11, 1e-8, "a kinetic diameter in [0.01, 10] nm");
        double dm = pr.quantity("diffusivity", UnitKind.DIFFUSIVITY, ambientDiffusivity, 1e-12, 1,
                "a diffusivity in (1e-12, 1) m2/s");
        // the product's own solution–diffusion permeability through the cap's solid; the cap's is the default
        double pi0 = Double.NaN;
        double ePi = Double.NaN;
        if (pr.has("permeability")) {
            YamlNode p = pr.section("permeability");
            pi0 = p.requiredQuantity("Pi0", UnitKind.PERMEABILITY, 0, Math.nextDown(1.0), "a permeability in [0, 1) mol/(m s Pa)");
            ePi = p.quantity("Ea", UnitKind.MOLAR_ENERGY, 0, 0, 1e6, "an activation energy in [0, 1000] kJ/mol");
            p.finish();
        }
        pr.finish();
        c.finish();
        double fpi0 = pi0;
        double fePi = ePi;
        return build(c, () -> new Component(name, fraction, model, a, e, ch, new Product(m, d, dm, fpi0, fePi)));
    }

    private static ReactionModel model(YamlNode c) {
        String id = c.name("model", List.of("nth-order", "sestak-berggren", "avrami-erofeev", "random-scission"));
        YamlNode at = c.get("model");
        try {
            return switch (id) {
                case "nth-order" -> new ReactionModel.NthOrder(c.number("n", 1, 1e-3, 10));
                case "sestak-berggren" -> new ReactionModel.SestakBerggren(c.number("m", 0, 0, 5), c.number("n", 1, 1e-3, 10));
                case "avrami-erofeev" -> new ReactionModel.AvramiErofeev(c.requiredNumber("n", 0.5, 4));
                case "random-scission" -> new ReactionModel.RandomScission();
                default -> {
                    List<String> known = List.of("nth-order", "sestak-berggren", "avrami-erofeev", "random-scission");
                    String best = Names.closest(id, known);
                    throw at.error(ErrorKind.UNKNOWN_NAME, "unknown reaction model '" + id + "'"
                            + (best != null ? " (did you mean '" + best + "'?)" : "") + "; known: " + String.join(", ", known));
                }
            };
        } catch (IllegalArgumentException e) {
            throw at.error(ErrorKind.OUT_OF_RANGE, e.getMessage());
        }
    }

    // ---------------------------------------------------------------- structure

    private Cavity cavity(YamlNode c) {
        String shapeText = c.name("shape", List.of("line", "rectangle", "disc"));
        Shape shape;
        switch (shapeText) {
            case "line" -> shape = Shape.LINE;
            case "rectangle" -> shape = Shape.RECTANGLE;
            case "disc", "disk", "circle" -> shape = Shape.DISC;
            default -> {
                String best = Names.closest(shapeText, List.of("line", "rectangle", "disc"));
                throw c.get("shape").error(ErrorKind.UNKNOWN_NAME, "unknown cavity shape '" + shapeText + "'"
                        + (best != null ? " (did you mean '" + best + "'?)" : "") + "; known: line, rectangle, disc");
            }
        }
        double w = c.requiredQuantity("width", UnitKind.LENGTH, 1e-9, 0.1, "a width in [1 nm, 100 mm]");
        double h = c.requiredQuantity("height", UnitKind.LENGTH, 1e-9, 0.01, "a height in [1 nm, 10 mm]");
        double l = w;
        if (shape == Shape.RECTANGLE) {
            l = c.requiredQuantity("length", UnitKind.LENGTH, w, 1, "a length at least the width " + Numbers.sig(w * 1e9, 6) + " nm");
        } else if (c.has("length")) {
            throw c.get("length").error(ErrorKind.INCONSISTENT, "length is only for shape: rectangle");
        }
        c.finish();
        double lf = l;
        return build(c, () -> new Cavity(shape, w, lf, h));
    }

    private CapFilm capFilm(YamlNode c) {
        double h = c.requiredQuantity("thickness", UnitKind.LENGTH, 1e-9, 1e-3, "a thickness in [1 nm, 1 mm]");
        double e = c.requiredQuantity("porosity", UnitKind.FRACTION, 0, 0.999, "a porosity in [0, 0.999] such as 0.3 or 30 %");
        double r = e > 0 ? c.requiredQuantity("pore_radius", UnitKind.LENGTH, 1e-11, 1e-4, "a pore radius in [0.01 nm, 100 um]")
                : c.quantity("pore_radius", UnitKind.LENGTH, 0, 0, 1e-4, "a pore radius in [0, 100 um]");
        double tau = Double.NaN;
        if (c.has("tortuosity")) {
            String t = c.string("tortuosity").trim();
            if (t.equals("bruggeman")) {
                c.name("tortuosity", List.of("bruggeman"));
            } else {
                tau = c.number("tortuosity", 1, 1, 1000);
            }
        } else if (e > 0) {
            defaults.add("cap.tortuosity = bruggeman (porosity^-1/2)");
        }
        double pi0 = 0;
        double ePi = 0;
        if (c.has("permeability")) {
            YamlNode p = c.section("permeability");
            pi0 = p.quantity("Pi0", UnitKind.PERMEABILITY, 0, 0, Math.nextDown(1.0), "a permeability in [0, 1) mol/(m s Pa)");
            ePi = p.quantity("Ea", UnitKind.MOLAR_ENERGY, 0, 0, 1e6, "an activation energy in [0, 1000] kJ/mol");
            p.finish();
        }
        double fpi0 = pi0;
        double fePi = ePi;
        double ft = tau;
        return build(c, () -> new CapFilm(h, e, r, ft, fpi0, fePi));
    }

    private static final List<String> MECHANICAL_KEYS = List.of("youngs_modulus", "poisson", "cte",
            "stress_free_temperature", "intrinsic_stress", "strength", "cohesive_energy", "interface_energy");

    private FilmProperties film(YamlNode c) {
        boolean any = MECHANICAL_KEYS.stream().anyMatch(c::has);
        if (!any) {
            c.finish();
            return null;
        }
        double e = c.requiredQuantity("youngs_modulus", UnitKind.STRESS, 1e6, 2e12, "a modulus in [1 MPa, 2000 GPa]");
        double nu = c.number("poisson", 0.25, 0, 0.499);
        if (!c.has("poisson")) {
            defaults.add("cap.poisson = 0.25");
        }
        double cte = c.requiredQuantity("cte", UnitKind.THERMAL_EXPANSION, -1e-4, 1e-3, "a CTE such as 12 ppm/K");
        double t0 = c.requiredQuantity("stress_free_temperature", UnitKind.TEMPERATURE, 1, 3000, "a temperature such as 350 C");
        double si = c.quantity("intrinsic_stress", UnitKind.STRESS, 0, -1e10, 1e10, "a stress in [-10, 10] GPa");
        double sf = c.quantity("strength", UnitKind.STRESS, FilmProperties.NOT_GIVEN, 1e3, 1e11, "a strength in (1 kPa, 100 GPa]");
        double gc = c.quantity("cohesive_energy", UnitKind.ENERGY_PER_AREA, FilmProperties.NOT_GIVEN, 1e-4, 1e4,
                "a fracture energy in [1e-4, 1e4] J/m2");
        double gi = c.quantity("interface_energy", UnitKind.ENERGY_PER_AREA, FilmProperties.NOT_GIVEN, 1e-4, 1e4,
                "a fracture energy in [1e-4, 1e4] J/m2");
        c.finish();
        return build(c, () -> new FilmProperties(e, nu, cte, t0, si, sf, gc, gi));
    }

    // ---------------------------------------------------------------- ambient, wafer, limits

    private double ambientDiffusivity = org.exhale.transport.Ambient.DEFAULT_DIFFUSIVITY_M2_PER_S;
    private boolean ambientDiffusivityGiven;

    private Ambient ambient(YamlNode a) {
        if (a == null) {
            defaults.add("ambient = nitrogen at 101.325 kPa, viscosity 3.0e-5 Pa s, diffusivity 1.0e-5 m2/s at 25 C");
            return new Ambient(PhysicalConstants.STANDARD_ATMOSPHERE_PA, Ambient.DEFAULT_VISCOSITY_PA_S, C0 + 25,
                    PhysicalConstants.STANDARD_ATMOSPHERE_PA);
        }
        double p = a.requiredQuantity("pressure", UnitKind.PRESSURE, 0, 1e8, "a pressure in [0, 100 MPa] (0 for vacuum)");
        double mu = a.quantity("viscosity", UnitKind.VISCOSITY, Ambient.DEFAULT_VISCOSITY_PA_S, 1e-7, 1, "a viscosity in [1e-7, 1] Pa s");
        if (!a.has("viscosity")) {
            defaults.add("ambient.viscosity = 3.0e-5 Pa s");
        }
        double tRef = C0 + 25;
        double pRef = PhysicalConstants.STANDARD_ATMOSPHERE_PA;
        if (a.has("diffusivity")) {
            YamlNode d = a.section("diffusivity");
            ambientDiffusivity = d.requiredQuantity("D", UnitKind.DIFFUSIVITY, 1e-12, 1, "a diffusivity in (1e-12, 1) m2/s");
            tRef = d.quantity("temperature", UnitKind.TEMPERATURE, tRef, 1, 3000, "a temperature");
            pRef = d.quantity("pressure", UnitKind.PRESSURE, pRef, 1, 1e8, "a pressure above 0");
            ambientDiffusivityGiven = true;
            d.finish();
        } else if (p > 0) {
            defaults.add("ambient.diffusivity = 1.0e-5 m2/s at 25 C, 101.325 kPa");
        }
        a.finish();
        double fp = p;
        double ft = tRef;
        double fpr = pRef;
        return build(a, () -> new Ambient(fp, mu, ft, fpr));
    }

    private Wafer wafer(YamlNode w) {
        if (w == null) {
            defaults.add("wafer.lag = 0 s, wafer.spread = 0 K");
            return Wafer.ideal();
        }
        double lag = w.quantity("lag", UnitKind.TIME, 0, 0, 1e5, "a time constant in [0, 1e5] s");
        double spread = w.quantity("spread", UnitKind.TEMPERATURE_DIFFERENCE, 0, 0, 199, "a spread in [0, 200) K");
        w.finish();
        return within(w, () -> new Wafer(lag, spread));
    }

    private Limits limits(YamlNode l) {
        double ceiling = l.requiredQuantity("ceiling", UnitKind.TEMPERATURE, C0 + 20, C0 + 1500, "a temperature in [20, 1500] C");
        double residue = explicitFraction(l, "residue", Limits.DEFAULT_RESIDUE, 0.5, "a residue such as 0.5 %");
        if (!l.has("residue")) {
            defaults.add("limits.residue = 0.5 %");
        }
        double pmax = l.quantity("max_pressure", UnitKind.PRESSURE, Double.POSITIVE_INFINITY, 1e-6, 1e10, "a pressure above 0");
        ThermalDose dose = null;
        if (l.has("thermal_dose")) {
            YamlNode d = l.section("thermal_dose");
            double ea = d.requiredQuantity("Ea", UnitKind.MOLAR_ENERGY, 1e3, 1e6, "an activation energy in (1, 1000) kJ/mol");
            double ref = d.requiredQuantity("reference", UnitKind.TEMPERATURE, 1, 3000, "a temperature such as 400 C");
            double max = d.requiredQuantity("max", UnitKind.TIME, 1, 1e8, "a time such as 2 h");
            d.finish();
            dose = within(d, () -> new ThermalDose(ea, ref, max));
        }
        double sf = l.number("safety_factor", 1, 1, 99);
        double dmax = l.quantity("max_deflection", UnitKind.LENGTH, Double.POSITIVE_INFINITY, 1e-12, 1, "a length above 0");
        l.finish();
        ThermalDose fd = dose;
        return build(l, () -> new Limits(ceiling, residue, pmax, fd, sf, dmax));
    }

    /**
     * A fraction that must carry '%' or 'ppm': a bare 0.5 could mean 0.5 % or 50 %, and for a residue
     * target or an exhaust limit the difference matters.
     */
    private static double explicitFraction(YamlNode n, String key, double fallback, double hi, String example) {
        if (!n.has(key)) {
            return fallback;
        }
        n.get(key).unitRequired();
        String text = n.get(key).text().trim();
        if (!(text.endsWith("%") || text.endsWith("ppm"))) {
            throw n.get(key).error(ErrorKind.BAD_UNIT, "'" + text + "' has no unit; write it with % or ppm, e.g. " + example
                    + " (a bare number would be ambiguous)");
        }
        return n.quantity(key, UnitKind.FRACTION, fallback, 1e-12, hi, example);
    }

    // ---------------------------------------------------------------- recipe and tool

    private static Recipe recipe(YamlNode r) {
        double start = r.requiredQuantity("start", UnitKind.TEMPERATURE, 1, 3000, "a temperature such as 150 C");
        List<YamlNode> items = r.list("steps");
        if (items.isEmpty()) {
            throw r.get("steps").error(ErrorKind.MISSING_KEY, "the recipe needs at least one step");
        }
        List<Step> steps = new ArrayList<>();
        double current = start;
        for (YamlNode s : items) {
            if (!s.isMapping() || s.keys().size() != 1) {
                throw s.error(ErrorKind.WRONG_TYPE, "a step is either 'ramp: {to: .., rate: ..}' or 'hold: <time>'");
            }
            if (s.has("ramp")) {
                YamlNode ramp = s.section("ramp");
                double to = ramp.requiredQuantity("to", UnitKind.TEMPERATURE, 1, 3000, "a temperature such as 300 C");
                double rate = ramp.requiredQuantity("rate", UnitKind.HEATING_RATE, 1e-9, 100, "a positive rate such as 5 C/min");
                ramp.finish();
                if (Math.abs(to - current) < 1e-9) {
                    throw ramp.get("to").error(ErrorKind.INCONSISTENT, "the ramp ends where it starts ("
                            + fmtC(current) + "); use a hold");
                }
                steps.add(within(ramp, () -> new Step.Ramp(to, rate)));
                current = to;
            } else if (s.has("hold")) {
                YamlNode h = s.get("hold");
                double d = h.quantity(UnitKind.TIME);
                if (!(d > 0 && d < 1e7)) {
                    throw h.error(ErrorKind.OUT_OF_RANGE, "a hold must last more than 0 s (and under 1e7 s), got '" + h.text() + "'");
                }
                steps.add(new Step.Hold(d));
            } else {
                String key = s.keys().iterator().next();
                String best = Names.closest(key, List.of("ramp", "hold"));
                throw s.error(ErrorKind.UNKNOWN_KEY, "unknown step '" + key + "'" + (best != null ? " (did you mean '" + best + "'?)" : "")
                        + "; a step is 'ramp' or 'hold'");
            }
            s.finish();
        }
        r.finish();
        return build(r, () -> new Recipe(start, steps));
    }

    static String fmtC(double k) {
        return String.format(java.util.Locale.ROOT, "%.6g C", k - C0);
    }

    static final String SETPOINT_STEP_RANGE = "a resolution of 0 (continuous) or in [0.001, 50] K";
    static final String TIME_STEP_RANGE = "a resolution of 0 (continuous) or in [1 ms, 600 s]";

    private Tool tool(YamlNode t) {
        double up = t.requiredQuantity("max_ramp_up", UnitKind.HEATING_RATE, 1e-6, 100, "a rate such as 10 C/min");
        double down = t.quantity("max_ramp_down", UnitKind.HEATING_RATE, up, 1e-6, 100, "a rate such as 5 C/min");
        double sp = t.quantity("setpoint_step", UnitKind.TEMPERATURE_DIFFERENCE, 1, 0, 50, SETPOINT_STEP_RANGE);
        double ts = t.quantity("time_step", UnitKind.TIME, 1, 0, 600, TIME_STEP_RANGE);
        // a resolution finer than the tool's clock or thermocouple can mean nothing, and setpoints
        // rounded to 1e-308 K overflow: 0 (continuous) or at least 1 mK and 1 ms
        if (sp > 0 && sp < 1e-3) {
            throw t.get("setpoint_step").error(ErrorKind.OUT_OF_RANGE, "'" + t.get("setpoint_step").text()
                    + "' is out of range, expected " + SETPOINT_STEP_RANGE);
        }
        if (ts > 0 && ts < 1e-3) {
            throw t.get("time_step").error(ErrorKind.OUT_OF_RANGE, "'" + t.get("time_step").text()
                    + "' is out of range, expected " + TIME_STEP_RANGE);
        }
        double ms = t.quantity("min_step", UnitKind.TIME, 30, 0, 36_000, "a time in [0, 10 h]");
        int n = (int) t.number("max_steps", 12, 2, 100);
        if (t.has("max_steps") && t.number("max_steps", 12, 2, 100) != n) {
            throw t.get("max_steps").error(ErrorKind.BAD_NUMBER, "max_steps must be a whole number");
        }
        double unload = t.quantity("unload", UnitKind.TEMPERATURE, Double.NaN, 1, 3000, "a temperature such as 150 C");
        double overshoot = t.quantity("overshoot", UnitKind.TEMPERATURE_DIFFERENCE, 0, 0, 50,
                "a temperature difference in [0, 50] K such as 2 K");
        t.finish();
        return build(t, () -> new Tool(up, down, sp, ts, ms, n, unload, overshoot));
    }

    // ---------------------------------------------------------------- chamber

    private org.exhale.simulation.Chamber chamber(YamlNode c) {
        int wafers = (int) c.requiredNumber("wafers", 1, 10_000);
        if (wafers != c.requiredNumber("wafers", 1, 10_000)) {
            throw c.get("wafers").error(ErrorKind.BAD_NUMBER, "wafers must be a whole number");
        }
        double d = c.requiredQuantity("wafer_diameter", UnitKind.LENGTH, 1e-3, 1, "a diameter such as 300 mm");
        double fp = c.quantity("pattern_fraction", UnitKind.FRACTION, 1, 1e-6, 1, "a fraction in (0, 1]");
        double fc = c.quantity("cavity_fraction", UnitKind.FRACTION, 1, 1e-6, 1, "a fraction in (0, 1]");
        double v = c.requiredQuantity("volume", UnitKind.VOLUME, 1e-6, 999, "a volume such as 60 L");
        double t = c.requiredQuantity("temperature", UnitKind.TEMPERATURE, 1, 2999, "a temperature such as 250 C");
        double p = c.requiredQuantity("pressure", UnitKind.PRESSURE, 1, 1e7 - 1, "a pressure above 0 such as 101.325 kPa");
        double f = c.requiredQuantity("purge", UnitKind.STANDARD_FLOW, 1e-9, 999, "a purge flow such as 10 slm");
        double limit = Double.NaN;
        String label = "";
        if (c.has("limit")) {
            limit = explicitFraction(c, "limit", Double.NaN, 0.999, "a concentration such as 1000 ppm");
            label = c.string("limit").trim();
            if (c.has("lel")) {
                throw c.get("lel").error(ErrorKind.INCONSISTENT, "give either 'limit' or 'lel' with 'lel_fraction', not both");
            }
        } else if (c.has("lel")) {
            double lel = explicitFraction(c, "lel", Double.NaN, 0.999, "a lower explosive limit such as 2 %");
            double frac = explicitFraction(c, "lel_fraction", 0.25, 1, "a fraction of the LEL such as 25 %");
            if (!c.has("lel_fraction")) {
                defaults.add("chamber.lel_fraction = 25 %");
            }
            limit = lel * frac;
            label = Numbers.sig(frac * 100, 3) + " % of LEL " + Numbers.sig(lel * 100, 3) + " %";
        } else {
            c.allow("lel_fraction");
        }
        c.finish();
        double fl = limit;
        String fLabel = label;
        return build(c, () -> new org.exhale.simulation.Chamber(wafers, d, fp, fc, v, t, p, f, fl, fLabel));
    }

    // ---------------------------------------------------------------- uncertainty

    /**
     * The uncertainty section (docs: studies-demo.md): standard deviations, each optional (0: not
     * uncertain); {@code components} overrides the kinetics' spread per component name.
     */
    private static org.exhale.studies.Uncertainty uncertainty(YamlNode u, BakeCase bake) {
        org.exhale.studies.Uncertainty.Kinetics all = kinetics(u);
        java.util.Map<String, org.exhale.studies.Uncertainty.Kinetics> per = new java.util.LinkedHashMap<>();
        if (u.has("components")) {
            YamlNode cs = u.section("components").keyedByName();
            List<String> names = bake.polymer().components().stream().map(Component::name).toList();
            for (String n : cs.keys()) {
                if (!names.contains(n)) {
                    String best = Names.closest(n, names);
                    throw cs.get(n).error(ErrorKind.UNKNOWN_NAME, "no component named '" + n + "'"
                            + (best != null ? " (did you mean '" + best + "'?)" : "") + "; components: " + String.join(", ", names));
                }
                YamlNode c = cs.section(n);
                per.put(n, kinetics(c));
                c.finish();
            }
            cs.finish();
        }
        double porosity = u.number("porosity_sd", 0, 0, 0.5);
        if (porosity > 0 && bake.cap().porosity() == 0) {
            throw u.get("porosity_sd").error(ErrorKind.INCONSISTENT, "the cap is dense (porosity 0): no porosity to vary");
        }
        double radius = u.quantity("pore_radius_sd", UnitKind.LENGTH, 0, 0, 1e-4, "a length such as 0.1 nm");
        double thickness = u.quantity("thickness_sd", UnitKind.LENGTH, 0, 0, 1e-3, "a length such as 5 nm");
        double tortuosity = u.number("tortuosity_sd", 0, 0, 100);
        double spread = u.quantity("spread_sd", UnitKind.TEMPERATURE_DIFFERENCE, 0, 0, 100, "a temperature difference such as 1 K");
        double lag = u.quantity("lag_sd", UnitKind.TIME, 0, 0, 1e4, "a time such as 5 s");
        double purge = u.quantity("purge_sd", UnitKind.FRACTION, 0, 0, 1, "a relative spread such as 5 %");
        if (purge > 0 && bake.chamber() == null) {
            throw u.get("purge_sd").error(ErrorKind.INCONSISTENT, "the case has no chamber section: no purge to vary");
        }
        double density = u.quantity("density_sd", UnitKind.DENSITY, 0, 0, 10_000, "a density such as 0.02 g/cm3");
        u.finish();
        return within(u, () -> new org.exhale.studies.Uncertainty(all, per, porosity, radius, thickness, tortuosity, spread,
                lag, purge, density));
    }

    private static org.exhale.studies.Uncertainty.Kinetics kinetics(YamlNode k) {
        double ea = k.quantity("Ea_sd", UnitKind.MOLAR_ENERGY, 0, 0, 1e5, "an energy such as 2 kJ/mol");
        double lnA = k.number("lnA_sd", 0, 0, 20);
        double rho = k.number("Ea_lnA_correlation", 0, -1, 1);
        return within(k, () -> new org.exhale.studies.Uncertainty.Kinetics(ea, lnA, rho));
    }

    /**
     * A recipe file for {@code --recipe}: a YAML mapping with a {@code recipe} block, as
     * {@code plan} writes in recipe.yaml (a whole case file is accepted too; only its recipe is read).
     */
    public static Recipe readRecipe(Path path) {
        String name = path.toString();
        Node node = compose(name, decode(name, readBytes(path, "a recipe file is a few KiB")));
        YamlNode root = YamlNode.root(name, node);
        if (!root.isMapping()) {
            throw root.error(ErrorKind.WRONG_TYPE, "a recipe file is a mapping with a 'recipe' block, found " + root.describe());
        }
        return recipe(root.section("recipe"));
    }

    // ---------------------------------------------------------------- warnings

    private void plausibility(BakeCase b) {
        if (b.limits().ceilingK() > C0 + 600) {
            warnings.add("limits.ceiling " + fmtC(b.limits().ceilingK()) + " is above 600 C, unusual for back-end wafers");
        }
        if (b.cap().porosity() > 0.8) {
            warnings.add("cap.porosity " + b.cap().porosity() + " is above 0.8, unusual for a cap film");
        }
        for (Component c : b.polymer().components()) {
            double ownPi0 = c.product().hasOwnPermeability() ? c.product().permeabilityPi0() : b.cap().permeabilityPi0();
            if (b.cap().porosity() == 0 && ownPi0 == 0) {
                warnings.add("the cap is dense (porosity 0) and gives the product of '" + c.name()
                        + "' no permeability (neither its own nor the cap's): that gas has no way out");
            }
        }
        for (Component c : b.polymer().components()) {
            if (b.cap().porosity() > 0 && c.product().kineticDiameterM() >= 2 * b.cap().poreRadiusM()) {
                warnings.add("product of '" + c.name() + "' (" + c.product().kineticDiameterM() * 1e9
                        + " nm) does not fit the pores (diameter " + 2 * b.cap().poreRadiusM() * 1e9 + " nm): no diffusion path");
            }
            double e = c.activationEnergyJPerMol();
            if (e < 50e3 || e > 400e3) {
                warnings.add("component '" + c.name() + "' activation energy " + e / 1e3 + " kJ/mol is outside the usual 50-400 kJ/mol");
            }
        }
        if (b.film() != null && b.cavity().widthM() < 5 * b.cap().thicknessM()) {
            warnings.add("the span (" + org.exhale.io.Numbers.sig(b.cavity().widthM() * 1e9, 4) + " nm) is under 5 cap thicknesses: thin-plate bending "
                    + "is only indicative; thermal stress dominates such caps");
        }
        if (b.recipe() != null && b.recipe().maxSetpointK() > b.limits().ceilingK()) {
            warnings.add("the recipe's highest setpoint " + fmtC(b.recipe().maxSetpointK()) + " is above the ceiling "
                    + fmtC(b.limits().ceilingK()));
        }
    }
}
