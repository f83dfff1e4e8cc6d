package org.exhale.report;

import java.util.Optional;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.labels.StandardCategoryItemLabelGenerator;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.data.category.DefaultCategoryDataset;

import com.fasterxml.jackson.databind.JsonNode;

/** Charts of a planned recipe from plan.json. */
final class PlanCharts {
    /** The ride's bar: between the bound's light and the plan's dark tone, also in greyscale. */
    private static final java.awt.Color RIDE_GREY = new java.awt.Color(0x62, 0x68, 0x6f);

    private PlanCharts() {
    }

    /**
     * The plan's duration beside the lower bound no recipe within the limits can beat and, where plan.json has it, the
     * planner's closed-loop ride with unlimited steps between them (bound ≤ ride ≤ plan).
     */
    static Optional<Figure> lowerBound(RunFolder f) {
        if (f.plan().isEmpty()) {
            return Optional.empty();
        }
        JsonNode p = f.plan().get();
        if (!p.path("duration_s").isNumber() || !p.path("lower_bound_s").isNumber()) {
            return Optional.empty();
        }
        double plan = p.path("duration_s").asDouble() / 60;
        double bound = p.path("lower_bound_s").asDouble() / 60;
        double ride = p.path("ride_s").isNumber() ? p.path("ride_s").asDouble() / 60 : Double.NaN;
        boolean withRide = Double.isFinite(ride) && ride > 0;
        // a ride that crossed a limit on the way is a reference only, not a time any recipe is known to reach
        boolean rideHeld = p.path("ride_admissible").asBoolean(true);
        String rideLabel = rideHeld ? "closed-loop ride" : "ride (crossed a limit)";
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        d.addValue(bound, "duration", "lower bound");
        if (withRide) {
            d.addValue(ride, "duration", rideLabel);
        }
        d.addValue(plan, "duration", "plan");
        int planColumn = withRide ? 2 : 1;
        BarRenderer r = new BarRenderer() {
            private static final long serialVersionUID = 1L;

            @Override
            public java.awt.Paint getItemPaint(int row, int column) {
                // the bound light, the ride mid-grey, the plan dark: told apart in greyscale as well as by the axis label
                return column == 0 ? ChartStyle.colour(7) : column == planColumn ? ChartStyle.colour(0) : RIDE_GREY;
            }
        };
        r.setBarPainter(new StandardBarPainter());
        r.setShadowVisible(false);
        r.setMaximumBarWidth(0.3);
        r.setDefaultItemLabelGenerator(new StandardCategoryItemLabelGenerator("{2} min",
                new java.text.DecimalFormat("0.0")));
        r.setDefaultItemLabelsVisible(true);
        r.setDefaultPositiveItemLabelPosition(new org.jfree.chart.labels.ItemLabelPosition(
                org.jfree.chart.labels.ItemLabelAnchor.OUTSIDE3, org.jfree.chart.ui.TextAnchor.CENTER_LEFT));
        r.setItemLabelAnchorOffset(8);
        r.setDefaultItemLabelFont(ChartStyle.LABEL);
        r.setDefaultItemLabelPaint(ChartStyle.INK);
        CategoryAxis x = new CategoryAxis("");
        NumberAxis y = new NumberAxis("Duration [min]");
        y.setUpperMargin(0.15);
        CategoryPlot plot = new CategoryPlot(d, x, y, r);
        plot.setOrientation(PlotOrientation.HORIZONTAL);
        plot.setRangeAxisLocation(org.jfree.chart.axis.AxisLocation.BOTTOM_OR_LEFT);
        plot.setRangeGridlinePaint(ChartStyle.GRID);
        ChartStyle.axis(x);
        ChartStyle.axis(y);
        String ratio = bound > 0 ? "plan / bound = " + ReportText.sig(plan / bound, 3)
                + (withRide && rideHeld ? "; plan / ride = " + ReportText.sig(plan / ride, 4) : "") : null;
        String rideWords = !withRide ? "." : rideHeld ? " and the planner's closed-loop ride (unlimited steps)."
                : " and the planner's closed-loop ride (unlimited steps), which crossed a limit on the way: a reference"
                + " only, not a time any recipe is known to reach.";
        JFreeChart c = ChartStyle.chart("Plan against the lower bound", plot, ReportText.label(f.caseName()), ratio);
        c.removeLegend();
        return Optional.of(new Figure("lower-bound", "Plan against the lower bound",
                p.path("lower_bound_rigorous").asBoolean(false)
                        ? "Duration of the planned recipe beside the shortest time any recipe within the limits could take"
                        + rideWords
                        : "Duration of the planned recipe beside an estimated lower bound (not a guarantee)" + rideWords,
                c));
    }
}
