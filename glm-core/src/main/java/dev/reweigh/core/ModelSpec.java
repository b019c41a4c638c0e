package dev.reweigh.core;

import dev.reweigh.families.Families;
import dev.reweigh.families.Family;
import dev.reweigh.families.Link;
import dev.reweigh.families.UnknownNameException;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * What to fit: the response (and trials column for binomial counts), the family and link, the
 * terms in order, the offsets, the prior weights and whether to include an intercept.
 * Immutable; column kinds are checked against the data at fit time.
 *
 * <pre>{@code
 * ModelSpec spec = ModelSpec.builder("claims")
 *         .family(Families.poisson())          // log link by default
 *         .factor("region")
 *         .numeric("age")
 *         .logOffset("exposure")
 *         .build();
 * }</pre>
 *
 * @since 0.1
 */
public final class ModelSpec {

    private final String response;
    private final String trials;
    private final Family family;
    private final Link link;
    private final boolean linkChosen;
    private final List<Term> terms;
    private final boolean intercept;
    private final String offset;
    private final String logOffset;
    private final String weights;
    private final boolean dropIncomplete;

    private ModelSpec(Builder b) {
        this.response = b.response;
        this.trials = b.trials;
        this.family = b.family == null ? Families.gaussian() : b.family;
        this.linkChosen = b.link != null;
        this.link = b.link == null ? family.defaultLink() : b.link;
        this.terms = List.copyOf(b.terms);
        this.intercept = b.intercept;
        this.offset = b.offset;
        this.logOffset = b.logOffset;
        this.weights = b.weights;
        this.dropIncomplete = b.dropIncomplete;
    }

    /**
     * Starts a specification for the given response column.
     *
     * @param responseColumn the numeric response column (successes when a trials column is set)
     * @return a builder with defaults: Gaussian family, its default link, intercept, no terms
     * @since 0.1
     */
    public static Builder builder(String responseColumn) {
        return new Builder(Objects.requireNonNull(responseColumn, "responseColumn"));
    }

    /**
     * Returns a builder holding this specification's settings, for variations.
     *
     * @return a new builder
     * @since 0.1
     */
    public Builder toBuilder() {
        Builder b = new Builder(response);
        b.trials = trials;
        b.family = family;
        b.link = linkChosen ? link : null;
        b.terms.addAll(terms);
        b.intercept = intercept;
        b.offset = offset;
        b.logOffset = logOffset;
        b.weights = weights;
        b.dropIncomplete = dropIncomplete;
        return b;
    }

    /**
     * Returns the response column.
     *
     * @return the column name
     * @since 0.1
     */
    public String response() {
        return response;
    }

    /**
     * Returns the trials column of a binomial count response, if any.
     *
     * @return the column name, or empty
     * @since 0.1
     */
    public Optional<String> trials() {
        return Optional.ofNullable(trials);
    }

    /**
     * Returns the family.
     *
     * @return the family
     * @since 0.1
     */
    public Family family() {
        return family;
    }

    /**
     * Returns the link: the caller's choice, else the family's default link.
     *
     * @return the link
     * @since 0.1
     */
    public Link link() {
        return link;
    }

    /**
     * Returns the terms in the order given.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<Term> terms() {
        return terms;
    }

    /**
     * Tells whether the model has an intercept.
     *
     * @return true with an intercept
     * @since 0.1
     */
    public boolean hasIntercept() {
        return intercept;
    }

    /**
     * Returns the offset column (added to the linear predictor as it is), if any.
     *
     * @return the column name, or empty
     * @since 0.1
     */
    public Optional<String> offset() {
        return Optional.ofNullable(offset);
    }

    /**
     * Returns the exposure column whose logarithm is added to the linear predictor, if any.
     *
     * @return the column name, or empty
     * @since 0.1
     */
    public Optional<String> logOffset() {
        return Optional.ofNullable(logOffset);
    }

    /**
     * Returns the prior-weights column, if any.
     *
     * @return the column name, or empty
     * @since 0.1
     */
    public Optional<String> weights() {
        return Optional.ofNullable(weights);
    }

    /**
     * Tells whether rows with a missing value in a column the model uses are dropped (true) or
     * rejected with an error (false, the default).
     *
     * @return true when incomplete rows are dropped
     * @since 0.1
     */
    public boolean dropsIncompleteRows() {
        return dropIncomplete;
    }

    /**
     * Tells whether the caller chose the link explicitly (rather than taking the family's
     * default).
     *
     * @return true when a link was set
     * @since 0.1
     */
    public boolean isLinkChosen() {
        return linkChosen;
    }

