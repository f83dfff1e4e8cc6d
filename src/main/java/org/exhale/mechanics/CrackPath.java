package org.exhale.mechanics;

/** Which channel crack has the larger energy release rate. */
public enum CrackPath {
    /** A channel crack in the film where it is bonded to the layer below: G = Z σ² h/Ē. */
    BONDED,
    /** A crack running along the free-standing span, relieving the transverse stress across it. */
    FREE_SPAN;

    /** Lower-case label for outputs ("bonded", "free span"). */
    public String label() {
        return this == BONDED ? "bonded" : "free span";
    }
}
