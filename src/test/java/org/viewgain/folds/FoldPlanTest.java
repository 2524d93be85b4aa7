package org.viewgain.folds;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.HashSet;
import java.util.Set;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

class FoldPlanTest {
    /** 23 of stratum 0, 14 of stratum 1, 6 of stratum 2, shuffled order. */
    static int[] strata() {
        int[] s = new int[43];
        for (int i = 0; i < s.length; i++) {
            s[i] = i % 3 == 0 && i < 18 ? 2 : (i % 3 == 1 ? 1 : 0);
        }
        return s;
    }

    @Test
    void givenStratifiedPlan_whenInspected_thenEachSubjectTestedOncePerRepeatAndFoldsPartition() {
        int[] s = strata();
        FoldPlan plan = FoldPlan.stratifiedKFold(s, 5, 3, 11);
        for (int r = 0; r < 3; r++) {
            int[] seen = new int[s.length];
            for (int f = 0; f < plan.folds(r); f++) {
                for (int i : plan.test(r, f)) {
                    seen[i]++;
                }
                int[] train = plan.train(r, f);
                Set<Integer> t = new HashSet<>();
                Arrays.stream(plan.test(r, f)).forEach(t::add);
                assertTrue(Arrays.stream(train).noneMatch(t::contains));
                assertEquals(s.length, train.length + plan.test(r, f).length);
            }
            assertTrue(Arrays.stream(seen).allMatch(c -> c == 1));
        }
    }

    @Test
    void givenStratifiedPlan_whenCounted_thenStrataAndSizesBalancedWithinOne() {
        int[] s = strata();
        FoldPlan plan = FoldPlan.stratifiedKFold(s, 5, 2, 11);
        for (int r = 0; r < 2; r++) {
            final int rep = r;
            int[] sizes = IntStream.range(0, 5).map(f -> plan.test(rep, f).length).toArray();
            assertTrue(Arrays.stream(sizes).max().getAsInt() - Arrays.stream(sizes).min().getAsInt() <= 1);
            for (int stratum = 0; stratum < 3; stratum++) {
                final int st = stratum;
                final int rr = r;
                int[] per = IntStream.range(0, 5)
                        .map(f -> (int) Arrays.stream(plan.test(rr, f)).filter(i -> s[i] == st).count()).toArray();
                assertTrue(Arrays.stream(per).max().getAsInt() - Arrays.stream(per).min().getAsInt() <= 1,
                        Arrays.toString(per));
            }
        }
    }

    @Test
    void givenSeeds_whenPlansMade_thenSameSeedSamePlanAndRepeatsDiffer() {
        int[] s = strata();
        FoldPlan a = FoldPlan.stratifiedKFold(s, 5, 2, 11);
        FoldPlan b = FoldPlan.stratifiedKFold(s, 5, 2, 11);
        FoldPlan c = FoldPlan.stratifiedKFold(s, 5, 2, 12);
        int[] a0 = IntStream.range(0, s.length).map(i -> a.foldOf(0, i)).toArray();
        int[] a1 = IntStream.range(0, s.length).map(i -> a.foldOf(1, i)).toArray();
        assertArrayEquals(a0, IntStream.range(0, s.length).map(i -> b.foldOf(0, i)).toArray());
        assertFalse(Arrays.equals(a0, a1));
        assertFalse(Arrays.equals(a0, IntStream.range(0, s.length).map(i -> c.foldOf(0, i)).toArray()));
    }

    @Test
    void givenSites_whenLeaveSiteOut_thenOneFoldPerSiteHoldingExactlyThatSite() {
        String[] sites = {"b", "a", "c", "a", "b", "c", "c"};
        FoldPlan plan = FoldPlan.leaveSiteOut(sites);
        assertEquals(3, plan.folds(0));
        assertArrayEquals(new int[] {1, 3}, plan.test(0, 0));
        assertArrayEquals(new int[] {2, 5, 6}, plan.test(0, 2));
    }

    @Test
    void givenN_whenLeaveOneOut_thenNFoldsOfOne() {
        FoldPlan plan = FoldPlan.leaveOneOut(4);
        assertEquals(4, plan.folds(0));
        assertArrayEquals(new int[] {2}, plan.test(0, 2));
        assertArrayEquals(new int[] {0, 1, 3}, plan.train(0, 2));
    }
}
