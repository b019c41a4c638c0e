package dev.reweigh.examples;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Term;
import dev.reweigh.inference.CoefficientRow;
import dev.reweigh.inference.Interval;
import dev.reweigh.inference.ReferenceDistribution;

import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

import static dev.reweigh.examples.TextFormat.left;
import static dev.reweigh.examples.TextFormat.num;
import static dev.reweigh.examples.TextFormat.p;
import static dev.reweigh.examples.TextFormat.right;

/**
 * The readable report of the {@code fit} command: what was fitted, one line per model-matrix
 * column, then deviance, dispersion, likelihood and warnings, each on a labelled line.
 *
 * @since 0.1
 */
public final class FitReport {
    private FitReport() {
    }

    /**
     * Renders the report.
     *
     * @param summary the fit summary
     * @param source where the data came from (shown in the header)
     * @return the text, ending with a line break
     * @since 0.1
     */
    public static String render(FitSummary summary, String source) {
        FittedModel fit = summary.fit();
        ModelSpec spec = fit.spec();
        StringBuilder sb = new StringBuilder();
        sb.append("response    ").append(spec.response());
        spec.trials().ifPresent(t -> sb.append(" out of ").append(t));
        sb.append(String.format(Locale.ROOT, " (%s; %d of %d rows used)%n", source, fit.rowCount(),
                fit.data().rowCount()));
        sb.append("model       ").append(fit.family().name()).append(" family, ").append(fit.link().name())
                .append(" link").append(spec.hasIntercept() ? "" : ", no intercept");
        spec.offset().ifPresent(o -> sb.append(", offset ").append(o));
        spec.logOffset().ifPresent(o -> sb.append(", log-offset ").append(o));
        spec.weights().ifPresent(w -> sb.append(", weights ").append(w));
        sb.append('\n');
        String terms = spec.terms().stream().map(Term::label).collect(Collectors.joining(", "));
        sb.append("terms       ").append(terms.isEmpty() ? "(none)" : terms).append('\n');
        sb.append(String.format(Locale.ROOT, "fitting     %s after %d iterations%n",
                fit.converged() ? "converged" : "DID NOT CONVERGE", fit.iterations()));
        sb.append('\n');
        sb.append(coefficientLines(summary));
        sb.append('\n');
        sb.append(String.format(Locale.ROOT, "deviance    %s on %d residual df (intercept-only model: %s on %d df)%n",
                num(fit.deviance()), fit.residualDf(), num(fit.nullDeviance()), fit.nullDf()));
        sb.append(String.format(Locale.ROOT, "pearson     chi-square %s on %d residual df%n",
                num(summary.pearsonChiSquare()), fit.residualDf()));
        String used = fit.family().isDispersionFixed() ? "1 (fixed by the family)"
                : num(summary.dispersionUsed()) + " (Pearson estimate)";
        sb.append("dispersion  used for standard errors: ").append(used).append("; estimates: Pearson ")
                .append(num(summary.pearsonDispersion())).append(", deviance ").append(num(summary.devianceDispersion()));
        if (!Double.isNaN(summary.mlDispersion())) {
            sb.append(", maximum likelihood ").append(num(summary.mlDispersion()));
        }
        sb.append('\n');
        if (!Double.isNaN(summary.logLikelihood())) {
            sb.append(String.format(Locale.ROOT, "likelihood  log-likelihood %s, AIC %s, BIC %s (%d parameters)%n",
                    num(summary.logLikelihood()), num(summary.aic()), num(summary.bic()), summary.parameters()));
        }
        if (!fit.aliasedColumns().isEmpty()) {
            sb.append("aliased     ").append(String.join(", ", fit.aliasedColumns()))
                    .append(" (not estimable from these data; left out)\n");
        }
        List<String> warnings = summary.warnings();
        if (warnings.isEmpty()) {
            sb.append("warnings    none\n");
        } else {
            for (String w : warnings) {
                sb.append("warning     ").append(w).append('\n');
            }
        }
        return sb.toString();
    }

    private static String coefficientLines(FitSummary summary) {
        List<CoefficientRow> rows = summary.coefficients().rows();
        boolean log = summary.fit().link().name().equalsIgnoreCase("log");
        int w = "coefficient".length();
        for (CoefficientRow r : rows) {
            w = Math.max(w, r.name().length());
        }
        String stat = summary.coefficients().reference() == ReferenceDistribution.T ? "wald t" : "wald z";
        String level = String.format(Locale.ROOT, "%.0f%%", 100 * summary.coefficients().level());
        StringBuilder sb = new StringBuilder();
        sb.append(left("coefficient", w)).append(right("estimate", 13)).append(right("s.e.", 12))
                .append(right(stat, 10)).append(right("p-value", 10));
        sb.append(log ? "   relativity  " + level + " range" : "   " + level + " range");
        sb.append('\n');
        for (CoefficientRow r : rows) {
            sb.append(left(r.name(), w));
            if (r.isAliased()) {
                sb.append(right("aliased", 13)).append('\n');
                continue;
            }
            sb.append(right(num(r.estimate()), 13)).append(right(num(r.standardError()), 12))
                    .append(right(TextFormat.fixed(r.statistic(), 2), 10)).append(right(p(r.pValue()), 10));
            if (log) {
                Interval ri = r.relativityInterval().orElseThrow();
                sb.append(right(num(r.relativity().orElseThrow()), 13)).append("  ")
                        .append(num(ri.lower())).append(" to ").append(num(ri.upper()));
            } else {
                Interval wi = r.waldInterval().orElseThrow();
                sb.append("   ").append(num(wi.lower())).append(" to ").append(num(wi.upper()));
            }
            sb.append('\n');
        }
        return sb.toString();
    }
}
