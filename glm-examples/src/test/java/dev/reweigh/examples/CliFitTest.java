package dev.reweigh.examples;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.families.Families;
import dev.reweigh.inference.CoefficientRow;
import dev.reweigh.inference.DispersionEstimate;
import dev.reweigh.inference.DispersionMethod;
import dev.reweigh.inference.Inference;
import dev.reweigh.inference.InformationCriteria;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The fit command in-process: JSON fields and values against the Java API, the text report, --save-model. */
class CliFitTest {
    @TempDir
    static Path dir;
    static PortfolioCsv data;
    static Path csv;

    @BeforeAll
    static void writeData() {
        data = new PortfolioCsv(3_000, 7L);
        csv = data.write(dir.resolve("policies.csv"));
    }

    private static ModelSpec poissonSpec() {
        return ModelSpec.builder("claims").family(Families.poisson())
                .factor("driver_age", "25-49").factor("region").numeric("mileage").logOffset("exposure").build();
    }

    private static String[] poissonArgs(String... extra) {
        List<String> args = new java.util.ArrayList<>(List.of("fit", "--data", csv.toString(), "--response", "claims",
                "--family", "poisson", "--factor", "driver_age:25-49", "--factor", "region", "--numeric", "mileage",
                "--log-offset", "exposure"));
        args.addAll(List.of(extra));
        return args.toArray(new String[0]);
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> json(CliRun run) {
        assertEquals(0, run.status, run::toString);
        assertEquals("", run.err, "nothing on standard error");
        return (Map<String, Object>) JsonTree.parse(run.out);
    }

    private static void close(double expected, Object actual, String what) {
        double a = (Double) actual;
        assertEquals(expected, a, 1e-12 * Math.max(1, Math.abs(expected)), what);
    }

    @Test
    @SuppressWarnings("unchecked")
    void jsonHasTheInterfaceFieldsAndTheJavaApiEstimates() {
        Map<String, Object> j = json(CliRun.of(poissonArgs("--json")));
        FittedModel fit = Glm.fit(poissonSpec(), data.table());
        Inference inf = Inference.of(fit);

        for (String field : List.of("converged", "iterations", "coefficients", "deviance", "null_deviance",
                "df_residual", "pearson_chi2", "dispersion", "log_likelihood", "aic", "bic", "aliased", "warnings")) {
            assertTrue(j.containsKey(field), "JSON has field " + field);
        }
        assertEquals(Boolean.TRUE, j.get("converged"));
        assertEquals((double) fit.iterations(), (Double) j.get("iterations"));
        close(fit.deviance(), j.get("deviance"), "deviance");
        close(fit.nullDeviance(), j.get("null_deviance"), "null deviance");
        assertEquals((double) fit.residualDf(), (Double) j.get("df_residual"));
        close(inf.goodnessOfFit().pearsonChiSquare(), j.get("pearson_chi2"), "Pearson chi-square");
        InformationCriteria ic = inf.informationCriteria();
        close(ic.logLikelihood(), j.get("log_likelihood"), "log-likelihood");
        close(ic.aic(), j.get("aic"), "AIC");
        close(ic.bic(), j.get("bic"), "BIC");

        List<Object> coefficients = (List<Object>) j.get("coefficients");
        List<CoefficientRow> rows = inf.coefficients().rows();
        assertEquals(rows.size(), coefficients.size());
        assertEquals(fit.columnNames(), coefficients.stream().map(c -> ((Map<String, Object>) c).get("term")).toList(),
                "terms named and ordered as glm-core names the columns");
        for (int k = 0; k < rows.size(); k++) {
            Map<String, Object> c = (Map<String, Object>) coefficients.get(k);
            CoefficientRow r = rows.get(k);
            close(r.estimate(), c.get("estimate"), "estimate " + r.name());
            close(r.standardError(), c.get("std_error"), "standard error " + r.name());
            close(r.statistic(), c.get("statistic"), "statistic " + r.name());
            close(r.pValue(), c.get("p_value"), "p-value " + r.name());
        }
        Map<String, Object> dispersion = (Map<String, Object>) j.get("dispersion");
        close(DispersionEstimate.of(fit, DispersionMethod.PEARSON).value(), dispersion.get("pearson"), "Pearson phi");
        close(DispersionEstimate.of(fit, DispersionMethod.DEVIANCE).value(), dispersion.get("deviance"), "deviance phi");
        assertNull(dispersion.get("ml"), "Poisson fixes the dispersion: no maximum-likelihood estimate");
        assertEquals(List.of(), j.get("aliased"));
        assertEquals(List.of(), j.get("warnings"));
    }

    @Test
    @SuppressWarnings("unchecked")
    void gammaJsonHasTheMaximumLikelihoodDispersion() {
        Map<String, Object> j = json(CliRun.of("fit", "--data", csv.toString(), "--response", "amount", "--family",
                "gamma", "--link", "log", "--factor", "region", "--json"));
        FittedModel fit = Glm.fit(ModelSpec.builder("amount").family(Families.gamma())
                .link(dev.reweigh.families.Links.log()).factor("region").build(), data.table());
        Map<String, Object> dispersion = (Map<String, Object>) j.get("dispersion");
        close(DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD).value(), dispersion.get("ml"), "ML phi");
        List<Object> coefficients = (List<Object>) j.get("coefficients");
        for (int k = 0; k < fit.columnCount(); k++) {
            Map<String, Object> c = (Map<String, Object>) coefficients.get(k);
            assertEquals(fit.columnNames().get(k), c.get("term"));
            close(fit.coefficients()[k], c.get("estimate"), fit.columnNames().get(k));
        }
    }

