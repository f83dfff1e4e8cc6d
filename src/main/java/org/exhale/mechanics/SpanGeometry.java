package org.exhale.mechanics;

/**
 * Plan-view shape and size of the free (unsupported) part of the cap, edges clamped.
 *
 * <p>{@code widthM} is the full span: the width of a line (long trench), the diameter of a disc,
 * the short side of a rectangle. {@code lengthM} is the long side of a rectangle and must be
 * {@code ≥ widthM} and finite; for a line it must be +∞ and for a disc equal to the width (the
 * factories {@link #line}, {@link #disc} and {@link #rectangle} fill it in).
 *
 * @param shape   plan-view shape
 * @param widthM  full span w [m] (line width, disc diameter, rectangle short side)
 * @param lengthM long side L [m] (+∞ for a line, = w for a disc)
 */
public record SpanGeometry(Shape shape, double widthM, double lengthM) {

    /** Plan-view shape of the span. */
    public enum Shape {
        /** A long line (trench): plane strain across the width. */
        LINE,
        /** A rectangle w × L, L ≥ w. */
        RECTANGLE,
        /** A circular disc of diameter w. */
        DISC
    }

    public SpanGeometry {
        if (shape == null) {
            throw new IllegalArgumentException("span shape must be given");
        }
        if (!(widthM > 0 && widthM < 1)) {
            throw new IllegalArgumentException("span width must be in (0, 1) m, got " + widthM);
        }
        switch (shape) {
            case LINE -> {
                if (lengthM != Double.POSITIVE_INFINITY) {
                    throw new IllegalArgumentException("a LINE span has infinite length, got " + lengthM
                            + " m (use RECTANGLE for a finite length)");
                }
            }
            case DISC -> {
                if (lengthM != widthM) {
                    throw new IllegalArgumentException("a DISC span has length equal to its diameter " + widthM
                            + " m, got " + lengthM);
                }
            }
            case RECTANGLE -> {
                if (!(lengthM >= widthM && lengthM < Double.POSITIVE_INFINITY)) {
                    throw new IllegalArgumentException("a RECTANGLE span needs a finite length >= its width "
                            + widthM + " m, got " + lengthM + " (give the short side as the width)");
                }
            }
            default -> throw new AssertionError(shape);
        }
    }

    /** A long line (trench) of full width w. */
    public static SpanGeometry line(double widthM) {
        return new SpanGeometry(Shape.LINE, widthM, Double.POSITIVE_INFINITY);
    }

    /** A disc of diameter w. */
    public static SpanGeometry disc(double diameterM) {
        return new SpanGeometry(Shape.DISC, diameterM, diameterM);
    }

    /** A rectangle with short side w and long side L ≥ w. */
    public static SpanGeometry rectangle(double widthM, double lengthM) {
        return new SpanGeometry(Shape.RECTANGLE, widthM, lengthM);
    }

    /** Aspect ratio L/w (≥ 1; +∞ for a line, 1 for a disc). */
    public double aspectRatio() {
        return lengthM / widthM;
    }
}
