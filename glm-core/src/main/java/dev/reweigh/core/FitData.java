package dev.reweigh.core;

import dev.reweigh.core.internal.NumberText;
import dev.reweigh.families.Family;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.UnknownNameException;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * The rows, response, prior weights and offset of a fit, read from the table and checked, with
 * messages naming column, row and value.
 */
final class FitData {
    final int[] rows;
    final int dropped;
    final double[] y;
    final double[] priorWeights;
    final double[] offset;
    final int positiveWeightRows;

    private FitData(int[] rows, int dropped, double[] y, double[] priorWeights, double[] offset, int positive) {
        this.rows = rows;
        this.dropped = dropped;
        this.y = y;
        this.priorWeights = priorWeights;
        this.offset = offset;
        this.positiveWeightRows = positive;
    }

    static FitData prepare(ModelSpec spec, Table t) {
        List<String> used = spec.usedColumns();
        for (String c : used) {
            if (!t.hasColumn(c)) {
                throw new UnknownNameException("column", c, t.columnNames());
            }
        }
        numericRole(t, spec.response(), "the response");
        spec.trials().ifPresent(c -> numericRole(t, c, "the trials column"));
        spec.offset().ifPresent(c -> numericRole(t, c, "an offset"));
        spec.logOffset().ifPresent(c -> numericRole(t, c, "a log-offset (exposure)"));
        spec.weights().ifPresent(c -> numericRole(t, c, "the prior weights"));
        if (t.rowCount() == 0) {
            throw new ModelSpecException("the table has no rows to fit");
        }
        // per row, the first used column (in model order) with a missing value, or -1; scanned column
        // by column, so each column is looked up once and read as one sequential stream
        int u = used.size();
        int rowCount = t.rowCount();
        int[] rows = new int[rowCount];
        Arrays.fill(rows, -1);
        for (int j = 0; j < u; j++) {
            String c = used.get(j);
            if (t.isNumeric(c)) {
                double[] col = t.numericView(c);
                for (int r = 0; r < rowCount; r++) {
                    if (Double.isNaN(col[r]) && rows[r] < 0) {
                        rows[r] = j;
                    }
                }
            } else {
                int[] codes = t.categorical(c).codes;
                for (int r = 0; r < rowCount; r++) {
                    if (codes[r] < 0 && rows[r] < 0) {
                        rows[r] = j;
                    }
                }
            }
        }
        // compact in place to the complete rows (the write position never passes the read position)
        int n = 0;
        for (int r = 0; r < rowCount; r++) {
            int missing = rows[r];
            if (missing < 0) {
                rows[n++] = r;
            } else if (!spec.dropsIncompleteRows()) {
                String c = used.get(missing);
                throw new InvalidDataException(c, r, t.isNumeric(c) ? "NaN" : "null (missing)",
                        "a value: missing values are not allowed unless the specification drops incomplete rows");
            }
        }
        if (n == 0) {
            throw new ModelSpecException("no complete rows are left to fit: every one of the " + t.rowCount()
                    + " rows has a missing value in one of the columns " + used);
        }
        if (n < rowCount) {
            rows = Arrays.copyOf(rows, n);
        }
        double[] w = new double[n];
        double[] off = new double[n];
        double[] resp = t.numericView(spec.response());
        // with every row kept and no trials the response is the table's own (immutable) column, read in
        // place instead of copied: one n-sized array less for the whole fit
        boolean responseInPlace = n == rowCount && !spec.trials().isPresent();
        double[] y = responseInPlace ? resp : new double[n];
        double[] wcol = spec.weights().map(t::numericView).orElse(null);
        double[] ocol = spec.offset().map(t::numericView).orElse(null);
        double[] ecol = spec.logOffset().map(t::numericView).orElse(null);
        double[] tcol = spec.trials().map(t::numericView).orElse(null);
        Family family = spec.family();
        int positive = 0;
        for (int i = 0; i < n; i++) {
            int r = rows[i];
            double wi = 1.0;
            if (wcol != null) {
                wi = wcol[r];
                if (!(wi >= 0) || Double.isInfinite(wi)) {
                    throw new InvalidDataException(spec.weights().get(), r, NumberText.of(wi),
                            "a non-negative finite weight");
                }
            }
            if (ocol != null) {
                off[i] = DesignRecipe.finite(spec.offset().get(), r, ocol[r]);
            }
            if (ecol != null) {
                double e = ecol[r];
                if (!(e > 0) || Double.isInfinite(e)) {
                    throw new InvalidDataException(spec.logOffset().get(), r, NumberText.of(e),
                            "a positive finite exposure (its logarithm enters the linear predictor)");
                }
                off[i] += Math.log(e);
            }
            double yi = resp[r];
            if (!Double.isFinite(yi)) {
                throw new InvalidDataException(spec.response(), r, NumberText.of(yi), family.responseDomain());
            }
            if (tcol != null) {
                double ti = tcol[r];
                String tc = spec.trials().get();
                if (!(ti >= 0) || Double.isInfinite(ti) || ti != Math.rint(ti)) {
                    throw new InvalidDataException(tc, r, NumberText.of(ti), "a non-negative whole number of trials");
                }
                if (!(yi >= 0) || yi != Math.rint(yi)) {
                    throw new InvalidDataException(spec.response(), r, NumberText.of(yi),
                            "a non-negative whole number of successes");
                }
                if (yi > ti) {
                    throw new InvalidDataException(spec.response(), r, NumberText.of(yi),
                            String.format(Locale.ROOT, "at most the %s trials in column '%s'", NumberText.of(ti), tc));
                }
                y[i] = ti == 0 ? 0.0 : yi / ti;
                wi *= ti;
            } else if (!responseInPlace) {
                y[i] = yi;
            }
            w[i] = wi;
            if (wi > 0) {
                positive++;
                if (!family.isValidResponse(y[i], wi)) {
                    throw new InvalidDataException(spec.response(), r, NumberText.of(yi),
                            family.responseDomain() + " for the " + family.name() + " family");
                }
            }
        }
        if (positive == 0) {
            String col = spec.weights().orElse(spec.trials().orElse(spec.response()));
            throw new InvalidDataException(col, -1, "all zero",
                    "at least one row with a positive prior weight");
        }
        return new FitData(rows, t.rowCount() - n, y, w, off, positive);
    }

    private static void numericRole(Table t, String column, String role) {
        if (t.isCategorical(column)) {
            throw new ModelSpecException("column '" + column + "' is categorical and cannot be " + role
                    + "; a numeric column is needed");
        }
    }
}