    /**
     * Returns a copy with another family; the link stays if the caller chose it explicitly, else
     * it becomes the new family's default link.
     *
     * @param f the new family
     * @return the new specification
     * @since 0.1
     */
    public ModelSpec withFamily(Family f) {
        Builder b = toBuilder();
        b.family = Objects.requireNonNull(f, "family");
        return b.build();
    }

    /**
     * Returns a copy with another link.
     *
     * @param l the new link
     * @return the new specification
     * @since 0.1
     */
    public ModelSpec withLink(Link l) {
        return toBuilder().link(l).build();
    }

    /**
     * Returns a copy without the term of that label.
     *
     * @param termLabel a label as {@link Term#label()} gives it
     * @return the new specification
     * @throws UnknownNameException when no term has that label (the message lists the labels)
     * @since 0.1
     */
    public ModelSpec withoutTerm(String termLabel) {
        Builder b = toBuilder();
        boolean removed = b.terms.removeIf(t -> t.label().equals(termLabel));
        if (!removed) {
            throw new UnknownNameException("term", termLabel,
                    terms.stream().map(Term::label).collect(Collectors.toList()));
        }
        return b.build();
    }

    /**
     * Returns a copy with these terms instead of the current ones.
     *
     * @param newTerms the terms, in order
     * @return the new specification
     * @since 0.1
     */
    public ModelSpec withTerms(List<Term> newTerms) {
        Builder b = toBuilder();
        b.terms.clear();
        b.terms.addAll(newTerms);
        return b.build();
    }

    /**
     * Returns a copy with another offset column (or none when null).
     *
     * @param column the new offset column, or null for none
     * @return the new specification
     * @since 0.1
     */
    public ModelSpec withOffset(String column) {
        Builder b = toBuilder();
        b.offset = column;
        return b.build();
    }

    /**
     * Returns the columns the model reads, without repeats, response first.
     *
     * @return an immutable list of column names
     * @since 0.1
     */
    public List<String> usedColumns() {
        List<String> out = new ArrayList<>();
        out.add(response);
        addIfNew(out, trials);
        for (Term t : terms) {
            for (String c : t.columns()) {
                addIfNew(out, c);
            }
        }
        addIfNew(out, offset);
        addIfNew(out, logOffset);
        addIfNew(out, weights);
        return List.copyOf(out);
    }

    private static void addIfNew(List<String> out, String c) {
        if (c != null && !out.contains(c)) {
            out.add(c);
        }
    }

