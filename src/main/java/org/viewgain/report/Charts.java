package org.viewgain.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.util.Base64;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.Plot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.ui.RectangleInsets;

/**
 * Renders JFreeChart charts to PNG data URIs (drawn at twice the shown size, so they stay sharp on screen and in
 * print) in the report's own colours. AWT runs headless: no display is needed.
 */
final class Charts {
    static {
        System.setProperty("java.awt.headless", "true");
    }

    /**
     * The report's palette for series, safe for the common colour-vision deficiencies (Okabe &amp; Ito 2008, "Color
     * universal design"): blue, vermillion, bluish green, reddish purple, orange, sky blue, black, and a grey in
     * place of their yellow, which is too pale on white. Line charts also give each series its own dash pattern
     * ({@link #line}), so they read without colour too.
     */
    static final Color[] PALETTE = {new Color(0x0072B2), new Color(0xD55E00), new Color(0x009E73),
        new Color(0xCC79A7), new Color(0xE69F00), new Color(0x56B4E9), new Color(0x000000), new Color(0x7F7F7F)};
    /** Dash patterns of line series, in series order: solid, long dashes, dots, dash-dot, and so on. */
    private static final float[][] DASHES = {null, {9f, 4f}, {2f, 3f}, {9f, 3f, 2f, 3f}, {14f, 4f}, {5f, 5f},
        {2f, 3f, 2f, 3f, 9f, 3f}, {1f, 6f}};
    static final Color INK = new Color(0x22303C);
    static final Color GRID = new Color(0xDDE3E8);
    static final Color CHANCE = new Color(0x9AA5AF);
    static final Font TITLE = new Font("SansSerif", Font.BOLD, 14);
    static final Font LABEL = new Font("SansSerif", Font.PLAIN, 12);
    static final Font TICK = new Font("SansSerif", Font.PLAIN, 11);

    private Charts() {
    }

    static Paint color(int i) {
        return PALETTE[Math.floorMod(i, PALETTE.length)];
    }

    static BasicStroke stroke(float width) {
        return new BasicStroke(width, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    }

    /** The stroke of line series i: its own dash pattern (see {@link #DASHES}), solid for the first. */
    static BasicStroke line(int i, float width) {
        float[] dash = DASHES[Math.floorMod(i, DASHES.length)];
        return dash == null ? stroke(width)
                : new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, dash, 0f);
    }

    static BasicStroke dashed(float width) {
        return new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {5f, 4f}, 0f);
    }

    /** Applies the report's look to a chart. */
    static JFreeChart style(JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        chart.setAntiAlias(true);
        chart.setTextAntiAlias(true);
        if (chart.getTitle() != null) {
            chart.getTitle().setFont(TITLE);
            chart.getTitle().setPaint(INK);
        }
        LegendTitle legend = chart.getLegend();
        if (legend != null) {
            legend.setItemFont(LABEL);
            legend.setFrame(org.jfree.chart.block.BlockBorder.NONE);
            legend.setBackgroundPaint(Color.WHITE);
        }
        Plot plot = chart.getPlot();
        plot.setBackgroundPaint(Color.WHITE);
        plot.setOutlineVisible(false);
        plot.setInsets(new RectangleInsets(6, 6, 6, 12));
        if (plot instanceof XYPlot xy) {
            xy.setDomainGridlinePaint(GRID);
            xy.setRangeGridlinePaint(GRID);
            xy.setDomainGridlineStroke(stroke(1f));
            xy.setRangeGridlineStroke(stroke(1f));
            axes(xy.getDomainAxis());
            axes(xy.getRangeAxis());
        } else if (plot instanceof CategoryPlot cp) {
            cp.setRangeGridlinePaint(GRID);
            cp.setRangeGridlineStroke(stroke(1f));
            cp.setDomainGridlinesVisible(false);
            axes(cp.getDomainAxis());
            axes(cp.getRangeAxis());
        }
        return chart;
    }

    private static void axes(org.jfree.chart.axis.Axis a) {
        if (a != null) {
            a.setLabelFont(LABEL);
            a.setTickLabelFont(TICK);
            a.setLabelPaint(INK);
            a.setTickLabelPaint(INK);
            a.setAxisLinePaint(CHANCE);
        }
    }

    /** The chart as a PNG data URI of {@code width} x {@code height} CSS pixels. */
    static String dataUri(JFreeChart chart, int width, int height, Redactor redact) {
        BufferedImage img = chart.createBufferedImage(2 * width, 2 * height, width, height, null);
        try {
            byte[] png = ChartUtils.encodeAsPNG(img);
            return "data:image/png;base64," + redact.base64(Base64.getEncoder().encodeToString(png));
        } catch (IOException e) {
            throw new IllegalStateException("cannot encode a chart as PNG", e);
        }
    }

    /** A chart as a figure, or a plain note when it cannot be drawn (e.g. no fonts on a bare machine). */
    static String figure(java.util.function.Supplier<JFreeChart> chart, int width, int height, String caption,
                         Redactor redact) {
        return ChartBatch.submit(() -> draw(chart, width, height, caption, redact));
    }

    private static String draw(java.util.function.Supplier<JFreeChart> chart, int width, int height, String caption,
                               Redactor redact) {
        try {
            return Html.img(dataUri(style(chart.get()), width, height, redact), caption, width);
        } catch (RuntimeException | Error e) {
            if (e instanceof VirtualMachineError vme) {
                throw vme;
            }
            return "<p class=\"absent\">The chart \u201c" + Html.esc(caption) + "\u201d could not be drawn ("
                    + Html.esc(e.getClass().getSimpleName()) + ").</p>\n";
        }
    }
}
