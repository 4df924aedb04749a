package org.dockgate.evaluation;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Rectangle;
import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.rtd.CallendarVanDusen;
import org.jfree.chart.ChartFactory;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.svg.SVGGraphics2D;

/**
 * Charts of a unit's readings: the calibration curve against the nominal transfer function with the
 * tolerance and acceptance (guard-banded) envelopes, and the frequency response. Drawn with JFreeChart,
 * as SVG for pages; the same {@link JFreeChart} objects draw onto PDFs.
 */
public final class Charts {

    private static final Color READINGS = new Color(11, 92, 138);
    private static final Color NOMINAL = new Color(90, 100, 114);
    private static final Color TOLERANCE = new Color(168, 38, 27);
    private static final Color ACCEPTANCE = new Color(31, 122, 58);

    private Charts() {
    }

    /**
     * Output against input: readings as points, the nominal line, and the envelopes the sensitivity
     * tolerance (or the accuracy in %FSO, or an RTD's class) allows, with the acceptance envelope the
     * guard band leaves.
     */
    public static JFreeChart calibration(SensorSpecification spec, ProcedureProposal procedure,
                                         List<UnitEvaluationView.StaticPoint> points) {
        XYSeries readings = new XYSeries("readings", false, true);
        points.forEach(p -> readings.add(p.input(), p.output()));
        XYSeries nominal = new XYSeries("nominal", true, true);
        XYSeries tolLow = new XYSeries("tolerance", true, true);
        XYSeries tolHigh = new XYSeries("tolerance (upper)", true, true);
        XYSeries accLow = new XYSeries("acceptance limits", true, true);
        XYSeries accHigh = new XYSeries("acceptance (upper)", true, true);
        int steps = 20;
        for (int i = 0; i <= steps; i++) {
            double x = spec.rangeMin() + spec.span() * i / steps;
            Band b = band(spec, procedure, x);
            if (b == null) {
                continue;
            }
            nominal.add(x, b.nominal);
            tolLow.add(x, b.tolLow);
            tolHigh.add(x, b.tolHigh);
            accLow.add(x, b.accLow);
            accHigh.add(x, b.accHigh);
        }
        XYSeriesCollection data = new XYSeriesCollection();
        data.addSeries(readings);
        data.addSeries(nominal);
        data.addSeries(tolLow);
        data.addSeries(tolHigh);
        data.addSeries(accLow);
        data.addSeries(accHigh);
        JFreeChart chart = ChartFactory.createXYLineChart(null, "input (" + spec.inputUnit() + ")",
                "output (" + spec.outputUnit() + ")", data, PlotOrientation.VERTICAL, true, false, false);
        XYPlot plot = chart.getXYPlot();
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer();
        r.setSeriesLinesVisible(0, false);
        r.setSeriesShapesVisible(0, true);
        r.setSeriesPaint(0, READINGS);
        style(r, 1, NOMINAL, new BasicStroke(1.2f));
        BasicStroke dashed = new BasicStroke(1f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f);
        BasicStroke dotted = new BasicStroke(1f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {2f, 3f}, 0f);
        style(r, 2, TOLERANCE, dashed);
        style(r, 3, TOLERANCE, dashed);
        style(r, 4, ACCEPTANCE, dotted);
        style(r, 5, ACCEPTANCE, dotted);
        r.setSeriesVisibleInLegend(3, false);
        r.setSeriesVisibleInLegend(5, false);
        plot.setRenderer(r);
        finish(chart);
        return chart;
    }