    /**
     * Describes the specification in one line.
     *
     * @return e.g. "claims: poisson family, log link, terms [region, age], log-offset exposure"
     * @since 0.1
     */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder(response);
        if (trials != null) {
            sb.append(" of ").append(trials).append(" trials");
        }
        sb.append(": ").append(family.name()).append(" family, ").append(link.name()).append(" link, ");
        sb.append(intercept ? "intercept and " : "no intercept, ");
        sb.append("terms ").append(terms.stream().map(Term::toString).collect(Collectors.toList()));
        if (offset != null) {
            sb.append(", offset ").append(offset);
        }
        if (logOffset != null) {
            sb.append(", log-offset ").append(logOffset);
        }
        if (weights != null) {
            sb.append(", weights ").append(weights);
        }
        if (dropIncomplete) {
            sb.append(", incomplete rows dropped");
        }
        return sb.toString();
    }

    /**
     * Equal when every setting is equal.
     *
     * @param o another object
     * @return true when equal
     * @since 0.1
     */
    @Override
    public boolean equals(Object o) {
        if (!(o instanceof ModelSpec)) {
            return false;
        }
        ModelSpec s = (ModelSpec) o;
        return response.equals(s.response) && Objects.equals(trials, s.trials) && family.equals(s.family)
                && link.equals(s.link) && linkChosen == s.linkChosen && terms.equals(s.terms)
                && intercept == s.intercept && Objects.equals(offset, s.offset)
                && Objects.equals(logOffset, s.logOffset) && Objects.equals(weights, s.weights)
                && dropIncomplete == s.dropIncomplete;
    }

    /**
     * Returns a hash code consistent with {@link #equals(Object)}.
     *
     * @return the hash code
     * @since 0.1
     */
    @Override
    public int hashCode() {
        return Objects.hash(response, trials, family, link, terms, intercept, offset, logOffset, weights, dropIncomplete);
    }

    /**
     * Collects the settings of a {@link ModelSpec}. Reusable: {@link #build()} copies.
     *
     * @since 0.1
     */
    public static final class Builder {
        private final String response;
        private String trials;
        private Family family;
        private Link link;
        private final List<Term> terms = new ArrayList<>();
        private boolean intercept = true;
        private String offset;
        private String logOffset;
        private String weights;
        private boolean dropIncomplete;

        private Builder(String response) {
            this.response = response;
        }

        /**
         * Sets the trials column: the response is then the number of successes out of that
         * many trials (binomial family only).
         *
         * @param column a numeric column of whole numbers
         * @return this builder
         * @since 0.1
         */
        public Builder trials(String column) {
            this.trials = Objects.requireNonNull(column, "column");
            return this;
        }

        /**
         * Sets the family (default Gaussian).
         *
         * @param f the family
         * @return this builder
         * @since 0.1
         */
        public Builder family(Family f) {
            this.family = Objects.requireNonNull(f, "family");
            return this;
        }

        /**
         * Sets the link (default: the family's default link).
         *
         * @param l the link
         * @return this builder
         * @since 0.1
         */
        public Builder link(Link l) {
            this.link = Objects.requireNonNull(l, "link");
            return this;
        }

        /**
         * Adds a numeric column as a term.
         *
         * @param column a numeric column
         * @return this builder
         * @since 0.1
         */
        public Builder numeric(String column) {
            return term(Term.numeric(column));
        }

        /**
         * Adds a categorical column as a factor whose reference level is the level with the
         * largest total prior weight (ties: first in level order).
         *
         * @param column a categorical column
         * @return this builder
         * @since 0.1
         */
        public Builder factor(String column) {
            return term(Term.factor(column));
        }

        /**
         * Adds a categorical column as a factor with the given reference level.
         *
         * @param column a categorical column
         * @param referenceLevel the level that gets no column
         * @return this builder
         * @since 0.1
         */
        public Builder factor(String column, String referenceLevel) {
            return term(Term.factor(column, referenceLevel));
        }

        /**
         * Adds the interaction of two columns; each side is a numeric term or a factor
         * (default reference level) according to the table's column kind at fit time.
         *
         * @param columnA the first column
         * @param columnB the second column
         * @return this builder
         * @since 0.1
         */
        public Builder interaction(String columnA, String columnB) {
            return term(Term.interaction(Term.column(columnA), Term.column(columnB)));
        }

        /**
         * Adds a polynomial in a numeric column.
         *
         * @param column a numeric column
         * @param degree the highest power, at least 1
         * @param orthogonal true for orthogonal polynomials, false for raw powers
         * @return this builder
         * @since 0.1
         */
        public Builder polynomial(String column, int degree, boolean orthogonal) {
            return term(Term.polynomial(column, degree, orthogonal));
        }

        /**
         * Adds a term.
         *
         * @param t the term
         * @return this builder
         * @since 0.1
         */
        public Builder term(Term t) {
            terms.add(Objects.requireNonNull(t, "term"));
            return this;
        }

        /**
         * Sets an offset column, added to the linear predictor as it is.
         *
         * @param column a numeric column
         * @return this builder
         * @since 0.1
         */
        public Builder offset(String column) {
            this.offset = Objects.requireNonNull(column, "column");
            return this;
        }

        /**
         * Sets an exposure column whose natural logarithm is added to the linear predictor.
         *
         * @param column a numeric column of positive values
         * @return this builder
         * @since 0.1
         */
        public Builder logOffset(String column) {
            this.logOffset = Objects.requireNonNull(column, "column");
            return this;
        }

        /**
         * Sets the prior-weights column.
         *
         * @param column a numeric column of non-negative values
         * @return this builder
         * @since 0.1
         */
        public Builder weights(String column) {
            this.weights = Objects.requireNonNull(column, "column");
            return this;
        }

        /**
         * Includes (default) or leaves out the intercept. Without an intercept the first factor
         * term (a main effect, in term order) has a column for every level and no reference level,
         * so that every level keeps its own effect; a reference level named for it is not used.
         * Later factors, and factors inside interactions, keep their reference level.
         *
         * @param on true for an intercept
         * @return this builder
         * @since 0.1
         */
        public Builder intercept(boolean on) {
            this.intercept = on;
            return this;
        }

        /**
         * Drops rows with a missing value in any used column instead of rejecting them.
         *
         * @param on true to drop incomplete rows
         * @return this builder
         * @since 0.1
         */
        public Builder dropIncompleteRows(boolean on) {
            this.dropIncomplete = on;
            return this;
        }

        /**
         * Builds the specification.
         *
         * @return an immutable specification
         * @throws ModelSpecException when a trials column is set for a family other than the
         *     binomial
         * @since 0.1
         */
        public ModelSpec build() {
            ModelSpec s = new ModelSpec(this);
            if (s.trials != null && !isBinomialLike(s.family)) {
                throw new ModelSpecException("a trials column ('" + s.trials + "') needs the binomial family, not "
                        + s.family.name());
            }
            return s;
        }

        private static boolean isBinomialLike(Family f) {
            String n = f.name().toLowerCase(java.util.Locale.ROOT);
            return n.contains("binomial") && !n.contains("negative");
        }
    }
}
