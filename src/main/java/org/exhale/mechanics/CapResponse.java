package org.exhale.mechanics;

/**
 * Mechanical state of the cap at one temperature and excess pressure.
 *
 * @param thermalStressPa        σ_th: intrinsic plus thermal-mismatch stress, biaxial, tension positive [Pa]
 * @param bendingStressPa        σ_b = 6|M_e|/h² ≥ 0: bending stress on the face in tension at the clamped edge [Pa]
 * @param membraneStressPa       σ_m = N/h − σ_th ≥ 0: the stretching share of the membrane stress [Pa]
 * @param edgeStressPa           σ_edge = N/h + 6|M_e|/h², the largest face stress at the clamped edge [Pa]
 * @param centreStressPa         σ_centre = N/h + 6|M_c|/h², the largest face stress at the centre [Pa]
 * @param deflectionM            δ: centre deflection, same sign as Δp (outward positive) [m]
 * @param bondedCrackJPerM2      channel crack where the film is bonded, G = Z σ_max² h/Ē while σ_max &gt; 0 [J/m²]
 * @param spanCrackJPerM2        crack along the free-standing span (see {@link CapStructure}) [J/m²]
 * @param delaminationJPerM2     G_d = σ_d² h/(2Ē), σ_d the largest face-stress magnitude [J/m²]
 * @param dominantTerm           the contribution of largest magnitude to the largest face stress
 * @param bucklingCompressionPa  |σ_th| while σ_th &lt; 0, else 0: to compare with the buckling stress [Pa]
 */
public record CapResponse(double thermalStressPa, double bendingStressPa, double membraneStressPa,
                          double edgeStressPa, double centreStressPa, double deflectionM,
                          double bondedCrackJPerM2, double spanCrackJPerM2, double delaminationJPerM2,
                          EdgeTerm dominantTerm, double bucklingCompressionPa) {
    public CapResponse {
        if (!Double.isFinite(thermalStressPa) || !Double.isFinite(edgeStressPa) || !Double.isFinite(centreStressPa)
                || !Double.isFinite(deflectionM)) {
            throw new IllegalArgumentException("cap response must be finite, got thermal stress " + thermalStressPa
                    + " Pa, edge stress " + edgeStressPa + " Pa, centre stress " + centreStressPa
                    + " Pa, deflection " + deflectionM + " m");
        }
        if (!(bendingStressPa >= 0 && membraneStressPa >= 0)) {
            throw new IllegalArgumentException("bending and membrane stress must be >= 0, got " + bendingStressPa
                    + " Pa and " + membraneStressPa + " Pa");
        }
        if (!(bondedCrackJPerM2 >= 0 && spanCrackJPerM2 >= 0 && delaminationJPerM2 >= 0)) {
            throw new IllegalArgumentException("energy release rates must be >= 0, got " + bondedCrackJPerM2 + ", "
                    + spanCrackJPerM2 + " and " + delaminationJPerM2 + " J/m2");
        }
        if (!(bucklingCompressionPa >= 0)) {
            throw new IllegalArgumentException("buckling compression must be >= 0, got " + bucklingCompressionPa);
        }
        if (dominantTerm == null) {
            throw new IllegalArgumentException("dominant edge term must be given");
        }
    }

    /** The largest face stress of the cap, max(σ_edge, σ_centre) [Pa]: what strength is checked against. */
    public double maxStressPa() {
        return Math.max(edgeStressPa, centreStressPa);
    }

    /** The channel-cracking energy release rate that governs: the larger of the two crack paths [J/m²]. */
    public double channelCrackingJPerM2() {
        return Math.max(bondedCrackJPerM2, spanCrackJPerM2);
    }

    /** The crack path with the larger energy release rate (bonded on a tie). */
    public CrackPath governingCrack() {
        return spanCrackJPerM2 > bondedCrackJPerM2 ? CrackPath.FREE_SPAN : CrackPath.BONDED;
    }
}
