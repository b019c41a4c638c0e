package dev.reweigh.core.artifact;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Scorer;
import dev.reweigh.core.Scores;
import dev.reweigh.core.Table;
import dev.reweigh.core.Term;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.nio.file.Path;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Save, load, score: a read artifact predicts bit-identically (link and mean compared as raw
 * bits) to the fitted model, for every sensible family and link, with factors, interactions,
 * raw and orthogonal polynomials and offsets.
 */
class ArtifactRoundTripTest {

    static Stream<Arguments> familiesAndLinks() {
        return Stream.of(
                Arguments.of("gaussian", "identity", false),
                Arguments.of("gaussian", "log", false),
                Arguments.of("gaussian", "inverse", false),
                Arguments.of("gaussian", "sqrt", false),
                Arguments.of("binomial", "logit", false),
                Arguments.of("binomial", "probit", false),
                Arguments.of("binomial", "cloglog", false),
                Arguments.of("binomial", "loglog", false),
                Arguments.of("binomial", "cauchit", false),
                Arguments.of("poisson", "log", true),
                Arguments.of("poisson", "sqrt", false),
                Arguments.of("poisson", "identity", false),
                Arguments.of("poisson", "power:0.33", false),
                Arguments.of("gamma", "inverse", false),
                Arguments.of("gamma", "log", false),
                Arguments.of("gamma", "identity", false),
                Arguments.of("gamma", "power:0.33", false),
                Arguments.of("inverse-gaussian", "inverse-squared", false),
                Arguments.of("inverse-gaussian", "log", false),
                Arguments.of("inverse-gaussian", "inverse", false),
                Arguments.of("tweedie:1.5", "log", true),
                Arguments.of("tweedie:1.5", "power:0.33", false),
                Arguments.of("negative-binomial:2", "log", true),
                Arguments.of("negative-binomial:2", "sqrt", false),
                Arguments.of("quasi:mu", "log", true),
                Arguments.of("quasi:mu^2", "log", false),
                Arguments.of("quasi:mu^2", "inverse", false),
                Arguments.of("quasi:constant", "identity", false),
                Arguments.of("quasi:mu(1-mu)", "logit", false));
    }

    @ParameterizedTest(name = "{0} with {1} link")
    @MethodSource("familiesAndLinks")
    void readArtifactScoresBitIdentically(String family, String link, boolean exposure, @TempDir Path dir)
            throws Exception {
        Portfolio train = new Portfolio(600, 11);
        Table data = train.table("y", train.response(family, exposure));
        ModelSpec.Builder b = ModelSpec.builder("y").family(Families.byName(family)).link(Links.byName(link))
                .factor("region")
                .factor("vehicle", "medium")
                .polynomial("age", 2, true)
                .polynomial("value", 2, false)
                .interaction("vehicle", "age");
        if (family.equals("binomial")) {
            b.trials("trials");
        }
        if (family.equals("quasi:mu(1-mu)")) {
            b.weights("trials");
        }
        if (exposure) {
            b.logOffset("exposure");
        }
        FittedModel fit = Glm.fit(b.build(), data);

        ModelArtifact written = ModelArtifact.of(fit);
        Path file = dir.resolve("model.json");
        written.write(file);
        ModelArtifact read = ModelArtifact.read(file);

        Portfolio fresh = new Portfolio(300, 97);
        Table newRows = fresh.table("y", null);
        double[] link0 = fit.predictLink(newRows);
        double[] mean0 = fit.predictMean(newRows);

        Scores fromFile = read.scorer().score(newRows);
        assertBits(link0, fromFile.link(), "link, read artifact, table");
        assertBits(mean0, fromFile.mean(), "mean, read artifact, table");
        Scores inProcess = fit.scorer().score(newRows);
        assertBits(link0, inProcess.link(), "link, fitted model's scorer");
        assertBits(mean0, inProcess.mean(), "mean, fitted model's scorer");

        Scorer scorer = read.scorer();
        double[] out = new double[fresh.rows];
        scorer.scoreLink(fresh.columns(), out);
        assertBits(link0, out, "link, column arrays");
        scorer.scoreMean(fresh.columns(), out);
        assertBits(mean0, out, "mean, column arrays");
        for (int i = 0; i < 25; i++) {
            Map<String, Object> row = fresh.row(i);
            assertEquals(Double.doubleToRawLongBits(link0[i]), Double.doubleToRawLongBits(scorer.link(row)),
                    "link of row " + i + " given by name");
            assertEquals(Double.doubleToRawLongBits(mean0[i]), Double.doubleToRawLongBits(scorer.mean(row)),
                    "mean of row " + i + " given by name");
        }

        assertBits(fit.coefficients(), read.coefficients(), "coefficients");
        double[][] c0 = fit.unscaledCovariance();
        double[][] c1 = read.unscaledCovariance();
        for (int i = 0; i < c0.length; i++) {
            assertBits(c0[i], c1[i], "covariance row " + i);
        }
        assertEquals(fit.columnNames(), read.columnNames());
        assertEquals(written.checksum(), read.checksum());
        assertEquals(written.toJson(), read.toJson());
        assertEquals(fit.family(), read.family());
        assertEquals(fit.link().name(), read.link().name());
        assertEquals(fit.deviance(), read.deviance());
        assertEquals(fit.iterations(), read.iterations());
        assertEquals(fit.converged(), read.converged());
        assertEquals(Families.byName(family).hasDensity(), read.logLikelihood().isPresent(),
                "a log-likelihood is recorded exactly when the family has a density");
    }

