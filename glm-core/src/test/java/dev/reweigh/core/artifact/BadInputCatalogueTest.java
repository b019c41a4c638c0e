package dev.reweigh.core.artifact;

import dev.reweigh.core.ArtifactException;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.ModelSpecException;
import dev.reweigh.core.Table;
import dev.reweigh.core.Term;
import dev.reweigh.core.UnseenLevelException;
import dev.reweigh.families.Families;
import dev.reweigh.families.Family;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Link;
import dev.reweigh.families.Links;
import dev.reweigh.families.ReweighException;
import dev.reweigh.families.UnknownNameException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The Java half of the catalogue of bad inputs: each case names the mistake, the exception type
 * the library promises, and the words its message must contain (the column, row, field and the
 * bad value). The command-line half lives in glm-examples.
 */
class BadInputCatalogueTest {

    // a small claims table; cells are replaced per case
    private static final double[] Y = {1, 0, 2, 3, 1, 0, 4, 2};
    private static final double[] X = {1, 2, 3, 4, 5, 6, 7, 8};
    private static final String[] G = {"a", "b", "a", "b", "c", "c", "a", "b"};

    private static Table table(String column, int row, double value) {
        Map<String, double[]> num = new LinkedHashMap<>();
        num.put("y", Y.clone());
        num.put("x", X.clone());
        num.put("w", new double[] {1, 1, 1, 1, 1, 1, 1, 1});
        num.put("e", new double[] {1, 0.5, 1, 0.5, 1, 0.5, 1, 0.5});
        num.put("o", new double[8]);
        num.put("n", new double[] {5, 5, 5, 5, 5, 5, 5, 5});
        num.put("p", new double[] {0.2, 0, 0.4, 0.6, 0.2, 0, 0.8, 0.4});
        num.put("s", new double[] {1.5, 2.5, 0.7, 3.1, 1.2, 2.2, 0.9, 1.8});
        if (column != null) {
            num.get(column)[row] = value;
        }
        Table.Builder b = Table.builder().categorical("g", G);
        num.forEach(b::numeric);
        return b.build();
    }

    private static Table ok() {
        return table(null, 0, 0);
    }

    private static ModelSpec.Builder poisson() {
        return ModelSpec.builder("y").family(Families.poisson()).numeric("x");
    }

    private static Executable fit(ModelSpec.Builder spec, Table t) {
        return () -> Glm.fit(spec.build(), t);
    }

    private static Executable fit(Family f, String response, Table t) {
        return () -> Glm.fit(ModelSpec.builder(response).family(f).numeric("x").build(), t);
    }

    private static Arguments bad(String description, Class<? extends Throwable> type, Executable action,
            String... mentions) {
        return Arguments.of(description, type, action, List.of(mentions));
    }

    private static final FittedModel FIT = Glm.fit(ModelSpec.builder("y").family(Families.poisson()).factor("g")
            .numeric("x").logOffset("e").build(), ok());

    private static Map<String, Object> row(Object g, Object x, Object e) {
        Map<String, Object> m = new HashMap<>();
        m.put("g", g);
        m.put("x", x);
        m.put("e", e);
        return m;
    }

