package dev.reweigh.core;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One term of a model: a numeric column, a factor (categorical column, reference-coded), a
 * polynomial in a numeric column, or the interaction of two terms.
 *
 * <p>Model-matrix column names: {@code age} for a numeric column; {@code region=North} for a
 * factor level; {@code age^2} for a raw power and {@code age[2]} for an orthogonal polynomial of
 * degree 2; parts of an interaction joined with {@code " & "}, e.g. {@code region=North & age}.
 *
 * <pre>{@code
 * Term t = Term.interaction(Term.factor("region", "South"), Term.numeric("age"));
 * t.label();   // "region & age"
 * }</pre>
 *
 * @since 0.1
 */
public final class Term {

    enum Kind { NUMERIC, FACTOR, COLUMN, POLYNOMIAL, INTERACTION }

    private final Kind kind;
    private final String column;
    private final String reference;
    private final int degree;
    private final boolean orthogonal;
    private final Term left;
    private final Term right;

    private Term(Kind kind, String column, String reference, int degree, boolean orthogonal, Term left, Term right) {
        this.kind = kind;
        this.column = column;
        this.reference = reference;
        this.degree = degree;
        this.orthogonal = orthogonal;
        this.left = left;
        this.right = right;
    }

    /**
     * A numeric column entering the model as it is.
     *
     * @param column a numeric column of the table
     * @return the term
     * @since 0.1
     */
    public static Term numeric(String column) {
        return new Term(Kind.NUMERIC, Objects.requireNonNull(column, "column"), null, 1, false, null, null);
    }

    /**
     * A column entering as a numeric term or as a factor (default reference level), according
     * to its kind in the table at fit time.
     *
     * @param column a column of the table
     * @return the term
     * @since 0.1
     */
    public static Term column(String column) {
        return new Term(Kind.COLUMN, Objects.requireNonNull(column, "column"), null, 1, false, null, null);
    }

    /**
     * A categorical column coded against a reference level chosen at fit time: the level with
     * the largest total prior weight, ties going to the first in level order (common practice in
     * rating plans, no source).
     *
     * @param column a categorical column of the table
     * @return the term
     * @since 0.1
     */
    public static Term factor(String column) {
        return new Term(Kind.FACTOR, Objects.requireNonNull(column, "column"), null, 1, false, null, null);
    }

    /**
     * A categorical column coded against the given reference level (which gets no column). In a
     * model without intercept the first factor term has a column for every level instead (see
     * {@link ModelSpec.Builder#intercept(boolean)}).
     *
     * @param column a categorical column of the table
     * @param referenceLevel one of the column's levels
     * @return the term
     * @since 0.1
     */
    public static Term factor(String column, String referenceLevel) {
        return new Term(Kind.FACTOR, Objects.requireNonNull(column, "column"),
                Objects.requireNonNull(referenceLevel, "referenceLevel"), 1, false, null, null);
    }

    /**
     * The interaction (elementwise product of every column of one with every column of the other)
     * of two terms. Numeric by numeric gives one column; factor by numeric one column per
     * non-reference level; factor by factor one column per pair of non-reference levels.
     *
     * @param a the first term
     * @param b the second term
     * @return the term
     * @since 0.1
     */
    public static Term interaction(Term a, Term b) {
        return new Term(Kind.INTERACTION, null, null, 1, false, Objects.requireNonNull(a, "a"), Objects.requireNonNull(b, "b"));
    }

    /**
     * Powers 1 to degree of a numeric column: raw ({@code x^1 .. x^d}, named {@code age^1},
     * {@code age^2}, ...) or orthogonal (polynomials orthogonal over the fitting rows, each of
     * unit length, named {@code age[1]}, {@code age[2]}, ...; the same recurrence is applied to
     * new data).
     *
     * @param column a numeric column
     * @param degree the highest power, at least 1
     * @param orthogonal true for orthogonal polynomials, false for raw powers
     * @return the term
     * @throws ModelSpecException when degree is below 1
     * @since 0.1
     */
    public static Term polynomial(String column, int degree, boolean orthogonal) {
        if (degree < 1) {
            throw new ModelSpecException("polynomial in column '" + column + "': degree " + degree
                    + " is not valid; expected a whole number at least 1");
        }
        return new Term(Kind.POLYNOMIAL, Objects.requireNonNull(column, "column"), null, degree, orthogonal, null, null);
    }

    /**
     * Returns the term's label, used to name the term in outputs and to remove it from a
     * specification: {@code age}, {@code region}, {@code age^1..3}, {@code age[1..3]},
     * {@code region & age}.
     *
     * @return the label
     * @since 0.1
     */
    public String label() {
        switch (kind) {
            case NUMERIC:
            case FACTOR:
            case COLUMN:
                return column;
            case POLYNOMIAL:
                return orthogonal ? column + "[1.." + degree + "]" : column + "^1.." + degree;
            default:
                return left.label() + " & " + right.label();
        }
    }

    /**
     * Returns the table columns the term reads, without repeats, in order of appearance.
     *
     * @return an immutable list of column names
     * @since 0.1
     */
    public List<String> columns() {
        LinkedHashSet<String> out = new LinkedHashSet<>();
        collectColumns(out);
        return List.copyOf(new ArrayList<>(out));
    }

    private void collectColumns(LinkedHashSet<String> out) {
        if (kind == Kind.INTERACTION) {
            left.collectColumns(out);
            right.collectColumns(out);
        } else {
            out.add(column);
        }
    }

    /**
     * Returns the reference level chosen by the caller, if this is a factor term with one.
     *
     * @return the reference level, or empty
     * @since 0.1
     */
    public Optional<String> referenceLevel() {
        return Optional.ofNullable(reference);
    }

    Kind kind() {
        return kind;
    }

    String column() {
        return column;
    }

    int degree() {
        return degree;
    }

    boolean isOrthogonal() {
        return orthogonal;
    }

    Term left() {
        return left;
    }

    Term right() {
        return right;
    }

    /**
     * Terms are equal when they are of the same kind on the same columns with the same options.
     *
     * @param o another object
     * @return true when equal
     * @since 0.1
     */
    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof Term)) {
            return false;
        }
        Term t = (Term) o;
        return kind == t.kind && degree == t.degree && orthogonal == t.orthogonal
                && Objects.equals(column, t.column) && Objects.equals(reference, t.reference)
                && Objects.equals(left, t.left) && Objects.equals(right, t.right);
    }

    /**
     * Returns a hash code consistent with {@link #equals(Object)}.
     *
     * @return the hash code
     * @since 0.1
     */
    @Override
    public int hashCode() {
        return Objects.hash(kind, column, reference, degree, orthogonal, left, right);
    }

    /**
     * Returns the label, with the reference level of a factor when one was chosen.
     *
     * @return a short description
     * @since 0.1
     */
    @Override
    public String toString() {
        if (kind == Kind.FACTOR && reference != null) {
            return column + " (reference " + reference + ")";
        }
        if (kind == Kind.INTERACTION) {
            return left + " & " + right;
        }
        return label();
    }
}
