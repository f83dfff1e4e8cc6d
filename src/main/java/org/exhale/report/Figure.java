package org.exhale.report;

import org.jfree.chart.JFreeChart;

/**
 * One chart of a report.
 *
 * @param id      file stem in charts/ (letters, digits and dashes)
 * @param title   the chart's title
 * @param caption what the chart shows, one or two sentences for the page
 * @param chart   the chart itself
 */
public record Figure(String id, String title, String caption, JFreeChart chart) {
    public Figure {
        if (!id.matches("[a-z0-9-]+")) {
            throw new IllegalArgumentException("chart id must be lower-case letters, digits and dashes: " + id);
        }
    }
}
