package org.viewgain.run;

import java.io.PrintWriter;
import java.util.Locale;
import org.viewgain.engine.Progress;

/**
 * A progress line on stderr: done/total, rate and time left; redrawn in place on a terminal, otherwise (a log file,
 * a cluster job) printed at every tenth of the work and at least once a minute while units finish.
 */
final class ProgressLine implements Progress {
    private final PrintWriter err;
    private final boolean terminal;
    private final long start = System.nanoTime();
    private long lastPrint;
    private int lastDecile = -1;

    ProgressLine(PrintWriter err) {
        this.err = err;
        this.terminal = System.console() != null;
    }

    @Override
    public synchronized void update(long done, long total) {
        long now = System.nanoTime();
        int decile = (int) (10 * done / Math.max(1, total));
        boolean last = done >= total;
        boolean due = terminal ? now - lastPrint >= 250_000_000L
                : decile != lastDecile || now - lastPrint >= 60_000_000_000L;
        if (!due && !last) {
            return;
        }
        lastPrint = now;
        lastDecile = decile;
        double secs = (now - start) / 1e9;
        double rate = done / Math.max(secs, 1e-9);
        long left = rate > 0 ? Math.round((total - done) / rate) : 0;
        String line = String.format(Locale.ROOT, "[viewgain] %d/%d work units (%d%%), %.2f units/s, about %d:%02d left",
                done, total, 100 * done / Math.max(1, total), rate, left / 60, left % 60);
        err.print(terminal ? "\r" + line + (last ? "\n" : "") : line + "\n");
        err.flush();
    }
}
