package org.exhale.mechanics;

import org.hipparchus.util.FastMath;

/**
 * The cap film over its span as a clamped plate–membrane: stresses, deflection and fracture
 * driving forces at a temperature and an excess pressure (inside minus outside). Immutable; all
 * constants are computed once in the constructor, and {@link #deflectionM}, {@link #edgeStressPa}
 * and {@link #thermalStressPa} allocate nothing, so they may be called in a hot loop.
 *
 * <h2>Relations (SI units; Ē = E/(1−ν²), D = E h³/(12(1−ν²)), w the full span)</h2>
 * <ul>
 *   <li><b>Thermal mismatch</b> (biaxial): σ_th(T) = σ_i + E/(1−ν) (α_s − α_f)(T − T_0f)
 *       (Freund &amp; Suresh, Thin Film Materials, 2003; formula from memory, unconfirmed).</li>
 *   <li><b>Load–deflection</b>: Δp = K₁ δ + K_σ max(σ_th, 0) δ + K₃ δ³ with the plate term
 *       K₁ = D/(c_δ w⁴) ({@link PlateCoefficients}), the pre-tension term K_σ and the stretching
 *       term K₃ of the bulge-test relations:
 *       <ul>
 *         <li>line (plane strain, a = w/2; Vlassak &amp; Nix, J. Mater. Res. 7 (1992) 3242):
 *             p = 2σ₀ h δ/a² + 4 E h δ³/(3(1−ν²) a⁴), so K_σ = 8h/w², K₃ = (64/3) Ē h/w⁴;</li>
 *         <li>disc (a = w/2; Small &amp; Nix, J. Mater. Res. 7 (1992) 1553):
 *             p = 4σ₀ h δ/a² + (8/3)(1−0.24ν) E h δ³/((1−ν) a⁴), so K_σ = 16h/w²,
 *             K₃ = (128/3)(1−0.24ν) E h/((1−ν) w⁴);</li>
 *         <li>rectangle w × L: the line's K_σ and K₃ (this package's choice, see below).</li>
 *       </ul>
 *       The cubic has one real root for every Δp (all coefficients positive); it is taken in
 *       closed form, δ = 2√(P/3) sinh(⅓ asinh((3√3/2) (Δp/K₃) / P^{3/2})), P = K_lin/K₃, which is
 *       exact, stable in both the plate and the membrane limit, odd in Δp, and needs no iteration.</li>
 *   <li><b>Bending stress</b> from the bending share of the load Δp_b = K₁ δ: σ_b = c_σ Δp_b w²/h².</li>
 *   <li><b>Membrane stress</b> from the stretching share Δp_m = K₃ δ³ and the equilibrium of the
 *       deflected membrane that the cited σ₀ terms express (p = 2σ h δ/a² for the cylindrical line,
 *       p = 4σ h δ/a² for the spherical disc): line σ_m = (8/3) Ē δ²/w², which is also Ē times the
 *       plane-strain stretch ε = (2/3)(δ/a)² of a parabolic profile z = δ(1 − x²/a²), since
 *       ε = (1/2a)∫½ z'² dx = (2/3)(δ/a)²; disc σ_m = (8/3)(1−0.24ν)/(1−ν) · E δ²/w², the mean
 *       biaxial stretching stress of the Small &amp; Nix fit. The pre-tension is not counted again:
 *       it is σ_th.</li>
 *   <li><b>Edge stress</b> σ_max = σ_th + σ_m + σ_b, the face in tension at the clamped edge.
 *       Under suction (Δp &lt; 0) δ is negative and the inner face is the one in tension; σ_b and
 *       σ_m are reported as magnitudes, so the relation holds for either sign.</li>
 *   <li><b>Channel cracking</b> G_ch = Z σ_max² h/Ē, Z = 1.976, only while σ_max &gt; 0
 *       (Hutchinson &amp; Suo, Adv. Appl. Mech. 29 (1992) 63; Beuth, Int. J. Solids Struct. 29 (1992)
 *       1657: no elastic mismatch).</li>
 *   <li><b>Delamination</b> G_d = σ_d² h/(2Ē) (steady state, Hutchinson &amp; Suo 1992) with σ_d the
 *       largest face-stress magnitude at the edge, max(|σ_max|, |σ_th + σ_m − σ_b|). This equals
 *       σ_max² whenever the mean stress σ_th + σ_m is tensile; when the mean stress is compressive
 *       the compressed face is taken, which keeps the check conservative. It is also never below
 *       the energy released by a film carrying both a force and a moment,
 *       (h/2Ē)(σ_mean² + σ_b²/3), since (|a| + b)² ≥ a² + b²/3.</li>
 *   <li><b>Buckling</b> of the freed cap under compressive σ_th: line σ_cr = (π²/3) Ē (h/w)²
 *       (clamped strip, = (π²/12) Ē (h/b)² with b = w/2, Hutchinson &amp; Suo 1992); disc
 *       σ_cr = (j₁₁²/3) Ē (h/w)², j₁₁ = 3.8317 the first zero of J₁ (clamped circular plate,
 *       N_cr = 14.68 D/a²); rectangle: the line value for the short side, a lower bound, because a
 *       plate inside the strip of the same width cannot buckle more easily (its admissible buckling
 *       modes are a subset of the strip's).</li>
 * </ul>
 *
 * <h2>Where this goes beyond the plain contract, and why</h2>
 * <ul>
 *   <li><b>Pre-tension stiffening.</b> Both cited bulge-test relations contain the residual-stress
 *       term; a tensile cap carries part of the pressure as a pre-tensioned membrane. For thin caps
 *       that term is not small: on a line its ratio to the plate term is σ_th w²/(4 Ē h²), about 2.5
 *       for 100 MPa in a 100 nm thick, 10 µm wide cap with Ē = 100 GPa. Leaving it out overestimates δ and σ_b
 *       several-fold. It is on by default and can be switched off (constructor flag) to reproduce
 *       the plain plate + stretching relation.</li>
 *   <li><b>Compression does not soften the cap here.</b> Compressive σ_th would lower the linear stiffness and
 *       make it vanish near the buckling stress; the relation above then loses its unique root and
 *       describes a buckled cap it was not made for. So compression is left out of the stiffness
 *       (K_σ uses max(σ_th, 0)) and is judged by the buckling check instead. Below buckling, the
 *       deflection under compression is therefore underestimated by the usual amplification
 *       1/(1 − |σ_th|/σ_cr) (Timoshenko &amp; Gere, Theory of Elastic Stability; from memory,
 *       unconfirmed); keep |σ_th| well under σ_cr (a buckling safety factor) where that matters.</li>
 *   <li><b>Rectangle stretching.</b> No published large-deflection relation for clamped
 *       rectangles is used here. The line's stretching and pre-tension terms are used for the short
 *       span: a rectangle lies inside the strip of its width, so it is stiffer in stretching and its
 *       true deflection and membrane stress at a given pressure are no larger than the strip's.
 *       The plate term is the rectangle's own (Roark), so small deflections are exact and large ones
 *       are conservative (deflection and stresses overestimated).</li>
 * </ul>
 *
 * <p>Validity: Kirchhoff plates (w/h ≳ 10), linear elastic, isotropic film; the supports are rigid
 * clamps and the substrate much thicker than the film.
 */
