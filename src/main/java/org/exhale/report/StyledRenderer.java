package org.exhale.report;

import java.util.HashMap;
import java.util.Map;

import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;

/**
 * Lines with a marker every few points rather than at every point, so long histories stay
 * readable while each series still carries its shape (for greyscale prints). Series without a
 * line are drawn as markers only (measured data).
 */
final class StyledRenderer extends XYLineAndShapeRenderer {
    private static final long serialVersionUID = 1L;
    private final Map<Integer, Integer> every = new HashMap<>();

    StyledRenderer() {
        super(true, true);
        setDrawSeriesLineAsPath(true);
        setDefaultShapesFilled(true);
        setUseFillPaint(false);
    }

    /**
     * Styles one series.
     *
     * @param points  how many points it has (markers are spaced to about a dozen per line)
     * @param markersOnly no line, a marker at every point
     */
    void series(int s, int colour, int dash, int shape, float width, int points, boolean markersOnly) {
        setSeriesPaint(s, ChartStyle.colour(colour));
        setSeriesStroke(s, ChartStyle.line(dash, width));
        setSeriesShape(s, ChartStyle.shape(shape));
        setSeriesLinesVisible(s, !markersOnly);
        every.put(s, markersOnly ? 1 : Math.max(1, points / 12));
    }

    @Override
    public boolean getItemShapeVisible(int series, int item) {
        int k = every.getOrDefault(series, 1);
        // item 0 always: the legend takes its marker from the first item
        return item == 0 || (item + series * Math.max(1, k / 5)) % k == 0;
    }
}