    static Stream<Arguments> catalogue() {
        List<Arguments> c = new ArrayList<>();
        // ---- tables
        c.add(bad("columns of different lengths", InvalidDataException.class,
                () -> Table.builder().numeric("a", 1, 2, 3).numeric("b", 1, 2).build(), "'b'", "2", "3", "'a'"));
        c.add(bad("two columns with one name", ReweighException.class,
                () -> Table.builder().numeric("a", 1).numeric("a", 2), "'a'"));
        c.add(bad("a table without columns", ReweighException.class, () -> Table.builder().build(), "column"));
        c.add(bad("a value outside the caller's level order", UnknownNameException.class,
                () -> Table.builder().categorical("g", List.of("x", "y"), "x", "z"), "'g'", "'z'", "row 1", "x, y"));
        c.add(bad("a level order that repeats a level", ReweighException.class,
                () -> Table.builder().categorical("g", List.of("x", "x"), "x"), "'g'", "x"));
        c.add(bad("an unknown column asked of a table", UnknownNameException.class,
                () -> ok().numeric("nope"), "'nope'", "x"));
        // ---- specification against the data
        c.add(bad("a table with no rows", ModelSpecException.class,
                fit(poisson(), Table.builder().numeric("y").numeric("x").build()), "no rows"));
        c.add(bad("an unknown response column", UnknownNameException.class,
                fit(ModelSpec.builder("claimz").numeric("x"), ok()), "'claimz'", "y"));
        c.add(bad("an unknown term column", UnknownNameException.class,
                fit(ModelSpec.builder("y").numeric("agee"), ok()), "'agee'"));
        c.add(bad("an unknown weights column", UnknownNameException.class,
                fit(poisson().weights("weight"), ok()), "'weight'"));
        c.add(bad("a categorical response", ModelSpecException.class,
                fit(ModelSpec.builder("g").numeric("x"), ok()), "'g'", "response"));
        c.add(bad("a categorical offset", ModelSpecException.class, fit(poisson().offset("g"), ok()), "'g'",
                "offset"));
        c.add(bad("a categorical log-offset (exposure)", ModelSpecException.class,
                fit(poisson().logOffset("g"), ok()), "'g'", "exposure"));
        c.add(bad("categorical weights", ModelSpecException.class, fit(poisson().weights("g"), ok()), "'g'",
                "weights"));
        c.add(bad("a categorical trials column", ModelSpecException.class,
                fit(ModelSpec.builder("y").family(Families.binomial()).trials("g"), ok()), "'g'", "trials"));
        c.add(bad("a factor on a numeric column", ModelSpecException.class, fit(poisson().factor("n"), ok()),
                "'n'", "numeric"));
        c.add(bad("a numeric term on a categorical column", ModelSpecException.class,
                fit(ModelSpec.builder("y").numeric("g"), ok()), "'g'", "categorical"));
        c.add(bad("a polynomial in a categorical column", ModelSpecException.class,
                fit(ModelSpec.builder("y").polynomial("g", 2, false), ok()), "'g'", "polynomial"));
        c.add(bad("an unknown reference level", UnknownNameException.class,
                fit(poisson().factor("g", "Atlantis"), ok()), "'Atlantis'", "'g'", "a, b, c"));
        c.add(bad("a trials column with the Poisson family", ModelSpecException.class,
                () -> poisson().trials("n").build(), "'n'", "binomial", "poisson"));
        c.add(bad("more coefficients than rows", ModelSpecException.class,
                fit(ModelSpec.builder("y").polynomial("x", 7, false).factor("g"), ok()), "10", "8"));
        c.add(bad("polynomial degree zero", ModelSpecException.class, () -> Term.polynomial("x", 0, true), "'x'",
                "0", "at least 1"));
        c.add(bad("removing a term that is not in the specification", UnknownNameException.class,
                () -> poisson().build().withoutTerm("age"), "'age'", "x"));
        c.add(bad("every row dropped as incomplete", ModelSpecException.class,
                fit(poisson().dropIncompleteRows(true), Table.builder().numeric("y", 1, 2).numeric("x", Double.NaN,
                        Double.NaN).build()), "no complete rows"));
        // ---- weights
        c.add(bad("all weights zero", InvalidDataException.class,
                fit(poisson().weights("w"), Table.builder().numeric("y", 1, 2).numeric("x", 1, 2).numeric("w", 0, 0)
                        .build()), "'w'", "all zero", "positive"));
        c.add(bad("a negative weight", InvalidDataException.class, fit(poisson().weights("w"), table("w", 2, -1)),
                "'w'", "row 2", "value -1 ", "non-negative"));
        c.add(bad("a NaN weight", InvalidDataException.class, fit(poisson().weights("w"), table("w", 3, Double.NaN)),
                "'w'", "row 3", "NaN"));
        c.add(bad("an infinite weight", InvalidDataException.class,
                fit(poisson().weights("w"), table("w", 4, Double.POSITIVE_INFINITY)), "'w'", "row 4", "Infinity"));
        // ---- non-finite values in each role
        c.add(bad("a NaN response", InvalidDataException.class, fit(poisson(), table("y", 1, Double.NaN)), "'y'",
                "row 1", "NaN"));
        c.add(bad("an infinite response", InvalidDataException.class,
                fit(Families.gaussian(), "y", table("y", 5, Double.POSITIVE_INFINITY)), "'y'", "row 5", "Infinity"));
        c.add(bad("a NaN predictor", InvalidDataException.class, fit(poisson(), table("x", 6, Double.NaN)), "'x'",
                "row 6", "NaN"));
        c.add(bad("an infinite predictor", InvalidDataException.class,
                fit(poisson(), table("x", 0, Double.NEGATIVE_INFINITY)), "'x'", "row 0", "-Infinity"));
        c.add(bad("a NaN offset", InvalidDataException.class, fit(poisson().offset("o"), table("o", 2, Double.NaN)),
                "'o'", "row 2", "NaN"));
        c.add(bad("an infinite offset", InvalidDataException.class,
                fit(poisson().offset("o"), table("o", 7, Double.POSITIVE_INFINITY)), "'o'", "row 7", "Infinity"));
        c.add(bad("a zero exposure", InvalidDataException.class, fit(poisson().logOffset("e"), table("e", 1, 0)),
                "'e'", "row 1", "value 0 ", "positive"));
        c.add(bad("a negative exposure", InvalidDataException.class, fit(poisson().logOffset("e"), table("e", 2, -3)),
                "'e'", "row 2", "value -3 "));
        c.add(bad("an infinite exposure", InvalidDataException.class,
                fit(poisson().logOffset("e"), table("e", 3, Double.POSITIVE_INFINITY)), "'e'", "row 3", "Infinity"));
        c.add(bad("a missing factor level", InvalidDataException.class,
                fit(ModelSpec.builder("y").factor("g"), Table.builder().numeric("y", 1, 2, 3)
                        .categorical("g", "a", null, "b").build()), "'g'", "row 1", "missing"));
        // ---- responses outside the family's domain
        c.add(bad("a negative Gamma response", InvalidDataException.class,
                fit(Families.gamma(), "s", table("s", 4, -1.5)), "'s'", "row 4", "-1.5", "gamma"));
        c.add(bad("a zero Gamma response", InvalidDataException.class, fit(Families.gamma(), "s", table("s", 0, 0)),
                "'s'", "row 0", "value 0 "));
        c.add(bad("a zero inverse-Gaussian response", InvalidDataException.class,
                fit(Families.inverseGaussian(), "s", table("s", 6, 0)), "'s'", "row 6", "value 0 ", "inverse-gaussian"));
        c.add(bad("a non-integer Poisson count", InvalidDataException.class, fit(poisson(), table("y", 3, 2.5)),
                "'y'", "row 3", "2.5", "poisson"));
        c.add(bad("a negative Poisson count", InvalidDataException.class, fit(poisson(), table("y", 2, -1)), "'y'",
                "row 2", "value -1 "));
        c.add(bad("a non-integer negative binomial count", InvalidDataException.class,
                fit(Families.negativeBinomial(2), "y", table("y", 7, 1.25)), "'y'", "row 7", "1.25",
                "negative-binomial"));
        c.add(bad("a negative Tweedie response", InvalidDataException.class,
                fit(Families.tweedie(1.5), "s", table("s", 1, -0.5)), "'s'", "row 1", "-0.5", "tweedie"));
        c.add(bad("a binomial proportion above 1", InvalidDataException.class,
                fit(ModelSpec.builder("p").family(Families.binomial()).weights("n").numeric("x"), table("p", 5, 1.5)),
                "'p'", "row 5", "1.5"));
        c.add(bad("a binomial proportion below 0", InvalidDataException.class,
                fit(ModelSpec.builder("p").family(Families.binomial()).weights("n").numeric("x"), table("p", 0, -0.25)),
                "'p'", "row 0", "-0.25"));
        c.add(bad("successes above trials", InvalidDataException.class,
                fit(ModelSpec.builder("y").family(Families.binomial()).trials("n").numeric("x"), table("y", 4, 6)),
                "'y'", "row 4", "value 6 ", "5", "'n'"));
        c.add(bad("a non-integer number of trials", InvalidDataException.class,
                fit(ModelSpec.builder("y").family(Families.binomial()).trials("n").numeric("x"), table("n", 2, 4.5)),
                "'n'", "row 2", "4.5", "whole number"));
        c.add(bad("a negative number of trials", InvalidDataException.class,
                fit(ModelSpec.builder("y").family(Families.binomial()).trials("n").numeric("x"), table("n", 3, -5)),
                "'n'", "row 3", "value -5 "));
        // ---- names
        c.add(bad("an unknown family name", UnknownNameException.class, () -> Families.byName("poison"),
                "'poison'", "poisson"));
        c.add(bad("an unknown link name", UnknownNameException.class, () -> Links.byName("logitt"), "'logitt'",
                "logit"));
        c.add(bad("an unknown quasi variance", ReweighException.class, () -> Families.byName("quasi:mu^x"),
                "mu^x"));
        c.add(bad("a Tweedie power between 0 and 1", ReweighException.class, () -> Families.byName("tweedie:0.5"),
                "0.5"));
        c.add(bad("an unknown coefficient name", UnknownNameException.class, () -> FIT.coefficient("x^2"), "'x^2'",
                "intercept"));
        // ---- prediction and scoring
        c.add(bad("predicting without a needed column", UnknownNameException.class,
                () -> FIT.predictLink(Table.builder().categorical("g", "a").numeric("e", 1).build()), "'x'"));
        c.add(bad("an unseen level when predicting", UnknownNameException.class,
                () -> FIT.predictLink(Table.builder().categorical("g", "d").numeric("x", 1).numeric("e", 1).build()),
                "'d'", "'g'"));
        c.add(bad("an unseen level when scoring", UnseenLevelException.class,
                () -> FIT.scorer().score(Table.builder().categorical("g", "a", "d").numeric("x", 1, 2)
                        .numeric("e", 1, 1).build()), "'g'", "row 1", "'d'", "a, b, c"));
        c.add(bad("a NaN when scoring", InvalidDataException.class,
                () -> FIT.scorer().score(Table.builder().categorical("g", "a", "b").numeric("x", 1, Double.NaN)
                        .numeric("e", 1, 1).build()), "'x'", "row 1", "NaN"));
        c.add(bad("a zero exposure when scoring", InvalidDataException.class,
                () -> FIT.scorer().scoreMean(Map.of("g", new String[] {"a", "b", "c"}, "x", new double[] {1, 2, 3},
                        "e", new double[] {1, 1, 0}), new double[3]), "'e'", "row 2", "value 0 ", "exposure"));
        c.add(bad("scoring arrays of different lengths", InvalidDataException.class,
                () -> FIT.scorer().score(Map.of("g", new String[] {"a", "b"}, "x", new double[] {1, 2, 3},
                        "e", new double[] {1, 1})), "length 3", "length 2"));
        c.add(bad("a numeric column given as text when scoring", InvalidDataException.class,
                () -> FIT.scorer().score(Map.of("g", new String[] {"a"}, "x", new String[] {"1"},
                        "e", new double[] {1})), "'x'", "String[]", "double[]"));
        c.add(bad("a row without a needed column", UnknownNameException.class,
                () -> FIT.scorer().mean(Map.of("g", "a", "x", 2.0)), "'e'"));
        c.add(bad("a row with text where a number is needed", InvalidDataException.class,
                () -> FIT.scorer().mean(row("a", "two", 1.0)), "'x'", "\"two\"", "finite number"));
        c.add(bad("a row with no level", InvalidDataException.class,
                () -> FIT.scorer().mean(row(null, 2.0, 1.0)), "'g'", "missing", "a, b, c"));
        c.add(bad("an output array shorter than the rows", ReweighException.class,
                () -> FIT.scorer().scoreLink(ok(), new double[3]), "length 3", "8"));
        // ---- artifacts
        String json = ModelArtifact.of(FIT).toJson();
        c.add(bad("a truncated artifact", ArtifactException.class,
                () -> ModelArtifact.fromJson(json.substring(0, json.length() / 3)), "'document'", "truncated"));
        c.add(bad("a tampered coefficient", ArtifactException.class,
                () -> ModelArtifact.fromJson(tamperFirstCoefficient(json)), "'checksum.value'", "does not match"));
        c.add(bad("an artifact of a newer major version", ArtifactException.class,
                () -> ModelArtifact.fromJson(json.replace("\"formatVersion\" : \"1.0\"", "\"formatVersion\" : \"3.1\"")),
                "'formatVersion'", "3.1", "newer"));
        c.add(bad("an artifact with a missing field", ArtifactException.class,
                () -> ModelArtifact.fromJson(withoutMember(json, "link")), "'model.link'", "missing"));
        c.add(bad("an artifact with a mistyped field", ArtifactException.class,
                () -> ModelArtifact.fromJson(withMember(json, "converged", "\"yes\"")), "'model.fit.converged'",
                "true or false", "\"yes\""));
        c.add(bad("garbage instead of an artifact", ArtifactException.class,
                () -> ModelArtifact.fromJson("PK\u0003\u0004 not json"), "'document'", "not valid JSON"));
        c.add(bad("an unknown family in an artifact", ArtifactException.class,
                () -> ModelArtifact.fromJson(withMember(json, "family", "\"poison\"")), "'model.family'", "poison"));
        c.add(bad("a link of the caller's own that an artifact cannot name", ReweighException.class,
                () -> ModelArtifact.of(Glm.fit(ModelSpec.builder("y").family(Families.poisson()).link(new OwnLog())
                        .numeric("x").build(), ok())), "'my-log'", "cannot be stored", "artifact"));
        return c.stream();
    }