    @Test
    @SuppressWarnings("unchecked")
    void anAliasedColumnHasANullEstimateAndIsListed() {
        Path copy = dir.resolve("with-copy.csv");
        StringBuilder sb = new StringBuilder("claims,exposure,mileage,mileage_again\n");
        for (int i = 0; i < 200; i++) {
            sb.append((long) data.claims[i]).append(',').append(data.exposure[i]).append(',').append(data.mileage[i])
                    .append(',').append(2 * data.mileage[i]).append('\n');
        }
        PortfolioCsvFiles.write(copy, sb.toString());
        Map<String, Object> j = json(CliRun.of("fit", "--data", copy.toString(), "--response", "claims", "--family",
                "poisson", "--numeric", "mileage", "--numeric", "mileage_again", "--log-offset", "exposure", "--json"));
        assertEquals(List.of("mileage_again"), j.get("aliased"));
        Map<String, Object> last = (Map<String, Object>) ((List<Object>) j.get("coefficients")).get(2);
        assertEquals("mileage_again", last.get("term"));
        assertNull(last.get("estimate"));
        assertNull(last.get("std_error"));
    }

    @Test
    void textReportShowsEveryPartInOurLayout() {
        CliRun run = CliRun.of(poissonArgs());
        assertEquals(0, run.status, run::toString);
        FittedModel fit = Glm.fit(poissonSpec(), data.table());
        for (String part : List.of("response    claims", "poisson family, log link", "log-offset exposure",
                "terms       driver_age, region, mileage", "converged after " + fit.iterations() + " iterations",
                "driver_age=18-24", "relativity", "deviance    ", "dispersion  used for standard errors: 1",
                "likelihood  log-likelihood", "AIC", "BIC", "warnings    none")) {
            assertTrue(run.out.contains(part), () -> "report contains '" + part + "':\n" + run.out);
        }
        // Words only: no significance stars and no formula strings.
        for (String mark : List.of("*", "~")) {
            assertFalse(run.out.contains(mark), "report avoids '" + mark + "'");
        }
    }

    @Test
    void saveModelWritesAnArtifactThatReproducesTheFit() throws Exception {
        Path model = dir.resolve("frequency.json");
        CliRun run = CliRun.of(poissonArgs("--json", "--save-model", model.toString()));
        assertEquals(0, run.status, run::toString);
        ModelArtifact artifact = ModelArtifact.read(model);
        FittedModel fit = Glm.fit(poissonSpec(), data.table());
        assertEquals(fit.columnNames(), artifact.columnNames());
        double[] expected = fit.coefficients();
        double[] actual = artifact.coefficients();
        for (int j = 0; j < expected.length; j++) {
            assertEquals(expected[j], actual[j], 0.0, fit.columnNames().get(j));
        }
    }

    @Test
    void termsFollowTheOrderOfTheOptions() {
        CliRun run = CliRun.of("fit", "--data", csv.toString(), "--response", "claims", "--family", "poisson",
                "--numeric", "mileage", "--factor", "region", "--interaction", "driver_age,mileage", "--log-offset",
                "exposure", "--json");
        assertEquals(0, run.status, run::toString);
        FittedModel fit = Glm.fit(ModelSpec.builder("claims").family(Families.poisson()).numeric("mileage")
                .factor("region").interaction("driver_age", "mileage").logOffset("exposure").build(), data.table());
        for (String name : fit.columnNames()) {
            assertTrue(run.out.contains("\"term\" : \"" + name + "\""), name);
        }
        assertTrue(run.out.indexOf("\"mileage\"") < run.out.indexOf("\"region="), "mileage before region");
    }
}