public final class CapStructure {

    /** Thermal expansion coefficient of silicon near room temperature, 2.6e-6 1/K (common practice). */
    public static final double SILICON_CTE_PER_K = 2.6e-6;
    /**
     * Channel-crack coefficient Z = 1.976 for a film on a substrate of like stiffness (Hutchinson &amp;
     * Suo, Adv. Appl. Mech. 29 (1992) 63; Beuth 1992).
     */
    public static final double CHANNEL_CRACK_Z = 1.976;
    /** First zero of the Bessel function J₁, 3.8317 (clamped circular plate buckling). */
    public static final double BESSEL_J1_FIRST_ZERO = 3.8317;

    private final FilmProperties film;
    private final double thicknessM;
    private final SpanGeometry span;
    private final double substrateCtePerK;
    private final MechanicalLimits limits;
    private final boolean tensionStiffening;
    private final PlateCoefficients plate;

    private final double planeStrainModulusPa;
    private final double flexuralRigidityNm;
    /** σ_th = σ_i + thermalSlope (T − T_0f). */
    private final double thermalSlopePaPerK;
    private final double plateStiffnessPaPerM;      // K₁
    private final double pretensionStiffnessPerM;   // K_σ: K_σ σ_th in Pa/m
    private final double stretchStiffnessPaPerM3;   // K₃
    private final double membraneStressPaPerM2;     // σ_m = this δ²
    private final double bendingStressPerPa;        // σ_b = this Δp_b
    private final double bucklingStressPa;

    /** A cap with tension stiffening (see the class description). */
    public CapStructure(FilmProperties film, double thicknessM, SpanGeometry span, double substrateCtePerK,
                        MechanicalLimits limits) {
        this(film, thicknessM, span, substrateCtePerK, limits, true);
    }

