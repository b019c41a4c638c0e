package dev.reweigh.inference;

import dev.reweigh.core.FittedModel;
import dev.reweigh.inference.internal.Comparability;
import dev.reweigh.inference.internal.TextTable;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Several models of the same response on the same rows, possibly of different families and
 * links, ranked by an information criterion computed from exact log-likelihoods.
 *
 * <pre>{@code
 * ModelComparison c = ModelComparison.of(Criterion.AIC, gaussianFit, gammaIdentityFit, gammaLogFit);
 * System.out.println(c);                  // best first
 * FittedModel best = c.best().fit();
 * }</pre>
 *
 * @since 0.1
 */
public final class ModelComparison {
    private final Criterion criterion;
    private final List<ComparedModel> models;

    private ModelComparison(Criterion criterion, List<ComparedModel> models) {
        this.criterion = criterion;
        this.models = List.copyOf(models);
    }

    /**
     * Compares fitted models, labelling each "family, link" (numbered when labels repeat).
     *
     * @param criterion the criterion to rank by
     * @param fits two or more fitted models of the same response on the same rows
     * @return the comparison, best first
     * @throws ModelMismatchException when the models differ in rows, response or prior weights
     * @throws dev.reweigh.families.NoLikelihoodException when a model's family has no density
     * @throws IllegalArgumentException when fewer than two models are given
     * @since 0.1
     */
    public static ModelComparison of(Criterion criterion, FittedModel... fits) {
        return of(criterion, List.of(fits));
    }

    /**
     * Compares fitted models, labelling each "family, link" (numbered when labels repeat).
     *
     * @param criterion the criterion to rank by
     * @param fits two or more fitted models of the same response on the same rows
     * @return the comparison, best first
     * @throws ModelMismatchException when the models differ in rows, response or prior weights
     * @throws dev.reweigh.families.NoLikelihoodException when a model's family has no density
     * @throws IllegalArgumentException when fewer than two models are given
     * @since 0.1
     */
    public static ModelComparison of(Criterion criterion, List<FittedModel> fits) {
        Map<String, FittedModel> labelled = new LinkedHashMap<>();
        for (FittedModel fit : fits) {
            String base = fit.family().name() + ", " + fit.link().name();
            String label = base;
            for (int k = 2; labelled.containsKey(label); k++) {
                label = base + " #" + k;
            }
            labelled.put(label, fit);
        }
        return ofLabelled(criterion, labelled);
    }

    /**
     * Compares fitted models under the caller's labels.
     *
     * @param criterion the criterion to rank by
     * @param fits label to model, two or more, in any order
     * @return the comparison, best first
     * @throws ModelMismatchException when the models differ in rows, response or prior weights
     * @throws dev.reweigh.families.NoLikelihoodException when a model's family has no density
     * @throws IllegalArgumentException when fewer than two models are given
     * @since 0.1
     */
    public static ModelComparison ofLabelled(Criterion criterion, Map<String, FittedModel> fits) {
        Builder builder = builder(criterion);
        fits.forEach(builder::add);
        return builder.build();
    }

    /**
     * Starts a comparison to which models are added one by one, including models whose family
     * parameter was estimated (negative binomial theta, Tweedie power), which then count that
     * parameter.
     *
     * <pre>{@code
     * ModelComparison c = ModelComparison.builder(Criterion.AIC)
     *         .add("poisson", poissonFit)
     *         .add("negative binomial", NegativeBinomialTheta.estimate(poissonFit))
     *         .build();
     * }</pre>
     *
     * @param criterion the criterion to rank by
     * @return a new builder
     * @since 0.1
     */
    public static Builder builder(Criterion criterion) {
        return new Builder(criterion);
    }

    /**
     * Collects labelled models for a {@link ModelComparison}. A builder is not thread-safe; the
     * comparison it builds is.
     *
     * @since 0.1
     */
    public static final class Builder {
        private final Criterion criterion;
        private final List<String> labels = new ArrayList<>();
        private final List<FittedModel> fits = new ArrayList<>();
        private final List<InformationCriteria> criteria = new ArrayList<>();

        private Builder(Criterion criterion) {
            this.criterion = Objects.requireNonNull(criterion, "criterion");
        }

