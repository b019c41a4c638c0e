package dev.reweigh.inference;

import dev.reweigh.families.UnknownNameException;
import dev.reweigh.inference.internal.TextTable;
import java.util.ArrayList;
import java.util.List;

/**
 * Estimates, standard errors, Wald statistics, p-values and intervals of every model-matrix
 * column, with relativities under a log link.
 *
 * <pre>{@code
 * CoefficientTable table = Inference.of(fit).coefficients();
 * double se = table.row("age").standardError();
 * System.out.println(table);
 * }</pre>
 *
 * @since 0.1
 */
public final class CoefficientTable {
    private final List<CoefficientRow> rows;
    private final ReferenceDistribution reference;
    private final int degreesOfFreedom;
    private final double level;
    private final DispersionEstimate dispersion;
    private final boolean logLink;
    private final boolean withProfile;

    CoefficientTable(List<CoefficientRow> rows, ReferenceDistribution reference, int degreesOfFreedom, double level,
                     DispersionEstimate dispersion, boolean logLink, boolean withProfile) {
        this.rows = List.copyOf(rows);
        this.reference = reference;
        this.degreesOfFreedom = degreesOfFreedom;
        this.level = level;
        this.dispersion = dispersion;
        this.logLink = logLink;
        this.withProfile = withProfile;
    }

    /**
     * Returns the rows in model order, aliased columns included.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<CoefficientRow> rows() {
        return rows;
    }

    /**
     * Returns the row of a column.
     *
     * @param columnName the model-matrix column name
     * @return the row
     * @throws UnknownNameException when no column has that name
     * @since 0.1
     */
    public CoefficientRow row(String columnName) {
        for (CoefficientRow r : rows) {
            if (r.name().equals(columnName)) {
                return r;
            }
        }
        List<String> names = new ArrayList<>();
        rows.forEach(r -> names.add(r.name()));
        throw new UnknownNameException("coefficient", columnName, names);
    }

    /**
     * Returns the distribution the Wald statistics are referred to: normal when the dispersion is
     * known or fixed, t with the residual degrees of freedom when it is estimated.
     *
     * @return NORMAL or T
     * @since 0.1
     */
    public ReferenceDistribution reference() {
        return reference;
    }

    /**
     * Returns the degrees of freedom of the t reference.
     *
     * @return the residual degrees of freedom, or 0 for the normal reference
     * @since 0.1
     */
    public int degreesOfFreedom() {
        return degreesOfFreedom;
    }

    /**
     * Returns the confidence level of the intervals.
     *
     * @return the level
     * @since 0.1
     */
    public double level() {
        return level;
    }

    /**
     * Returns the dispersion the standard errors are scaled by.
     *
     * @return the dispersion
     * @since 0.1
     */
    public DispersionEstimate dispersion() {
        return dispersion;
    }

    /**
     * Renders the table with column titles in words.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        String pct = TextTable.percent(level);
        List<String> titles = new ArrayList<>(List.of("term", "estimate", "std error",
                reference == ReferenceDistribution.T ? "t" : "z", "p-value", "lower " + pct, "upper " + pct));
        if (withProfile) {
            titles.add("profile lower");
            titles.add("profile upper");
        }
        if (logLink) {
            titles.add("relativity");
            titles.add("rel. lower");
            titles.add("rel. upper");
        }
        TextTable t = TextTable.withTitles(titles.toArray(new String[0]));
        for (CoefficientRow r : rows) {
            List<String> cells = new ArrayList<>();
            cells.add(r.name());
            if (r.isAliased() || r.isFixed()) {
                cells.add(r.isAliased() ? "aliased" : TextTable.number(r.estimate()));
                cells.add(r.isFixed() ? "held fixed" : "");
                while (cells.size() < titles.size()) {
                    cells.add("");
                }
            } else {
                Interval w = r.waldInterval().orElseThrow();
                cells.add(TextTable.number(r.estimate()));
                cells.add(TextTable.number(r.standardError()));
                cells.add(TextTable.number(r.statistic()));
                cells.add(TextTable.probability(r.pValue()));
                cells.add(TextTable.number(w.lower()));
                cells.add(TextTable.number(w.upper()));
                if (withProfile) {
                    Interval p = r.profileInterval().orElseThrow();
                    cells.add(TextTable.number(p.lower()));
                    cells.add(TextTable.number(p.upper()));
                }
                if (logLink) {
                    Interval rel = r.relativityInterval().orElseThrow();
                    cells.add(TextTable.number(r.relativity().orElseThrow()));
                    cells.add(TextTable.number(rel.lower()));
                    cells.add(TextTable.number(rel.upper()));
                }
            }
            t.row(cells.toArray(new String[0]));
        }
        String ref = reference == ReferenceDistribution.T
                ? "t with " + degreesOfFreedom + " df" : "standard normal";
        return t.render() + "Wald statistics referred to the " + ref + "; " + dispersion + "\n";
    }
}
