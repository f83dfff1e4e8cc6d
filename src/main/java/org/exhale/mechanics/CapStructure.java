package org.exhale.mechanics;

import org.hipparchus.util.FastMath;

/**
 * The cap film over its span as a clamped plate carrying in-plane force and pressure (Föppl–von
 * Kármán): stresses, deflection and fracture driving forces at a temperature and an excess
 * pressure (inside minus outside). Immutable and allocation-free apart from the result record (a disc
 * interpolates its table to the film's ν row by row on first use; safe to share between threads).
 *
 * <h2>Relations (SI units; Ē = E/(1−ν²), D = Ē h³/12, a = w/2 the half-span or radius)</h2>
 * <ul>
 *   <li><b>Thermal mismatch</b> (biaxial): σ_th(T) = σ_i + E/(1−ν) (α_s − α_f)(T − T_0f)
 *       (Freund &amp; Suresh, Thin Film Materials, 2003; formula from memory, unconfirmed).</li>
 *   <li><b>Strip</b> (a long line; plane strain): the clamped beam-column under pressure q and the
 *       membrane force N = σ_th h + Ē h ε, ε = (1/2a)∫½ w'² dx the stretch of the deflected shape.
 *       With k² = N/D, u = ka: edge moment M_e = (q/k²)(u coth u − 1), centre moment
 *       M_c = (q/k²)(1 − u/sinh u), deflection δ = (q a²/2N)(1 − 2 tanh(u/2)/u). N is solved
 *       self-consistently (Newton on s = N a²/D, monotone, one root) with ε taken from this same
 *       beam-column shape, so the result is the exact plane-strain Föppl–von Kármán solution.
 *       In compression (N &lt; 0, above buckling) the hyperbolic functions become circular ones; as
 *       N → 0 the clamped-plate values M_e = q a²/3, δ = q a⁴/(24 D) follow continuously (series,
 *       see {@link MembraneFunctions}).</li>
 *   <li><b>Disc</b>: the axisymmetric plate under a uniform in-plane force N and pressure: edge
 *       moment M_e = (q/2k²)(u I₀(u)/I₁(u) − 2), centre moment (1+ν)(q/2k²)(1 − u/(2 I₁(u))),
 *       with J Bessel functions in compression, for a uniform force. The true stretching force
 *       varies with radius, so the edge and centre forces, both moments and the deflection are the
 *       axisymmetric Föppl–von Kármán solution itself, looked up in {@link DiscFvkTable}
 *       (finite-difference FvK solutions tabulated against load, pre-force and ν; within 0.1 % of an
 *       independent shooting solution in the tests), so no call solves for the force. The
 *       uniform-force model, N = σ_th h + E h/(1−ν) · (1/2a²)∫φ² r dr with the Bessel shape solved
 *       self-consistently, remains for the crack along the span and beyond the table's range.</li>
 *   <li><b>Rectangle</b> w × L: the clamped strip of width w as a base (with its compressive
 *       pre-stress scaled by π²/λ_s, λ_s the rectangle's doubly symmetric buckling load, so that it is
 *       amplified near buckling as the rectangle is), corrected part by part — edge and centre stretching
 *       force, edge and centre moment, largest deflection — to the two-dimensional Föppl–von Kármán
 *       solution of the clamped rectangle by the tabulated ratios of {@link RectangleCorrection}
 *       (finite-difference FvK solutions by L/w, pre-stress, load and ν; docs/model.md gives the
 *       errors measured off the table's nodes). The edge value is the largest face stress on the
 *       clamped boundary (raised where a point just inside carries more), so σ_max = max(σ_edge,
 *       σ_centre) is the 2D largest principal face stress. The strip alone is not conservative for
 *       L/w ≳ 1.5 (up to 9 % low under compression) and very conservative for the square (up to 40 %
 *       high).</li>
 *   <li><b>Face stresses</b>: σ_edge = N/h + 6|M_e|/h², σ_centre = N/h + 6|M_c|/h². Strength,
 *       the bonded channel crack and delamination are checked on the larger of the two.</li>
 *   <li><b>Channel cracking where bonded</b> G = Z σ_max² h/Ē, Z = 1.976, only while σ_max &gt; 0
 *       (Hutchinson &amp; Suo, Adv. Appl. Mech. 29 (1992) 63; Beuth, Int. J. Solids Struct. 29 (1992)
 *       1657: no elastic mismatch).</li>
 *   <li><b>Crack along the free span</b> (derived, no published source; docs/model.md): a
 *       through-crack running along the freed span relieves the transverse force and moment across
 *       the whole span; in steady state it releases at most the elastic energy stored per unit
 *       length, G_span = (1/(2Ē)) ∫_span (σ_N² + σ_b(x)²/3) dx with σ_N = max(N,0)/h and
 *       σ_b = 6M(x)/h². For a uniform stress that is σ² w/(2Ē). Strip: ∫M² dx in closed form;
 *       disc: along a diameter, with the strip's distribution of M across the span scaled to the
 *       disc's edge moment. Counted while σ_max &gt; 0. The larger of the two cracks governs.</li>
 *   <li><b>Delamination</b> G_d = σ_d² h/(2Ē) (steady state, Hutchinson &amp; Suo 1992), σ_d the
 *       largest face-stress magnitude (either face, edge or centre).</li>
 *   <li><b>Buckling</b> of the freed cap under compressive σ_th: line σ_cr = (π²/3) Ē (h/w)²
 *       (clamped strip); disc σ_cr = (j₁₁²/3) Ē (h/w)², j₁₁ = 3.8317 the first zero of J₁;
 *       rectangle σ_cr = λ(L/w) D/(h a²), the clamped rectangle under equi-biaxial compression
 *       ({@link RectangleBuckling}: 1.326 π² for the square, below the strip's π² from L/w ≈ 1.7, down to
 *       0.939 π² for a long plate).</li>
 * </ul>
 *
 * <p>Validity: Kirchhoff plates (w/h ≳ 10), moderate rotations, linear elastic, isotropic film;
 * rigid clamps and a substrate much thicker than the film.
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
    /** First zero of J₁ to double precision, 3.8317059702075125. */
    static final double BESSEL_J1_FIRST_ZERO_EXACT = 3.8317059702075125;

    private final FilmProperties film;
    private final double thicknessM;
    private final SpanGeometry span;
    private final double substrateCtePerK;
    private final MechanicalLimits limits;
    private final PlateCoefficients plate;
    private final boolean disc;
    /** The disc's tabulated FvK response at this film's ν (null for other shapes). */
    private final DiscFvkTable discTable;
    private final boolean rectangle;
    /** L/w of a rectangle (1 otherwise). */
    private final double aspect;

    private final double planeStrainModulusPa;
    private final double flexuralRigidityNm;
    /** σ_th = σ_i + thermalSlope (T − T_0f). */
    private final double thermalSlopePaPerK;
    private final double halfSpanM;
    /** s0 per Pa of σ_th: h a²/D. */
    private final double sPerPa;
    /** Q per Pa of pressure: a⁴/(D h). */
    private final double qPerPa;
    /** s − s0 = stretchGain Q² F(s). */
    private final double stretchGain;
    private final double bucklingS;
    private final double bucklingStressPa;

    public CapStructure(FilmProperties film, double thicknessM, SpanGeometry span, double substrateCtePerK,
                        MechanicalLimits limits) {
        if (film == null || span == null || limits == null) {
            throw new IllegalArgumentException("cap needs film properties, a span and limits");
        }
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
        this.plate = PlateCoefficients.forSpan(span);
        this.disc = span.shape() == SpanGeometry.Shape.DISC;
        this.discTable = disc ? new DiscFvkTable(film.poisson()) : null;
        this.rectangle = span.shape() == SpanGeometry.Shape.RECTANGLE;
        this.aspect = rectangle ? span.lengthM() / span.widthM() : 1;

        double h = thicknessM;
        double w = span.widthM();
        double a = w / 2;
        halfSpanM = a;
        planeStrainModulusPa = film.planeStrainModulusPa();
        flexuralRigidityNm = planeStrainModulusPa * h * h * h / 12;
        thermalSlopePaPerK = film.biaxialModulusPa() * (substrateCtePerK - film.ctePerK());
        sPerPa = h * a * a / flexuralRigidityNm;
        qPerPa = a * a * a * a / (flexuralRigidityNm * h);
        stretchGain = disc ? 6 * (1 + film.poisson()) : 3;
        bucklingS = disc ? MembraneFunctions.DISC_BUCKLING_S : MembraneFunctions.STRIP_BUCKLING_S;
        double hw = h / w;
        bucklingStressPa = disc
                ? BESSEL_J1_FIRST_ZERO * BESSEL_J1_FIRST_ZERO / 3 * planeStrainModulusPa * hw * hw
                : rectangle ? RectangleBuckling.lambda(aspect) / sPerPa
                : Math.PI * Math.PI / 3 * planeStrainModulusPa * hw * hw;
    }

    /** σ_th(T) = σ_i + E/(1−ν) (α_s − α_f)(T − T_0f) [Pa]. */
    public double thermalStressPa(double temperatureK) {
        return film.intrinsicStressPa() + thermalSlopePaPerK * (temperatureK - film.stressFreeTemperatureK());
    }

    /** Centre deflection δ [m] at temperature T and excess pressure Δp. */
    public double deflectionM(double temperatureK, double excessPressurePa) {
        double s0 = sPerPa * thermalStressPa(temperatureK);
        double q = qPerPa * Math.abs(excessPressurePa);
        if (q == 0) {
            return 0;
        }
        if (rectangle) {
            double s0b = RectangleCorrection.baseS0(aspect, s0);
            double[] r = new double[RectangleCorrection.PARTS];
            RectangleCorrection.ratios(aspect, s0, q, film.poisson(), r);
            return Math.signum(excessPressurePa) * thicknessM * q
                    * MembraneFunctions.stripDeflection(solveTension(s0b, q)) * r[4];
        }
        if (disc) {
            return Math.signum(excessPressurePa) * thicknessM * discTable.deflection(q, s0);
        }
        double s = solveTension(s0, q);
        double f = MembraneFunctions.stripDeflection(s);
        return Math.signum(excessPressurePa) * thicknessM * q * f;
    }

    /** Largest face stress max(σ_edge, σ_centre) [Pa] at temperature T and excess pressure Δp. */
    public double edgeStressPa(double temperatureK, double excessPressurePa) {
        return evaluate(temperatureK, excessPressurePa).maxStressPa();
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
        double h = thicknessM;
        double sigmaTh = thermalStressPa(temperatureK);
        double s0 = sPerPa * sigmaTh;
        double q = qPerPa * Math.abs(excessPressurePa);
        // a rectangle's base model is the strip at its compression scaled to the rectangle's buckling
        double s0Model = rectangle ? RectangleCorrection.baseS0(aspect, s0) : s0;
        double s = q == 0 || disc ? s0 : solveTension(s0Model, q);
        double sigmaN = s / sPerPa;                               // N/h (uniform force: strip)
        double sigmaNCentre = sigmaN;
        double delta;
        double mEdge;                                             // |M_e| h/(D Q) etc. in units of D h/a²
        double mCentre;
        double ratioSquare;                                       // ∫M² dx / (2a M_e²) across the span
        if (q == 0) {
            delta = 0;
            mEdge = 0;
            mCentre = 0;
            ratioSquare = 0;
        } else if (disc) {
            // the axisymmetric FvK solution, tabulated: no force to solve for
            double[] f = new double[DiscFvkTable.PARTS];
            discTable.response(q, s0, f);
            sigmaN = (s0 + f[DiscFvkTable.EDGE_STRETCH]) / sPerPa;
            sigmaNCentre = (s0 + f[DiscFvkTable.CENTRE_STRETCH]) / sPerPa;
            delta = h * f[DiscFvkTable.DEFLECTION];
            mEdge = f[DiscFvkTable.EDGE_MOMENT];
            mCentre = (1 + film.poisson()) * f[DiscFvkTable.CENTRE_MOMENT];
            // the strip's distribution of M across the span at the uniform-force model's force
            double sModel = s0 + f[DiscFvkTable.MODEL_STRETCH];
            ratioSquare = sModel > MembraneFunctions.STRIP_BUCKLING_S ? MembraneFunctions.stripBendingShare(sModel) : 1;
        } else if (rectangle) {
            // to the 2D FvK solution of the clamped rectangle: parts of the strip base, tabulated ratios
            double[] r = new double[RectangleCorrection.PARTS];
            RectangleCorrection.ratios(aspect, s0, q, film.poisson(), r);
            double stretch = s - s0Model;
            sigmaN = (s0 + r[0] * stretch) / sPerPa;
            sigmaNCentre = (s0 + r[1] * stretch) / sPerPa;
            double fe = MembraneFunctions.stripEdge(s);
            delta = h * q * MembraneFunctions.stripDeflection(s) * r[4];
            mEdge = q * Math.abs(fe) * r[2];
            mCentre = q * Math.abs(MembraneFunctions.stripCentre(s)) * r[3];
            ratioSquare = MembraneFunctions.stripBendingEnergy(s) / (2 * fe * fe);
        } else {
            delta = h * q * MembraneFunctions.stripDeflection(s);
            double fe = MembraneFunctions.stripEdge(s);
            mEdge = q * Math.abs(fe);
            mCentre = q * Math.abs(MembraneFunctions.stripCentre(s));
            ratioSquare = MembraneFunctions.stripBendingEnergy(s) / (2 * fe * fe);
        }
        // M = (D h/a²) m; bending face stress 6M/h² = (6 D/(h a²)) m = m/sPerPa·6/h²·h²... written out:
        double stressPerM = 6 * flexuralRigidityNm / (h * halfSpanM * halfSpanM);
        double sigmaBEdge = stressPerM * mEdge;
        double sigmaBCentre = stressPerM * mCentre;
        double sigmaEdge = sigmaN + sigmaBEdge;
        double sigmaCentre = sigmaNCentre + sigmaBCentre;
        double sigmaMax = Math.max(sigmaEdge, sigmaCentre);
        double ebar = planeStrainModulusPa;
        double bonded = sigmaMax > 0 ? CHANNEL_CRACK_Z * sigmaMax * sigmaMax * h / ebar : 0;
        double spanCrack = 0;
        if (sigmaMax > 0) {
            // across a diameter the hoop force is at most the larger of the centre and edge forces
            double membrane = Math.max(Math.max(sigmaN, sigmaNCentre), 0);
            spanCrack = span.widthM() / (2 * ebar)
                    * (membrane * membrane + sigmaBEdge * sigmaBEdge * ratioSquare / 3);
        }
        double sigmaD = Math.max(Math.max(Math.abs(sigmaEdge), Math.abs(sigmaN - sigmaBEdge)),
                Math.max(Math.abs(sigmaCentre), Math.abs(sigmaNCentre - sigmaBCentre)));
        double gD = sigmaD * sigmaD * h / (2 * ebar);
        double sigmaM = Math.max(Math.max(sigmaN, sigmaNCentre) - sigmaTh, 0);
        double sigmaB = Math.max(sigmaBEdge, sigmaBCentre);
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
        return new CapResponse(sigmaTh, sigmaBEdge, sigmaM, sigmaEdge, sigmaCentre,
                Math.signum(excessPressurePa) * delta, bonded, spanCrack, gD, dominant, buckling);
    }

    /**
     * The membrane force parameter s = N a²/D: the one root of s − s0 = c Q² F(s) (F the stretching
     * function of the shape, positive and decreasing, infinite at buckling), by Newton's method
     * kept inside a bracket.
     */
    /** √(c∞/F(0)) of the stretching functions: strip √((2/3)/(4/945)), disc √((3/16)/(1/6144)). */
    private static final double STRIP_MODEL_B = Math.sqrt(157.5);
    private static final double DISC_MODEL_B = Math.sqrt(1152);
    private double solveTension(double s0, double q) {
        return solveTension(disc, stretchGain, s0, q);
    }

    /** The same for a strip or a disc with stretch gain c (3 strip, 6(1+ν) disc), s0 and Q. */
    static double solveTension(boolean disc, double stretchGain, double s0, double q) {
        double bucklingS = disc ? MembraneFunctions.DISC_BUCKLING_S : MembraneFunctions.STRIP_BUCKLING_S;
        double gain = stretchGain * q * q;
        double floor = bucklingS * (1 - 1e-12);
        double lo = Math.max(s0, floor);
        double hi;
        if (lo == s0) {
            hi = s0 + gain * stretch(disc, s0);
        } else {
            // beyond buckling at no load: the root lies above the buckling load; find an upper point
            hi = Math.max(0, s0) + Math.cbrt(gain) + 1;
            while (hi - s0 - gain * stretch(disc, hi) < 0) {
                hi = 2 * hi + 1;
            }
        }
        // start from the model F ≈ c∞/(s + b)² (exact at s = 0 and as s → ∞): x = s + b solves
        // x²(x − s0 − b) = gain c∞, a cubic convex right of its inflection, by Newton from the right
        double cInf = disc ? 3.0 / 16 : 2.0 / 3;
        double b = disc ? DISC_MODEL_B : STRIP_MODEL_B;
        double p = s0 + b;
        double g = gain * cInf;
        double x = Math.max(p, 0) + Math.cbrt(g);
        for (int i = 0; i < 30; i++) {
            double f = x * x * (x - p) - g;
            double dx = f / (x * (3 * x - 2 * p));
            x -= dx;
            if (Math.abs(dx) <= 1e-6 * x) {
                break;
            }
        }
        double s = Math.min(hi, Math.max(lo, x - b));
        for (int i = 0; i < 100; i++) {
            double f;
            double fp;
            if (disc && Math.abs(s) > MembraneFunctions.SERIES_LIMIT) {
                double r = MembraneFunctions.ratioR(s);          // one Bessel ratio for both
                f = MembraneFunctions.discStretch(s, r);
                fp = MembraneFunctions.discStretchSlope(s, r);
            } else {
                f = stretch(disc, s);
                fp = stretchSlope(disc, s);
            }
            double phi = s - s0 - gain * f;
            if (phi < 0) {
                lo = s;
            } else {
                hi = s;
            }
            double slope = 1 - gain * fp;
            double next = s - phi / slope;
            if (!(next > lo && next < hi)) {
                next = 0.5 * (lo + hi);
            }
            if (Math.abs(next - s) <= 1e-10 * (1 + Math.abs(next)) || hi - lo <= 1e-10 * (1 + Math.abs(hi))) {
                return next;
            }
            s = next;
        }
        return s;
    }

    private static double stretch(boolean disc, double s) {
        return disc ? MembraneFunctions.discStretch(s) : MembraneFunctions.stripStretch(s);
    }

    private static double stretchSlope(boolean disc, double s) {
        return disc ? MembraneFunctions.discStretchSlope(s) : MembraneFunctions.stripStretchSlope(s);
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

    /** Small-deflection plate coefficients of this span's shape (Roark for a rectangle; reference only). */
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

}