    /** Amplitude against frequency (log axis), with the flatness band when the specification has one. */
    public static JFreeChart frequencyResponse(SensorSpecification spec, List<UnitEvaluationView.SweepPoint> points) {
        XYSeries response = new XYSeries("amplitude");
        points.forEach(p -> response.add(p.frequencyHz(), p.amplitude()));
        XYSeriesCollection data = new XYSeriesCollection(response);
        JFreeChart chart = ChartFactory.createXYLineChart(null, "frequency (Hz)", "amplitude", data,
                PlotOrientation.VERTICAL, true, false, false);
        XYPlot plot = chart.getXYPlot();
        LogAxis axis = new LogAxis("frequency (Hz)");
        axis.setSmallestValue(0.1);
        plot.setDomainAxis(axis);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, true);
        r.setSeriesPaint(0, READINGS);
        plot.setRenderer(r);
        if (spec.bandwidth() != null && spec.bandwidth().upperHz() > 0) {
            var marker = new org.jfree.chart.plot.ValueMarker(spec.bandwidth().upperHz(), TOLERANCE, new BasicStroke(1f));
            marker.setLabel("specified limit " + spec.bandwidth().upperHz() + " Hz");
            marker.setLabelFont(new Font(Font.SANS_SERIF, Font.PLAIN, 10));
            plot.addDomainMarker(marker);
        }
        finish(chart);
        return chart;
    }

    public static String svg(JFreeChart chart, int width, int height) {
        SVGGraphics2D g = new SVGGraphics2D(width, height);
        chart.draw(g, new Rectangle(0, 0, width, height));
        return g.getSVGElement();
    }

    private record Band(double nominal, double tolLow, double tolHigh, double accLow, double accHigh) {
    }

    /** The nominal output at x and the envelopes around it, in the output unit. */
    private static Band band(SensorSpecification spec, ProcedureProposal procedure, double x) {
        if (spec.rtd() != null) {
            CallendarVanDusen cvd = CallendarVanDusen.iec60751(spec.rtd().r0Ohm());
            double r = cvd.resistanceOhm(x);
            double slope = cvd.sensitivityOhmPerC(x);
            double tol = org.dockgate.core.rtd.ToleranceClass.parse(spec.rtd().toleranceClass()).toleranceC(x) * slope;
            MetricAcceptance a = acceptance(procedure, Metric.RTD_TOLERANCE);
            double inner = a == null ? tol : Math.max(0, a.acceptanceUpper().orElse(a.toleranceUpper().orElse(0))
                    / a.toleranceUpper().orElse(1) * tol);
            return new Band(r, r - tol, r + tol, r - inner, r + inner);
        }
        if (spec.sensitivity() == null) {
            return null;
        }
        double s = Units.convert(spec.sensitivity().nominal(), spec.sensitivity().unit(),
                "(" + spec.outputUnit() + ")/(" + spec.inputUnit() + ")");
        double offset = spec.zeroOffset() == null ? 0 : Units.convert(spec.zeroOffset().nominal(), spec.zeroOffset().unit(),
                spec.outputUnit());
        double nominal = offset + s * x;
        MetricAcceptance accuracy = acceptance(procedure, Metric.ACCURACY);
        if (accuracy != null) {
            double fso = Math.abs(s) * spec.span();
            double tol = accuracy.toleranceUpper().orElse(0) / 100 * fso;
            double acc = accuracy.acceptanceUpper().orElse(accuracy.toleranceUpper().orElse(0)) / 100 * fso;
            return new Band(nominal, nominal - tol, nominal + tol, nominal - Math.max(0, acc), nominal + Math.max(0, acc));
        }
        MetricAcceptance sens = acceptance(procedure, Metric.SENSITIVITY);
        double ratio = s / spec.sensitivity().nominal();
        OptionalDouble tl = sens == null ? OptionalDouble.empty() : sens.toleranceLower();
        OptionalDouble tu = sens == null ? OptionalDouble.empty() : sens.toleranceUpper();
        double lowS = tl.orElse(spec.sensitivity().nominal()) * ratio;
        double highS = tu.orElse(spec.sensitivity().nominal()) * ratio;
        double accLowS = sens == null ? lowS : sens.acceptanceLower().orElse(spec.sensitivity().nominal()) * ratio;
        double accHighS = sens == null ? highS : sens.acceptanceUpper().orElse(spec.sensitivity().nominal()) * ratio;
        return new Band(nominal, offset + Math.min(lowS * x, highS * x), offset + Math.max(lowS * x, highS * x),
                offset + Math.min(accLowS * x, accHighS * x), offset + Math.max(accLowS * x, accHighS * x));
    }

    private static MetricAcceptance acceptance(ProcedureProposal procedure, Metric metric) {
        return procedure.acceptance().stream().filter(a -> a.metric() == metric).findFirst().orElse(null);
    }

    private static void style(XYLineAndShapeRenderer r, int series, Color color, BasicStroke stroke) {
        r.setSeriesPaint(series, color);
        r.setSeriesStroke(series, stroke);
        r.setSeriesShapesVisible(series, false);
        r.setSeriesLinesVisible(series, true);
    }

    private static void finish(JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        chart.getXYPlot().setBackgroundPaint(Color.WHITE);
        chart.getXYPlot().setDomainGridlinePaint(new Color(213, 218, 225));
        chart.getXYPlot().setRangeGridlinePaint(new Color(213, 218, 225));
    }
}
