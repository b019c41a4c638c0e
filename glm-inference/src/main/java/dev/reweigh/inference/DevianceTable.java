package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;
import java.util.List;

/**
 * A sequential analysis of deviance: the terms are added one at a time in the order of the model
 * specification, each line testing the term given the terms above it. The dispersion and (for F
 * tests) the denominator degrees of freedom come from the full model.
 *
 * <pre>{@code
 * DevianceTable table = Inference.of(fit).devianceTable();
 * System.out.println(table);
 * }</pre>
 *
 * @since 0.1
 */
public final class DevianceTable {
    private final List<DevianceStep> steps;
    private final ReferenceDistribution reference;
    private final DispersionEstimate dispersion;

    DevianceTable(List<DevianceStep> steps, ReferenceDistribution reference, DispersionEstimate dispersion) {
        this.steps = List.copyOf(steps);
        this.reference = reference;
        this.dispersion = dispersion;
    }

    /**
     * Returns the lines, the null model first.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<DevianceStep> steps() {
        return steps;
    }

    /**
     * Returns the reference distribution of the tests.
     *
     * @return CHI_SQUARED when the dispersion is fixed or known, F when estimated
     * @since 0.1
     */
    public ReferenceDistribution reference() {
        return reference;
    }

    /**
     * Returns the dispersion used.
     *
     * @return the dispersion
     * @since 0.1
     */
    public DispersionEstimate dispersion() {
        return dispersion;
    }

    /**
     * Renders the table.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        TextTable t = TextTable.withTitles("term added", "df", "deviance reduction", "residual df",
                "deviance after", reference == ReferenceDistribution.F ? "F" : "chi-square", "p-value");
        for (DevianceStep s : steps) {
            t.row(s.term(), s.hasTest() || s.df() > 0 ? Integer.toString(s.df()) : "",
                    s.df() > 0 ? TextTable.number(s.devianceReduction()) : "",
                    Integer.toString(s.residualDf()), TextTable.number(s.residualDeviance()),
                    s.hasTest() ? TextTable.number(s.statistic()) : "",
                    s.hasTest() ? TextTable.probability(s.pValue()) : "");
        }
        return "terms added in order; " + dispersion + "\n" + t.render();
    }
}
