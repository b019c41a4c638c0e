package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;
import java.util.List;

/**
 * Observed versus fitted mean and standard deviation of the response per level of a factor
 * column: a quick check that the model reproduces each group's level and spread.
 *
 * <p>Per level, over its fitted rows with positive prior weight (each row counted once):
 * observed mean and standard deviation (divisor n) of y; fitted mean = mean of mu_i; fitted
 * variance = mean of phi V(mu_i) / w_i plus the variance (divisor n) of the mu_i, the variance of
 * a response from a randomly chosen row of the level.
 *
 * @since 0.1
 */
public final class GroupSummary {
    private final String column;
    private final List<LevelSummary> levels;

    GroupSummary(String column, List<LevelSummary> levels) {
        this.column = column;
        this.levels = List.copyOf(levels);
    }

    /**
     * Returns the factor column.
     *
     * @return the column name
     * @since 0.1
     */
    public String column() {
        return column;
    }

    /**
     * Returns one summary per level, in the column's level order.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<LevelSummary> levels() {
        return levels;
    }

    /**
     * Renders the summary.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        TextTable t = TextTable.withTitles(column, "rows", "observed mean", "fitted mean", "observed sd", "fitted sd");
        for (LevelSummary s : levels) {
            t.row(s.level(), Integer.toString(s.rows()), TextTable.number(s.observedMean()),
                    TextTable.number(s.fittedMean()), TextTable.number(s.observedStandardDeviation()),
                    TextTable.number(s.fittedStandardDeviation()));
        }
        return t.render();
    }
}