    /** A caller's own link: the log link under another name. */
    private static final class OwnLog implements Link {
        private final Link log = Links.log();

        @Override
        public String name() {
            return "my-log";
        }

        @Override
        public double apply(double mu) {
            return log.apply(mu);
        }

        @Override
        public double inverse(double eta) {
            return log.inverse(eta);
        }

        @Override
        public double derivative(double eta) {
            return log.derivative(eta);
        }

        @Override
        public boolean isValidEta(double eta) {
            return log.isValidEta(eta);
        }

        @Override
        public String etaDomain() {
            return log.etaDomain();
        }
    }

    private static String tamperFirstCoefficient(String json) {
        Map<String, Object> d = ArtifactText.parse(json);
        @SuppressWarnings("unchecked")
        List<Object> beta = (List<Object>) ArtifactText.object(d, "model").get("coefficients");
        beta.set(0, (Double) beta.get(0) * 1.0001);
        return ArtifactText.unsigned(d);
    }

    @SuppressWarnings("unchecked")
    private static String withoutMember(String json, String name) {
        Map<String, Object> d = ArtifactText.parse(json);
        ArtifactText.object(d, "model").remove(name);
        return ArtifactText.signed(d);
    }

    @SuppressWarnings("unchecked")
    private static String withMember(String json, String name, String valueJson) {
        Map<String, Object> d = ArtifactText.parse(json);
        Object v = ArtifactText.parse("{\"v\":" + valueJson + "}").get("v");
        Map<String, Object> model = ArtifactText.object(d, "model");
        if (model.containsKey(name)) {
            model.put(name, v);
        } else {
            ArtifactText.object(d, "model", "fit").put(name, v);
        }
        return ArtifactText.signed(d);
    }

    @ParameterizedTest(name = "{index}: {0}")
    @MethodSource("catalogue")
    void badInputGivesTheLibrarysExceptionNamingWhatIsWrong(String description, Class<? extends Throwable> type,
            Executable action, List<String> mentions) {
        Throwable e = assertThrows(Throwable.class, action, description);
        assertTrue(type.isInstance(e), description + ": expected " + type.getSimpleName() + " but got "
                + e.getClass().getName() + ": " + e.getMessage());
        assertTrue(e instanceof ReweighException, description + ": not a library exception: " + e);
        for (String m : mentions) {
            assertTrue(e.getMessage().contains(m), description + ": the message should mention " + m + ": "
                    + e.getMessage());
        }
    }

    @Test
    void theCatalogueHasAtLeastFortyDistinctCases() {
        List<String> names = new ArrayList<>();
        catalogue().forEach(a -> names.add((String) a.get()[0]));
        assertTrue(names.size() >= 40, "cases: " + names.size());
        assertEquals(names.size(), names.stream().distinct().count(), "descriptions are distinct");
    }
}
