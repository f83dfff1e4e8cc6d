package org.exhale.report;

import java.util.List;

/** The usual cautions of the trade, shown with every result. */
public final class Cautions {
    private Cautions() {
    }

    public static final List<String> BAKE = List.of(
            "Predictions are estimates from a model; confirm every recipe on test wafers before production use.",
            "Hot wafers, hot chambers and decomposition products can injure: follow your site's safety rules, "
                    + "local codes and the tool's procedures, and have qualified process engineers approve recipes.",
            "Decomposition products may be flammable, toxic or condensable: keep the exhaust and gas detection as "
                    + "your site requires.");

    public static final List<String> CHAMBER = List.of(
            "Chamber figures assume a well-mixed chamber; real concentrations can be higher near the wafers and in "
                    + "dead zones.",
            "Follow the site's exhaust, gas-detection and safety rules and consult qualified facilities engineers "
                    + "before relying on these figures.");

    /**
     * The cautions as the terminal shows them, once per run: one line that carries each of them in
     * short, and where the full text is. Every output file and report keeps the full text.
     */
    public static String terminal(boolean chamber) {
        return "Caution: model estimates: confirm every recipe on test wafers; hot wafers and possibly flammable or "
                + "toxic products need your site's safety and exhaust rules" + (chamber ? " (chamber figures assume "
                + "a well-mixed chamber)" : "") + ". Full cautions are in the output files.";
    }
}
