package org.viewgain.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The run's answer in one sentence, for the top of the report and the end of {@code run}: how many pairs of the
 * first comparison the spec asked for (normally source+imputed vs source) the primary test found better, with the
 * difference, its unadjusted interval and adjusted p-value of each win; and how many pipelines beat chance, or that
 * chance was not tested. It rests on the same rows as the answer section (the corrected t-test of balanced accuracy
 * when present) and never reads "no difference" where a test simply lacked power.
 */
public final class Verdict {
    private Verdict() {
    }

    /** The sentence for a finished run folder (read from its files). */
    public static String of(Path runDir) throws IOException {
        return of(ReportData.read(runDir, false));
    }

    static String of(ReportData d) {
        double alpha = d.alpha();
        String level = CsvTable.formatNumber(alpha);
        List<String> parts = new ArrayList<>();
        parts.add(comparison(d, alpha, level));
        parts.add(chance(d, level));
        return String.join("; ", parts) + ".";
    }

    private static String comparison(ReportData d, double alpha, String level) {
        if (d.comparisons == null || d.comparisons.rows().isEmpty()) {
            return "no paired comparison was asked for (significance.compare)";
        }
        String label = d.comparisons.rows().get(0).s("comparison");
        Map<String, CsvRows.Row> primary = new LinkedHashMap<>();
        for (CsvRows.Row r : d.comparisons.where(r -> r.s("comparison").equals(label)
                && !r.s("test").equals("bayes-correlated-t"))) {
            String pair = AnswerSection.a(r) + "#" + AnswerSection.bKey(r);
            CsvRows.Row had = primary.get(pair);
            if (had == null || isPrimary(r) && !isPrimary(had)) {
                primary.put(pair, r);
            }
        }
        List<String> wins = new ArrayList<>();
        int losses = 0;
        String adjust = "";
        String conf = AnswerSection.level(d);
        for (CsvRows.Row r : primary.values()) {
            adjust = r.s("adjust_method");
            double p = Double.isFinite(r.d("p_adjusted")) ? r.d("p_adjusted") : r.d("p_value");
            if (p <= alpha && r.d("difference") > 0) {
                String interval = Double.isFinite(r.d("ci_low")) ? String.format(Locale.ROOT,
                        ", unadjusted %s interval %s to %s", conf, Html.signed3(r.d("ci_low")),
                        Html.signed3(r.d("ci_high"))) : "";
                String who = r.s("classifier_a") + (r.s("imputer_a").isEmpty() || r.s("imputer_a").equals("none")
                        ? "" : ", " + r.s("imputer_a") + " imputer");
                wins.add(String.format(Locale.ROOT, "%s: %s %s%s, %s = %s", who, Html.signed3(r.d("difference")),
                        Names.metric(r.s("metric")), interval,
                        Double.isFinite(r.d("p_adjusted")) ? "adjusted p" : "p", Html.p(p)));
            } else if (p <= alpha) {
                losses++;
            }
        }
        String[] sides = label.split(" vs ", 2);
        String a = sides[0];
        String b = sides.length > 1 ? sides[1] : "the other";
        String after = adjust.isEmpty() || adjust.equals("none") ? "" : " after " + adjust + " adjustment";
        int m = primary.size();
        String of = m == 1 ? "the 1 comparison" : "the " + m + " comparisons";
        if (!wins.isEmpty()) {
            return String.format(Locale.ROOT, "%s beat %s in %d of %s at level %s%s (%s)%s", a, b, wins.size(), of
                    .replace("the ", ""), level, after, String.join("; ", wins),
                    losses > 0 ? " and was worse in " + losses : "");
        }
        if (losses > 0) {
            return String.format(Locale.ROOT, "%s did not beat %s in any of %s at level %s%s, and was worse in %d",
                    a, b, of, level, after, losses);
        }
        Power power = Power.of(d);
        String why = power.low() ? " (not evidence of no difference: " + power.plan()
                + " leave the corrected t-test little power)" : "";
        return String.format(Locale.ROOT, "%s did not beat %s in any of %s at level %s%s%s", a, b, of, level, after,
                why);
    }

    private static boolean isPrimary(CsvRows.Row r) {
        return r.s("test").equals("corrected-t") && r.s("metric").equals("balanced_accuracy");
    }

    private static String chance(ReportData d, String level) {
        if (d.permutations == null || d.permutations.rows().isEmpty()) {
            return "chance not tested (significance.permutations: 0)";
        }
        Chance chance = new Chance(d);
        java.util.Collection<CsvRows.Row> main = chance.pipelines();
        long beat = main.stream().filter(chance::beats).count();
        String metric = Names.metric(main.iterator().next().s("metric"));
        if (beat == main.size()) {
            return "every pipeline beat chance (permutation p \u2264 " + level + " on " + metric + ", unadjusted)";
        }
        if (beat == 0) {
            return "no pipeline beat chance at level " + level + " (permutation test on " + metric + ")";
        }
        return beat + " of " + main.size() + " pipelines beat chance (permutation p \u2264 " + level + " on " + metric
                + ", unadjusted)";
    }
}
