package org.viewgain.engine;

import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import org.viewgain.spec.SpecLoader;

/**
 * Benchmark, not a test (run by {@code bench/availability.sh}): issue 17's aim, in one JVM with the data loaded once.
 * Times {@link Runner#run()} (the work units alone: no start-up, loading, tables or report) for three variants of
 * a spec with an availability curve: {@code source} (feature-sets [source], no curve), {@code plain} ([source,
 * source+imputed], no curve) and {@code curve} ([source, source+imputed] with the spec's curve). The imputer and source+imputed work of a plain run is
 * plain - source; what the curve adds is curve - plain. Prints one CSV row per timed round (process CPU seconds of
 * all threads, wall seconds), then the medians and the ratio.
 */
public final class AvailabilityBench {
    private AvailabilityBench() {
    }

    /** {@code args}: spec with a curve, rounds (3), threads (1). */
    public static void main(String[] args) throws Exception {
        Path spec = Path.of(args[0]);
        int rounds = args.length > 1 ? Integer.parseInt(args[1]) : 3;
        int threads = args.length > 2 ? Integer.parseInt(args[2]) : 1;
        String text = Files.readString(spec, StandardCharsets.UTF_8);
        // the curve re-runs the imputers and the source+imputed pipelines: the other feature sets are left out
        String curveText = text.replaceAll("(?m)^feature-sets: .*$", "feature-sets: [source, source+imputed]")
                .replaceAll("(?m)^  compare: .*$", "  compare: [\"source+imputed vs source\"]");
        String plainText = curveText.substring(0, curveText.indexOf("availability-curve:"));
        String sourceText = plainText.replaceAll("(?m)^feature-sets: .*$", "feature-sets: [source]")
                .replaceAll("(?m)^  compare: .*$", "  compare: []");
        String[] names = {"source", "plain", "curve"};
        Experiment[] ex = {prepare(spec, sourceText, "source"), prepare(spec, plainText, "plain"),
            prepare(spec, curveText, "curve")};
        for (Experiment e : ex) {
            new Runner(e, threads, Progress.NONE).run(); // warm-up
        }
        double[][] cpu = new double[3][rounds];
        double[][] wall = new double[3][rounds];
        com.sun.management.OperatingSystemMXBean os =
                (com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean();
        System.out.println("variant,round,cpu_seconds,wall_seconds,load_before");
        for (int r = 0; r < rounds; r++) {
            for (int v = 0; v < 3; v++) {
                double load = os.getSystemLoadAverage();
                long c0 = os.getProcessCpuTime();
                long t0 = System.nanoTime();
                new Runner(ex[v], threads, Progress.NONE).run();
                wall[v][r] = (System.nanoTime() - t0) / 1e9;
                cpu[v][r] = (os.getProcessCpuTime() - c0) / 1e9;
                System.out.println(String.format(Locale.ROOT, "%s,%d,%.2f,%.2f,%.2f", names[v], r + 1, cpu[v][r],
                        wall[v][r], load));
            }
        }
        double[] mc = new double[3];
        double[] mw = new double[3];
        for (int v = 0; v < 3; v++) {
            mc[v] = median(cpu[v]);
            mw[v] = median(wall[v]);
        }
        System.out.println(String.format(Locale.ROOT, "median CPU s: source %.2f, plain %.2f, curve %.2f; wall s: "
                + "source %.2f, plain %.2f, curve %.2f", mc[0], mc[1], mc[2], mw[0], mw[1], mw[2]));
        System.out.println(String.format(Locale.ROOT, "the curve adds %.2f x the imputer and source+imputed work of "
                + "a plain run in CPU, %.2f x in wall time", (mc[2] - mc[1]) / (mc[1] - mc[0]),
                (mw[2] - mw[1]) / (mw[1] - mw[0])));
    }

    private static Experiment prepare(Path spec, String text, String name) throws Exception {
        Path f = spec.resolveSibling(".bench-" + name + "-" + spec.getFileName());
        Files.writeString(f, text, StandardCharsets.UTF_8);
        try {
            return Setup.prepare(SpecLoader.load(f));
        } finally {
            Files.delete(f);
        }
    }

    private static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        return s[s.length / 2];
    }
}
