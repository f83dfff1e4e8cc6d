package org.exhale.simulation;

import org.exhale.mechanics.SpanGeometry;
import org.exhale.mechanics.SpanGeometry.Shape;

/**
 * The cavity filled with polymer. Gas leaves only through the cap above it, so all balances are
 * per unit of cavity (= vent) area and only the height enters the gas balance; the plan-view
 * size enters the cap mechanics.
 *
 * @param shape   plan-view shape
 * @param widthM  line width, rectangle short side, or disc diameter w [m]
 * @param lengthM rectangle long side L [m] (equal to the width for other shapes)
 * @param heightM cavity height d [m]
 */
public record Cavity(Shape shape, double widthM, double lengthM, double heightM) {
    public Cavity {
        if (shape == null) {
            throw new IllegalArgumentException("cavity shape is required");
        }
        if (!(widthM > 0 && widthM <= 0.1)) {
            throw new IllegalArgumentException("cavity width must be in (0, 100] mm, got " + widthM + " m");
        }
        if (!(heightM > 0 && heightM <= 0.01)) {
            throw new IllegalArgumentException("cavity height must be in (0, 10] mm, got " + heightM + " m");
        }
        if (shape == Shape.RECTANGLE && !(lengthM >= widthM && lengthM <= 1)) {
            throw new IllegalArgumentException("rectangle length must be at least its width and at most 1 m, got " + lengthM + " m");
        }
        if (shape != Shape.RECTANGLE) {
            lengthM = widthM;
        }
    }

    /** The freed cap span above the cavity. */
    public SpanGeometry span() {
        return switch (shape) {
            case LINE -> SpanGeometry.line(widthM);
            case DISC -> SpanGeometry.disc(widthM);
            case RECTANGLE -> SpanGeometry.rectangle(widthM, lengthM);
        };
    }
}
