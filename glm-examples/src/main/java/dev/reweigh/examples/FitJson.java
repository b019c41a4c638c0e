package dev.reweigh.examples;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import dev.reweigh.core.FittedModel;
import dev.reweigh.inference.CoefficientRow;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;

/**
 * Writes a {@link FitSummary} as one JSON object. The field names are an interface for scripts
 * and stay as they are: {@code converged}, {@code iterations}, {@code coefficients} (objects with
 * {@code term}, {@code estimate}, {@code std_error}, {@code statistic}, {@code p_value}),
 * {@code deviance}, {@code null_deviance}, {@code df_residual}, {@code pearson_chi2},
 * {@code dispersion} ({@code pearson}, {@code deviance}, {@code ml}, {@code used}),
 * {@code log_likelihood}, {@code aic}, {@code bic}, {@code aliased} and {@code warnings}.
 * Quantities that do not exist (an aliased column's estimate, a likelihood of a quasi family) are
 * JSON null.
 *
 * @since 0.1
 */
public final class FitJson {
    private static final JsonFactory FACTORY = JsonFactory.builder().build();

    private FitJson() {
    }

    /**
     * Writes the summary to a writer, which is flushed but not closed.
     *
     * @param summary the fit summary
     * @param out where to write
     * @throws UncheckedIOException when writing fails
     * @since 0.1
     */
    public static void write(FitSummary summary, Writer out) {
        try (JsonGenerator g = FACTORY.createGenerator(out)) {
            g.disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);
            g.useDefaultPrettyPrinter();
            write(summary, g);
            g.flush();
            out.write(System.lineSeparator());
            out.flush();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static void write(FitSummary s, JsonGenerator g) throws IOException {
        FittedModel fit = s.fit();
        g.writeStartObject();
        g.writeStringField("response", fit.spec().response());
        g.writeStringField("family", fit.family().name());
        g.writeStringField("link", fit.link().name());
        g.writeBooleanField("converged", fit.converged());
        g.writeNumberField("iterations", fit.iterations());
        g.writeNumberField("rows_used", fit.rowCount());
        g.writeNumberField("rank", fit.rank());
        g.writeArrayFieldStart("coefficients");
        for (CoefficientRow row : s.coefficients().rows()) {
            g.writeStartObject();
            g.writeStringField("term", row.name());
            number(g, "estimate", row.estimate());
            number(g, "std_error", row.standardError());
            number(g, "statistic", row.statistic());
            number(g, "p_value", row.pValue());
            g.writeBooleanField("aliased", row.isAliased());
            g.writeEndObject();
        }
        g.writeEndArray();
        g.writeStringField("statistic_reference", s.coefficients().reference().name().toLowerCase(java.util.Locale.ROOT));
        number(g, "deviance", fit.deviance());
        number(g, "null_deviance", fit.nullDeviance());
        g.writeNumberField("df_residual", fit.residualDf());
        g.writeNumberField("df_null", fit.nullDf());
        number(g, "pearson_chi2", s.pearsonChiSquare());
        g.writeObjectFieldStart("dispersion");
        number(g, "pearson", s.pearsonDispersion());
        number(g, "deviance", s.devianceDispersion());
        number(g, "ml", s.mlDispersion());
        number(g, "used", s.dispersionUsed());
        g.writeBooleanField("fixed_by_family", fit.family().isDispersionFixed());
        g.writeEndObject();
        number(g, "log_likelihood", s.logLikelihood());
        number(g, "aic", s.aic());
        number(g, "bic", s.bic());
        g.writeArrayFieldStart("aliased");
        for (String a : fit.aliasedColumns()) {
            g.writeString(a);
        }
        g.writeEndArray();
        g.writeArrayFieldStart("warnings");
        for (String w : s.warnings()) {
            g.writeString(w);
        }
        g.writeEndArray();
        g.writeEndObject();
    }

    private static void number(JsonGenerator g, String name, double value) throws IOException {
        if (Double.isFinite(value)) {
            g.writeNumberField(name, value);
        } else {
            g.writeNullField(name);
        }
    }
}