        /**
         * Adds a fitted model; its family's parameters count as given.
         *
         * @param label a label not used before
         * @param fit the model
         * @return this builder
         * @throws IllegalArgumentException when the label is already used
         * @throws dev.reweigh.families.NoLikelihoodException when the family has no density
         * @since 0.1
         */
        public Builder add(String label, FittedModel fit) {
            return add(label, fit, Inference.of(fit).informationCriteria());
        }

        /**
         * Adds a negative binomial model whose theta was estimated (theta counts as a parameter).
         *
         * @param label a label not used before
         * @param theta the estimate, with its fit
         * @return this builder
         * @throws IllegalArgumentException when the label is already used
         * @throws ModelMismatchException when the model differs from the first one added in rows,
         *     response or prior weights
         * @since 0.1
         */
        public Builder add(String label, NegativeBinomialTheta theta) {
            return add(label, theta.fit(), theta.informationCriteria());
        }

        /**
         * Adds a Tweedie model whose power was chosen by profile likelihood (the power counts as a
         * parameter).
         *
         * @param label a label not used before
         * @param profile the profile, with its fit
         * @return this builder
         * @throws IllegalArgumentException when the label is already used
         * @throws ModelMismatchException when the model differs from the first one added in rows,
         *     response or prior weights
         * @since 0.1
         */
        public Builder add(String label, TweediePowerProfile profile) {
            return add(label, profile.fit(), profile.informationCriteria());
        }

        private Builder add(String label, FittedModel fit, InformationCriteria ic) {
            Objects.requireNonNull(label, "label");
            if (labels.contains(label)) {
                throw new IllegalArgumentException("label '" + label + "' is already used; labels must be unique");
            }
            if (!fits.isEmpty()) {
                Comparability.sameData("model '" + labels.get(0) + "'", fits.get(0), "model '" + label + "'", fit);
            }
            labels.add(label);
            fits.add(fit);
            criteria.add(ic);
            return this;
        }

        /**
         * Ranks the models added.
         *
         * @return the comparison, best first
         * @throws IllegalArgumentException when fewer than two models were added
         * @since 0.1
         */
        public ModelComparison build() {
            if (fits.size() < 2) {
                throw new IllegalArgumentException("a comparison needs at least two models, got " + fits.size());
            }
            double best = Double.POSITIVE_INFINITY;
            for (InformationCriteria ic : criteria) {
                best = Math.min(best, ic.value(criterion));
            }
            double total = 0;
            double[] raw = new double[fits.size()];
            for (int i = 0; i < raw.length; i++) {
                raw[i] = Math.exp(-(criteria.get(i).value(criterion) - best) / 2);
                total += raw[i];
            }
            List<ComparedModel> rows = new ArrayList<>();
            for (int i = 0; i < raw.length; i++) {
                rows.add(new ComparedModel(labels.get(i), fits.get(i), criteria.get(i),
                        criteria.get(i).value(criterion) - best, raw[i] / total));
            }
            rows.sort(Comparator.comparingDouble(ComparedModel::difference));
            return new ModelComparison(criterion, rows);
        }
    }

    /**
     * Returns the criterion the models are ranked by.
     *
     * @return the criterion
     * @since 0.1
     */
    public Criterion criterion() {
        return criterion;
    }

    /**
     * Returns the models, best (smallest criterion) first.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<ComparedModel> models() {
        return models;
    }

    /**
     * Returns the best model.
     *
     * @return the first line
     * @since 0.1
     */
    public ComparedModel best() {
        return models.get(0);
    }

    /**
     * Renders the comparison, best first.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        TextTable t = TextTable.withTitles("model", "log-likelihood", "parameters", "AIC", "AICc", "BIC",
                "difference", "weight");
        for (ComparedModel m : models) {
            InformationCriteria c = m.criteria();
            t.row(m.label(), TextTable.number(c.logLikelihood()), Integer.toString(c.parameters()),
                    TextTable.number(c.aic()), TextTable.number(c.aicc()), TextTable.number(c.bic()),
                    TextTable.number(m.difference()), TextTable.number(m.weight()));
        }
        return "models ranked by " + criterion + " (smaller is better) on " + best().criteria().observations()
                + " rows\n" + t.render();
    }
}
