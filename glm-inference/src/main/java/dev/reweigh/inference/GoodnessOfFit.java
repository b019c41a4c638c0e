package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;
import java.util.OptionalDouble;

/**
 * The deviance and the Pearson chi-square statistic against the residual degrees of freedom.
 * The chi-square references are offered only where they mean something: a family with a fixed
 * dispersion (or a known one), no binary response, and at least one residual degree of freedom.
 * {@link #note()} says why when they are not, and warns when small fitted means make the
 * approximation doubtful.
 *
 * @since 0.1
 */
public final class GoodnessOfFit {
    private final double deviance;
    private final double pearsonChiSquare;
    private final int residualDf;
    private final double dispersion;
    private final boolean meaningful;
    private final String note;

    GoodnessOfFit(double deviance, double pearsonChiSquare, int residualDf, double dispersion, boolean meaningful,
                  String note) {
        this.deviance = deviance;
        this.pearsonChiSquare = pearsonChiSquare;
        this.residualDf = residualDf;
        this.dispersion = dispersion;
        this.meaningful = meaningful;
        this.note = note;
    }

    /**
     * Returns the deviance.
     *
     * @return D
     * @since 0.1
     */
    public double deviance() {
        return deviance;
    }

    /**
     * Returns the Pearson chi-square statistic.
     *
     * @return X^2
     * @since 0.1
     */
    public double pearsonChiSquare() {
        return pearsonChiSquare;
    }

    /**
     * Returns the residual degrees of freedom.
     *
     * @return n - p
     * @since 0.1
     */
    public int residualDf() {
        return residualDf;
    }

    /**
     * Tells whether the chi-square references are meaningful for this model.
     *
     * @return true when the p-values are given
     * @since 0.1
     */
    public boolean isMeaningful() {
        return meaningful;
    }

    /**
     * Returns P(chi-square(df) &gt;= D / phi).
     *
     * @return the p-value, empty when not meaningful
     * @since 0.1
     */
    public OptionalDouble devianceP() {
        return meaningful ? OptionalDouble.of(dev.reweigh.inference.internal.Distributions.chiSquareUpper(
                deviance / dispersion, residualDf)) : OptionalDouble.empty();
    }

    /**
     * Returns P(chi-square(df) &gt;= X^2 / phi).
     *
     * @return the p-value, empty when not meaningful
     * @since 0.1
     */
    public OptionalDouble pearsonP() {
        return meaningful ? OptionalDouble.of(dev.reweigh.inference.internal.Distributions.chiSquareUpper(
                pearsonChiSquare / dispersion, residualDf)) : OptionalDouble.empty();
    }

    /**
     * Returns a remark on how far to trust the references, or why they are not given.
     *
     * @return the note, empty text when there is nothing to say
     * @since 0.1
     */
    public String note() {
        return note;
    }

    /**
     * Renders the statistics.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        TextTable t = TextTable.withTitles("statistic", "value", "residual df", "ratio", "p-value");
        t.row("deviance", TextTable.number(deviance), Integer.toString(residualDf),
                TextTable.number(deviance / residualDf),
                devianceP().isPresent() ? TextTable.probability(devianceP().getAsDouble()) : "-");
        t.row("Pearson chi-square", TextTable.number(pearsonChiSquare), Integer.toString(residualDf),
                TextTable.number(pearsonChiSquare / residualDf),
                pearsonP().isPresent() ? TextTable.probability(pearsonP().getAsDouble()) : "-");
        return t.render() + (note.isEmpty() ? "" : note + "\n");
    }
}
