package dev.reweigh.examples.demo;

import dev.reweigh.examples.csv.DataFileException;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.CategoryLabelPositions;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.LineAndShapeRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.geom.Ellipse2D;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

/**
 * The demo's three PNG charts, drawn with JFreeChart off-screen (the AWT runs headless).
 *
 * @since 0.1
 */
public final class DemoCharts {
    private static final int WIDTH = 1000;
    private static final int HEIGHT = 640;
    private static final int MAX_POINTS = 4_000;
    private static final Color OBSERVED = new Color(0x1b, 0x6c, 0xa8);
    private static final Color FITTED = new Color(0xd9, 0x5f, 0x02);
    private static final Color TRUTH = new Color(0x33, 0x99, 0x33);
    private static final Color BARS = new Color(0xcf, 0xd8, 0xdc);

    static {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
    }

    private DemoCharts() {
    }

    /**
     * Draws observed and fitted claim frequency per level of a factor, over bars of exposure.
     *
     * @param file the PNG file to write
     * @param factor the factor's name (for the axis label)
     * @param levels the levels, in order
     * @param exposure total exposure per level
     * @param observed observed claims per unit of exposure per level
     * @param fitted fitted claims per unit of exposure per level
     * @param truth the true expected claims per unit of exposure per level, or null when unknown
     * @throws DataFileException when the file cannot be written
     * @since 0.1
     */
    public static void observedVersusFitted(Path file, String factor, List<String> levels, double[] exposure,
                                            double[] observed, double[] fitted, double[] truth) {
        DefaultCategoryDataset bars = new DefaultCategoryDataset();
        DefaultCategoryDataset lines = new DefaultCategoryDataset();
        for (int i = 0; i < levels.size(); i++) {
            bars.addValue(exposure[i], "exposure (policy-years)", levels.get(i));
            lines.addValue(observed[i], "observed frequency", levels.get(i));
            lines.addValue(fitted[i], "fitted frequency", levels.get(i));
            if (truth != null) {
                lines.addValue(truth[i], "true expected frequency", levels.get(i));
            }
        }
        CategoryAxis axis = new CategoryAxis(factor);
        axis.setCategoryLabelPositions(CategoryLabelPositions.UP_45);
        BarRenderer barRenderer = new BarRenderer();
        barRenderer.setBarPainter(new StandardBarPainter());
        barRenderer.setShadowVisible(false);
        barRenderer.setSeriesPaint(0, BARS);
        CategoryPlot plot = new CategoryPlot(bars, axis, new NumberAxis("exposure (policy-years)"), barRenderer);
        NumberAxis frequencyAxis = new NumberAxis("claims per policy-year");
        frequencyAxis.setAutoRangeIncludesZero(true);
        plot.setDataset(1, lines);
        plot.setRangeAxis(1, frequencyAxis);
        plot.mapDatasetToRangeAxis(1, 1);
        LineAndShapeRenderer lineRenderer = new LineAndShapeRenderer(true, true);
        lineRenderer.setSeriesPaint(0, OBSERVED);
        lineRenderer.setSeriesPaint(1, FITTED);
        lineRenderer.setSeriesStroke(0, new BasicStroke(2f));
        lineRenderer.setSeriesStroke(1, new BasicStroke(2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 1f,
                new float[] {6f, 4f}, 0f));
        lineRenderer.setSeriesPaint(2, TRUTH);
        lineRenderer.setSeriesStroke(2, new BasicStroke(1.5f));
        plot.setRenderer(1, lineRenderer);
        plot.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        save(file, new JFreeChart("Claim frequency by " + factor + ": observed and fitted", JFreeChart.DEFAULT_TITLE_FONT,
                plot, true));
    }

    /**
     * Draws residuals against fitted means, thinned evenly to at
     * most 4,000 points.
     *
     * @param file the PNG file to write
     * @param title the chart title
     * @param fitted fitted means, positive
     * @param residuals residuals, one per fitted mean
     * @param residualLabel the residual axis label
     * @throws DataFileException when the file cannot be written
     * @since 0.1
     */
    public static void residualsVersusFitted(Path file, String title, double[] fitted, double[] residuals,
                                             String residualLabel) {
        XYSeries points = new XYSeries("rows", false, true);
        int step = Math.max(1, fitted.length / MAX_POINTS);
        for (int i = 0; i < fitted.length; i += step) {
            if (fitted[i] > 0 && Double.isFinite(residuals[i])) {
                points.add(fitted[i], residuals[i]);
            }
        }
        NumberAxis x = new NumberAxis("fitted mean");
        x.setAutoRangeIncludesZero(false);
        NumberAxis y = new NumberAxis(residualLabel);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(false, true);
        renderer.setSeriesShape(0, new Ellipse2D.Double(-1.5, -1.5, 3, 3));
        renderer.setSeriesPaint(0, new Color(0x1b, 0x6c, 0xa8, 120));
        XYPlot plot = new XYPlot(new XYSeriesCollection(points), x, y, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        plot.setDomainGridlinePaint(Color.LIGHT_GRAY);
        plot.setOrientation(PlotOrientation.VERTICAL);
        save(file, new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, false));
    }

    /**
     * Draws a normal quantile-quantile plot: sorted residuals against standard normal quantiles,
     * at most 4,000 evenly spaced order statistics, with the line y = x.
     *
     * @param file the PNG file to write
     * @param title the chart title
     * @param residuals the residuals (NaN values are left out)
     * @throws DataFileException when the file cannot be written
     * @since 0.1
     */
    public static void quantileQuantile(Path file, String title, double[] residuals) {
        double[] sorted = Arrays.stream(residuals).filter(Double::isFinite).sorted().toArray();
        int n = sorted.length;
        NormalDistribution normal = new NormalDistribution(null, 0, 1);
        XYSeries points = new XYSeries("residuals", false, true);
        int m = Math.min(n, MAX_POINTS);
        double low = Double.POSITIVE_INFINITY;
        double high = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < m; k++) {
            int i = (int) Math.min(n - 1, Math.round((k + 0.5) / m * n - 0.5));
            double q = normal.inverseCumulativeProbability((i + 0.5) / n);
            points.add(q, sorted[i]);
            low = Math.min(low, Math.min(q, sorted[i]));
            high = Math.max(high, Math.max(q, sorted[i]));
        }
        XYSeries line = new XYSeries("y = x", false, true);
        line.add(low, low);
        line.add(high, high);
        XYSeriesCollection data = new XYSeriesCollection();
        data.addSeries(points);
        data.addSeries(line);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer();
        renderer.setSeriesLinesVisible(0, false);
        renderer.setSeriesShapesVisible(0, true);
        renderer.setSeriesShape(0, new Ellipse2D.Double(-1.5, -1.5, 3, 3));
        renderer.setSeriesPaint(0, OBSERVED);
        renderer.setSeriesLinesVisible(1, true);
        renderer.setSeriesShapesVisible(1, false);
        renderer.setSeriesPaint(1, FITTED);
        XYPlot plot = new XYPlot(data, new NumberAxis("standard normal quantile"),
                new NumberAxis("randomized quantile residual"), renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        plot.setDomainGridlinePaint(Color.LIGHT_GRAY);
        save(file, new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true));
    }

    private static void save(Path file, JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        try {
            ChartUtils.saveChartAsPNG(file.toFile(), chart, WIDTH, HEIGHT);
        } catch (IOException e) {
            throw new DataFileException(file.toString(), "cannot write the chart: " + e.getMessage(), e);
        }
    }
}