    /**
     * @param film               film properties
     * @param thicknessM         film thickness h [m], positive and below 100 span widths (thin-plate
     *                           theory wants w/h above about 5; the case check warns)
     * @param span               shape and size of the free span
     * @param substrateCtePerK   substrate CTE α_s [1/K] (e.g. {@link #SILICON_CTE_PER_K})
     * @param limits             safety factor and deflection limit
     * @param tensionStiffening  whether tensile σ_th stiffens the cap (the bulge-test σ₀ term)
     */
    public CapStructure(FilmProperties film, double thicknessM, SpanGeometry span, double substrateCtePerK,
                        MechanicalLimits limits, boolean tensionStiffening) {
        if (film == null || span == null || limits == null) {
            throw new IllegalArgumentException("cap needs film properties, a span and limits");
        }
        // Thin-plate theory wants w/h above about 5; thicker caps are still computed (their
        // bending stress is small beside the thermal term) and the case check warns.
        if (!(thicknessM > 0 && thicknessM < 100 * span.widthM())) {
            throw new IllegalArgumentException("cap thickness must be positive and below 100 span widths "
                    + span.widthM() + " m, got " + thicknessM + " m");
        }
        if (!(Math.abs(substrateCtePerK) < 1e-3)) {
            throw new IllegalArgumentException("substrate CTE must be finite and below 1e-3 1/K in magnitude, got "
                    + substrateCtePerK);
        }
        this.film = film;
        this.thicknessM = thicknessM;
        this.span = span;
        this.substrateCtePerK = substrateCtePerK;
        this.limits = limits;
        this.tensionStiffening = tensionStiffening;
        this.plate = PlateCoefficients.forSpan(span);

        double e = film.youngsModulusPa();
        double nu = film.poisson();
        double h = thicknessM;
        double w = span.widthM();
        double w2 = w * w;
        double w4 = w2 * w2;
        planeStrainModulusPa = film.planeStrainModulusPa();
        flexuralRigidityNm = planeStrainModulusPa * h * h * h / 12;
        thermalSlopePaPerK = film.biaxialModulusPa() * (substrateCtePerK - film.ctePerK());
        plateStiffnessPaPerM = flexuralRigidityNm / (plate.deflectionCoefficient() * w4);
        bendingStressPerPa = plate.edgeStressCoefficient() * w2 / (h * h);
        double hw = h / w;
        if (span.shape() == SpanGeometry.Shape.DISC) {
            double smallNix = (1 - 0.24 * nu) / (1 - nu);
            pretensionStiffnessPerM = 16 * h / w2;
            stretchStiffnessPaPerM3 = 128.0 / 3 * smallNix * e * h / w4;
            membraneStressPaPerM2 = 8.0 / 3 * smallNix * e / w2;
            bucklingStressPa = BESSEL_J1_FIRST_ZERO * BESSEL_J1_FIRST_ZERO / 3 * planeStrainModulusPa * hw * hw;
        } else {
            pretensionStiffnessPerM = 8 * h / w2;
            stretchStiffnessPaPerM3 = 64.0 / 3 * planeStrainModulusPa * h / w4;
            membraneStressPaPerM2 = 8.0 / 3 * planeStrainModulusPa / w2;
            bucklingStressPa = Math.PI * Math.PI / 3 * planeStrainModulusPa * hw * hw;
        }
    }

    /** σ_th(T) = σ_i + E/(1−ν) (α_s − α_f)(T − T_0f) [Pa]. */
    public double thermalStressPa(double temperatureK) {
        return film.intrinsicStressPa() + thermalSlopePaPerK * (temperatureK - film.stressFreeTemperatureK());
    }

    /** Centre deflection δ [m] at temperature T and excess pressure Δp (allocation-free). */
    public double deflectionM(double temperatureK, double excessPressurePa) {
        return solveDeflection(linearStiffness(thermalStressPa(temperatureK)), excessPressurePa);
    }

    /** Edge stress σ_max [Pa] at temperature T and excess pressure Δp (allocation-free). */
    public double edgeStressPa(double temperatureK, double excessPressurePa) {
        double sigmaTh = thermalStressPa(temperatureK);
        double delta = solveDeflection(linearStiffness(sigmaTh), excessPressurePa);
        double sigmaB = bendingStressPerPa * (plateStiffnessPaPerM * Math.abs(delta));
        double sigmaM = membraneStressPaPerM2 * delta * delta;
        return sigmaTh + sigmaM + sigmaB;    // same operations as evaluate, so the same value
    }

