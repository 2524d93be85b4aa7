package org.viewgain.report;

import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Draws a report's charts on all cores while the report's text is built: each chart is handed to a pool and stands
 * in the text as a marker (unique to this report) until {@link #fill} puts the finished figure in its place, in the
 * order the charts were asked for. A chart's bytes do not depend on which thread drew it, so the report is the same
 * on any number of cores. Outside a batch, charts are drawn where they are asked for.
 */
final class ChartBatch implements AutoCloseable {
    private static final ThreadLocal<ChartBatch> CURRENT = new ThreadLocal<>();

    private final ExecutorService pool;
    private final List<Future<String>> parts = new ArrayList<>();
    private final String mark = "\u0000chart-" + UUID.randomUUID() + "-";
    private final Pattern marker = Pattern.compile(Pattern.quote(mark) + "(\\d+)\u0000");

    private ChartBatch(int threads) {
        pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "viewgain-chart");
            t.setDaemon(true);
            return t;
        });
    }

    /** Opens a batch for the calling thread; charts asked for until {@link #close} are drawn in the pool. */
    static ChartBatch open() {
        ChartBatch b = new ChartBatch(Math.max(1, Runtime.getRuntime().availableProcessors()));
        CURRENT.set(b);
        return b;
    }

    /** The figure's HTML, or a marker for it when a batch is open on this thread. */
    static String submit(Callable<String> figure) {
        ChartBatch b = CURRENT.get();
        if (b == null) {
            return call(figure);
        }
        b.parts.add(b.pool.submit(figure));
        return b.mark + (b.parts.size() - 1) + "\u0000";
    }

    /** The text with every marker of this batch replaced by its finished figure. */
    String fill(String text) {
        Matcher m = marker.matcher(text);
        StringBuilder out = new StringBuilder(text.length() + (1 << 20));
        while (m.find()) {
            m.appendReplacement(out, Matcher.quoteReplacement(result(parts.get(Integer.parseInt(m.group(1))))));
        }
        m.appendTail(out);
        return out.toString();
    }

    private static String result(Future<String> f) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while drawing the report's charts", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException("a chart could not be drawn: " + e.getCause().getMessage(), e);
        }
    }

    private static String call(Callable<String> figure) {
        try {
            return figure.call();
        } catch (RuntimeException e) {
            throw e;
        } catch (Exception e) {
            throw new IllegalStateException(e);
        }
    }

    @Override
    public void close() {
        CURRENT.remove();
        pool.shutdownNow();
    }
}