    @Test
    void everyKindOfTermAndBothOffsetsRoundTrip() throws Exception {
        Portfolio train = new Portfolio(800, 5);
        Table data = train.table("claims", train.response("poisson", true));
        ModelSpec spec = ModelSpec.builder("claims").family(Families.poisson())
                .factor("region", "North")
                .factor("vehicle")
                .numeric("age")
                .polynomial("value", 3, true)
                .polynomial("age", 2, false)
                .interaction("region", "vehicle")
                .interaction("age", "value")
                .term(Term.interaction(Term.factor("vehicle"), Term.polynomial("value", 2, false)))
                .term(Term.interaction(Term.interaction(Term.factor("region"), Term.numeric("age")),
                        Term.numeric("value")))
                .term(Term.interaction(Term.factor("region"), Term.polynomial("age", 2, true)))
                .offset("adjustment")
                .logOffset("exposure")
                .build();
        FittedModel fit = Glm.fit(spec, data);
        ByteArrayOutputStream buffer = new ByteArrayOutputStream();
        ModelArtifact.of(fit).write(buffer);
        ModelArtifact read = ModelArtifact.read(new ByteArrayInputStream(buffer.toByteArray()));

        Portfolio fresh = new Portfolio(400, 123);
        Table newRows = fresh.table("claims", null);
        Scores s = read.scorer().score(newRows);
        assertBits(fit.predictLink(newRows), s.link(), "link");
        assertBits(fit.predictMean(newRows), s.mean(), "mean");
        assertEquals(fit.spec().terms().size(), read.spec().terms().size());
        assertEquals(spec.offset(), read.spec().offset());
        assertEquals(spec.logOffset(), read.spec().logOffset());
        assertTrue(read.toJson().contains("\"centres\""), "orthogonal polynomial recurrence is stored");
    }

    @Test
    void awkwardNamesAndLevelsRoundTrip() {
        Portfolio train = new Portfolio(400, 31);
        String[] odd = {"Z\u00fcrich", "a \"quoted\" level", "back\\slash", "tab\there", "\ud83d\ude97 car", "2", "10"};
        String[] district = new String[train.rows];
        for (int i = 0; i < district.length; i++) {
            district[i] = odd[i % odd.length];
        }
        Table data = Table.builder().categorical("district \u00e9", district).numeric("driver age", train.age)
                .numeric("n", train.response("poisson", false)).build();
        FittedModel fit = Glm.fit(ModelSpec.builder("n").family(Families.poisson()).factor("district \u00e9")
                .numeric("driver age").build(), data);
        ModelArtifact read = ModelArtifact.fromJson(ModelArtifact.of(fit).toJson());
        assertEquals(fit.columnNames(), read.columnNames());
        assertBits(fit.predictMean(data), read.scorer().score(data).mean(), "mean with awkward names");
    }

    @Test
    void aliasedColumnsAreWrittenAsNullAndScoreAsZero() throws Exception {
        Portfolio train = new Portfolio(300, 8);
        double[] y = train.response("gaussian", false);
        double[] twiceAge = train.age.clone();
        for (int i = 0; i < twiceAge.length; i++) {
            twiceAge[i] *= 2;
        }
        Table data = Table.builder().numeric("y", y).numeric("age", train.age).numeric("age2", twiceAge)
                .categorical("region", train.region).build();
        FittedModel fit = Glm.fit(ModelSpec.builder("y").numeric("age").numeric("age2").factor("region").build(),
                data);
        assertFalse(fit.aliasedColumns().isEmpty(), "age2 is aliased with age");
        ModelArtifact read = ModelArtifact.fromJson(ModelArtifact.of(fit).toJson());
        assertTrue(Double.isNaN(read.coefficients()[fit.indexOf("age2")]));
        assertTrue(read.toJson().contains("null"));
        assertBits(fit.predictLink(data), read.scorer().score(data).link(), "link with an aliased column");
    }

    @Test
    void callerDispersionAndMethodAreRecorded() {
        Portfolio train = new Portfolio(300, 21);
        Table data = train.table("y", train.response("gamma", false));
        FittedModel fit = Glm.fit(ModelSpec.builder("y").family(Families.gamma()).link(Links.log())
                .factor("region").build(), data);
        ModelArtifact a = ModelArtifact.fromJson(ModelArtifact.of(fit, 0.31, "maximum likelihood").toJson());
        assertEquals(0.31, a.dispersion());
        assertEquals("maximum likelihood", a.dispersionMethod());
        ModelArtifact d = ModelArtifact.of(fit);
        assertEquals(ModelArtifact.PEARSON, d.dispersionMethod());
        // Pearson estimate: sum of (y - mu)^2 / V(mu) over the residual df, common practice, no source
        double[] yy = fit.response();
        double[] mu = fit.fittedValues();
        double s = 0;
        for (int i = 0; i < yy.length; i++) {
            s += (yy[i] - mu[i]) * (yy[i] - mu[i]) / (mu[i] * mu[i]);
        }
        assertEquals(s / fit.residualDf(), d.dispersion(), 1e-12 * d.dispersion());
        assertEquals(ModelArtifact.FIXED_BY_FAMILY, ModelArtifact.of(Glm.fit(ModelSpec.builder("n")
                .family(Families.poisson()).factor("region").build(), train.table("n",
                train.response("poisson", false)))).dispersionMethod());
    }

    static void assertBits(double[] expected, double[] actual, String what) {
        assertEquals(expected.length, actual.length, what + ": length");
        for (int i = 0; i < expected.length; i++) {
            if (Double.doubleToRawLongBits(expected[i]) != Double.doubleToRawLongBits(actual[i])) {
                throw new AssertionError(what + ": entry " + i + " differs: expected " + expected[i] + " but was "
                        + actual[i]);
            }
        }
    }
}
