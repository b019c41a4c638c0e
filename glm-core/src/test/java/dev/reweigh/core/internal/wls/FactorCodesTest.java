package dev.reweigh.core.internal.wls;

import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** Factor blocks as level codes give the same X'WX and X'Wz as the dense dummy expansion. */
class FactorCodesTest {

    @Property(tries = 150)
    void levelCodesEqualDenseDummyExpansion(@ForAll long seed, @ForAll @IntRange(min = 1, max = 1500) int n,
            @ForAll @IntRange(min = 0, max = 6) int d, @ForAll @IntRange(min = 1, max = 4) int factors,
            @ForAll boolean multipliers) {
        int[] levels = new int[factors];
        for (int f = 0; f < factors; f++) {
            levels[f] = 1 + (int) Math.floorMod(seed >>> (5 * f), 12L);
        }
        RandomDesign coded = RandomDesign.generate(seed, n, d, levels, multipliers);
        RandomDesign expanded = coded.denseExpansion();
        int p = coded.layout.columns();
        double[][] results = new double[2][];
        double[][] vectors = new double[2][];
        RandomDesign[] both = {coded, expanded};
        for (int k = 0; k < 2; k++) {
            GramPartial total = new GramPartial(both[k].layout);
            BlockedGramAccumulator.of(both[k].layout, 2, null).accumulate(both[k].rows(), both[k].w, both[k].z, total);
            results[k] = new double[p * p];
            vectors[k] = new double[p];
            total.writeTo(results[k], vectors[k], true);
        }
        RandomDesign.Naive ref = coded.naive();
        for (int i = 0; i < p * p; i++) {
            assertEquals(results[1][i], results[0][i], 1e-12 * ref.gramAbs[i] + 1e-300, "X'WX entry " + i);
        }
        for (int i = 0; i < p; i++) {
            assertEquals(vectors[1][i], vectors[0][i], 1e-12 * ref.xtwzAbs[i] + 1e-300, "X'Wz entry " + i);
        }
    }
}