    /**
     * Full response at temperature T [K] and excess pressure Δp [Pa] (inside minus outside,
     * positive pushes the cap outward).
     */
    public CapResponse evaluate(double temperatureK, double excessPressurePa) {
        if (!(temperatureK > 0 && temperatureK < 1e4)) {
            throw new IllegalArgumentException("temperature must be in (0, 1e4) K, got " + temperatureK);
        }
        if (!Double.isFinite(excessPressurePa)) {
            throw new IllegalArgumentException("excess pressure must be finite, got " + excessPressurePa);
        }
        double sigmaTh = thermalStressPa(temperatureK);
        double delta = solveDeflection(linearStiffness(sigmaTh), excessPressurePa);
        double bendingLoad = plateStiffnessPaPerM * Math.abs(delta);
        double sigmaB = bendingStressPerPa * bendingLoad;
        double sigmaM = membraneStressPaPerM2 * delta * delta;
        double sigmaMax = sigmaTh + sigmaM + sigmaB;
        double ebar = planeStrainModulusPa;
        double gCh = sigmaMax > 0 ? CHANNEL_CRACK_Z * sigmaMax * sigmaMax * thicknessM / ebar : 0;
        double sigmaD = Math.max(Math.abs(sigmaMax), Math.abs(sigmaTh + sigmaM - sigmaB));
        double gD = sigmaD * sigmaD * thicknessM / (2 * ebar);
        double fraction = excessPressurePa == 0 ? 1 : Math.min(1, bendingLoad / Math.abs(excessPressurePa));
        EdgeTerm dominant = EdgeTerm.THERMAL;
        double largest = Math.abs(sigmaTh);
        if (sigmaB > largest) {
            dominant = EdgeTerm.BENDING;
            largest = sigmaB;
        }
        if (sigmaM > largest) {
            dominant = EdgeTerm.MEMBRANE;
        }
        double buckling = sigmaTh < 0 ? -sigmaTh : 0;
        return new CapResponse(sigmaTh, sigmaB, sigmaM, sigmaMax, delta, fraction, gCh, gD, dominant, buckling);
    }

    private double linearStiffness(double sigmaTh) {
        return tensionStiffening && sigmaTh > 0
                ? plateStiffnessPaPerM + pretensionStiffnessPerM * sigmaTh
                : plateStiffnessPaPerM;
    }

    /**
     * The real root of K₃ δ³ + K δ = Δp (K, K₃ &gt; 0): δ = 2√(P/3) sinh(⅓ asinh(x)),
     * P = K/K₃, x = Δp / (2 K₃ (P/3)^{3/2}); this satisfies the cubic exactly because
     * sinh 3θ = 3 sinh θ + 4 sinh³θ.
     */
    private double solveDeflection(double linearStiffnessPaPerM, double excessPressurePa) {
        if (excessPressurePa == 0) {
            return 0;
        }
        double k3 = stretchStiffnessPaPerM3;
        double r = Math.sqrt(linearStiffnessPaPerM / (3 * k3));   // √(P/3)
        double x = excessPressurePa / (2 * k3 * r * r * r);
        return 2 * r * FastMath.sinh(FastMath.asinh(x) / 3);
    }

    /** Allowed tensile edge stress σ_f / SF [Pa] (+∞ if the strength is not given). */
    public double allowedStressPa() {
        return film.strengthPa() / limits.safetyFactor();
    }

    /** Allowed channel-cracking energy release rate Γ_c / SF [J/m²] (+∞ if not given). */
    public double allowedCrackingJPerM2() {
        return film.cohesiveEnergyJPerM2() / limits.safetyFactor();
    }

    /** Allowed delamination energy release rate Γ_i / SF [J/m²] (+∞ if not given). */
    public double allowedDelaminationJPerM2() {
        return film.interfaceEnergyJPerM2() / limits.safetyFactor();
    }

    /** Critical compressive stress σ_cr of the freed cap [Pa] (see the class description). */
    public double bucklingStressPa() {
        return bucklingStressPa;
    }

    /** Largest allowed deflection magnitude [m] (+∞ if not checked). */
    public double maxDeflectionM() {
        return limits.maxDeflectionM();
    }

    /** Plane-strain modulus Ē = E/(1−ν²) [Pa]. */
    public double planeStrainModulusPa() {
        return planeStrainModulusPa;
    }

    /** Flexural rigidity D = E h³/(12(1−ν²)) [N·m]. */
    public double flexuralRigidityNm() {
        return flexuralRigidityNm;
    }

    /** Small-deflection plate coefficients used for this span. */
    public PlateCoefficients plateCoefficients() {
        return plate;
    }

    public FilmProperties film() {
        return film;
    }

    public double thicknessM() {
        return thicknessM;
    }

    public SpanGeometry span() {
        return span;
    }

    public double substrateCtePerK() {
        return substrateCtePerK;
    }

    public MechanicalLimits limits() {
        return limits;
    }

    public boolean tensionStiffening() {
        return tensionStiffening;
    }
}
