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
        Objects.requireNonNull(criterion, "criterion");
        if (fits.size() < 2) {
            throw new IllegalArgumentException("a comparison needs at least two models, got " + fits.size());
        }
        List<Map.Entry<String, FittedModel>> entries = new ArrayList<>(fits.entrySet());
        Map.Entry<String, FittedModel> first = entries.get(0);
        for (Map.Entry<String, FittedModel> e : entries.subList(1, entries.size())) {
            Comparability.sameData("model '" + first.getKey() + "'", first.getValue(), "model '" + e.getKey() + "'",
                    e.getValue());
        }
        List<String> labels = new ArrayList<>();
        List<FittedModel> models = new ArrayList<>();
        List<InformationCriteria> criteria = new ArrayList<>();
        double best = Double.POSITIVE_INFINITY;
        for (Map.Entry<String, FittedModel> e : entries) {
            InformationCriteria ic = Inference.of(e.getValue()).informationCriteria();
            labels.add(e.getKey());
            models.add(e.getValue());
            criteria.add(ic);
            best = Math.min(best, ic.value(criterion));
        }
        double total = 0;
        double[] raw = new double[entries.size()];
        for (int i = 0; i < raw.length; i++) {
            raw[i] = Math.exp(-(criteria.get(i).value(criterion) - best) / 2);
            total += raw[i];
        }
        List<ComparedModel> rows = new ArrayList<>();
        for (int i = 0; i < raw.length; i++) {
            rows.add(new ComparedModel(labels.get(i), models.get(i), criteria.get(i),
                    criteria.get(i).value(criterion) - best, raw[i] / total));
        }
        rows.sort(Comparator.comparingDouble(ComparedModel::difference));
        return new ModelComparison(criterion, rows);
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
