package dev.reweigh.inference.internal;

import dev.reweigh.core.FittedModel;
import dev.reweigh.inference.ModelMismatchException;
import java.util.Arrays;

/**
 * Checks that fitted models can be compared: the same rows of the same data, the same response
 * and prior weights, and (for nested tests) the same family and link.
 */
public final class Comparability {
    private Comparability() {
    }

    /**
     * Checks rows, response and prior weights.
     *
     * @param a the first model's name for messages
     * @param first the first model
     * @param b the second model's name
     * @param second the second model
     * @throws ModelMismatchException naming what differs
     */
    public static void sameData(String a, FittedModel first, String b, FittedModel second) {
        String prefix = "cannot compare " + a + " with " + b + ": ";
        if (!first.spec().response().equals(second.spec().response())) {
            throw new ModelMismatchException(prefix + "the response columns differ ('" + first.spec().response()
                    + "' vs '" + second.spec().response() + "'); both must model the same response");
        }
        if (first.rowCount() != second.rowCount() || !Arrays.equals(first.usedRows(), second.usedRows())) {
            throw new ModelMismatchException(prefix + "they were fitted on different rows (" + first.rowCount()
                    + " vs " + second.rowCount() + " rows used" + firstDifference(first.usedRows(), second.usedRows())
                    + "); fit both on the same rows, e.g. drop incomplete rows before fitting either");
        }
        if (first.data().rowCount() != second.data().rowCount()) {
            throw new ModelMismatchException(prefix + "they were fitted on different tables (" + first.data().rowCount()
                    + " vs " + second.data().rowCount() + " rows)");
        }
        // both arrays have one entry per used row, and the used rows are the same (checked above);
        // Arrays.mismatch compares like Double.compare: NaN equals NaN, -0.0 differs from 0.0
        double[] ya = first.response();
        double[] yb = second.response();
        int i = Arrays.mismatch(ya, yb);
        if (i >= 0) {
            throw new ModelMismatchException(prefix + "the response differs at fitted row " + i + " (" + ya[i]
                    + " vs " + yb[i] + "); both must be fitted to the same response values");
        }
        double[] wa = first.priorWeights();
        double[] wb = second.priorWeights();
        i = Arrays.mismatch(wa, wb);
        if (i >= 0) {
            throw new ModelMismatchException(prefix + "the prior weights differ at fitted row " + i + " (" + wa[i]
                    + " vs " + wb[i] + "); both must use the same weights");
        }
    }

    /**
     * Checks everything {@link #sameData} checks plus the family and the link.
     *
     * @param a the first model's name for messages
     * @param first the first model
     * @param b the second model's name
     * @param second the second model
     * @throws ModelMismatchException naming what differs
     */
    public static void nested(String a, FittedModel first, String b, FittedModel second) {
        String prefix = "cannot compare " + a + " with " + b + ": ";
        if (!first.family().name().equals(second.family().name())) {
            throw new ModelMismatchException(prefix + "the families differ ('" + first.family().name() + "' vs '"
                    + second.family().name() + "'); a likelihood-ratio test needs the same family;"
                    + " compare different families by information criteria (ModelComparison)");
        }
        if (!first.link().name().equals(second.link().name())) {
            throw new ModelMismatchException(prefix + "the links differ ('" + first.link().name() + "' vs '"
                    + second.link().name() + "'); nested models need the same link");
        }
        sameData(a, first, b, second);
    }

    private static String firstDifference(int[] a, int[] b) {
        int n = Math.min(a.length, b.length);
        for (int i = 0; i < n; i++) {
            if (a[i] != b[i]) {
                return "; first difference at position " + i + ": data row " + a[i] + " vs " + b[i];
            }
        }
        return "";
    }
}
