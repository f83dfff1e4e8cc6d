package org.exhale.mechanics;

/**
 * Mechanical state of the cap at one temperature and excess pressure.
 *
 * @param thermalStressPa        σ_th: intrinsic plus thermal-mismatch stress, biaxial, tension positive [Pa]
 * @param bendingStressPa        σ_b ≥ 0: edge bending stress on the face in tension (the outer face for
 *                               Δp &gt; 0, the inner face for suction) [Pa]
 * @param membraneStressPa       σ_m ≥ 0: stretching stress from the deflection (tensile for either sign) [Pa]
 * @param edgeStressPa           σ_max = σ_th + σ_m + σ_b, the largest face stress at the clamped edge [Pa]
 * @param deflectionM            δ: centre deflection, same sign as Δp (outward positive) [m]
 * @param bendingLoadFraction    Δp_b/Δp, the share of the load carried by bending, in [0, 1] (1 at Δp = 0)
 * @param channelCrackingJPerM2  G_ch = Z σ_max² h/Ē while σ_max &gt; 0, else 0 [J/m²]
 * @param delaminationJPerM2     G_d = σ_d² h/(2Ē), σ_d the largest face-stress magnitude at the edge [J/m²]
 * @param dominantTerm           the contribution of largest magnitude to the edge stress
 * @param bucklingCompressionPa  |σ_th| while σ_th &lt; 0, else 0: to compare with the buckling stress [Pa]
 */
public record CapResponse(double thermalStressPa, double bendingStressPa, double membraneStressPa,
                          double edgeStressPa, double deflectionM, double bendingLoadFraction,
                          double channelCrackingJPerM2, double delaminationJPerM2, EdgeTerm dominantTerm,
                          double bucklingCompressionPa) {
    public CapResponse {
        if (!Double.isFinite(thermalStressPa) || !Double.isFinite(edgeStressPa) || !Double.isFinite(deflectionM)) {
            throw new IllegalArgumentException("cap response must be finite, got thermal stress " + thermalStressPa
                    + " Pa, edge stress " + edgeStressPa + " Pa, deflection " + deflectionM + " m");
        }
        if (!(bendingStressPa >= 0 && membraneStressPa >= 0)) {
            throw new IllegalArgumentException("bending and membrane stress must be >= 0, got " + bendingStressPa
                    + " Pa and " + membraneStressPa + " Pa");
        }
        if (!(bendingLoadFraction >= 0 && bendingLoadFraction <= 1)) {
            throw new IllegalArgumentException("bending load fraction must be in [0, 1], got " + bendingLoadFraction);
        }
        if (!(channelCrackingJPerM2 >= 0 && delaminationJPerM2 >= 0)) {
            throw new IllegalArgumentException("energy release rates must be >= 0, got " + channelCrackingJPerM2
                    + " and " + delaminationJPerM2 + " J/m2");
        }
        if (!(bucklingCompressionPa >= 0)) {
            throw new IllegalArgumentException("buckling compression must be >= 0, got " + bucklingCompressionPa);
        }
        if (dominantTerm == null) {
            throw new IllegalArgumentException("dominant edge term must be given");
        }
    }
}
