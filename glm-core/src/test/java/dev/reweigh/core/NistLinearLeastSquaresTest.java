package dev.reweigh.core;

import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * NIST StRD linear least squares (NIST/ITL Statistical Reference Datasets, certified values to 15
 * digits; see src/test/resources/nist-strd-lls/SOURCES.md): every .dat file in the folder is fitted
 * as a Gaussian identity-link model; every certified estimate, certified standard deviation and
 * the residual standard deviation must be matched with a log relative error of at least 9.
 */
class NistLinearLeastSquaresTest {
    private static final double REQUIRED_LRE = 9.0;

    static List<Path> datasets() throws IOException, URISyntaxException {
        Path dir = Path.of(NistLinearLeastSquaresTest.class.getResource("/nist-strd-lls").toURI());
        try (Stream<Path> s = Files.list(dir)) {
            return s.filter(f -> f.toString().endsWith(".dat")).sorted().collect(java.util.stream.Collectors.toList());
        }
    }

    @TestFactory
    Stream<DynamicTest> everyDatasetWithEverySolver() throws IOException, URISyntaxException {
        List<Path> files = datasets();
        assertFalse(files.isEmpty(), "no NIST files found");
        List<DynamicTest> tests = new ArrayList<>();
        for (Path f : files) {
            for (Solver solver : List.of(Solver.AUTO, Solver.PIVOTED_QR)) {
                tests.add(DynamicTest.dynamicTest(f.getFileName() + " " + solver, () -> check(NistDataset.read(f), solver)));
            }
        }
        return tests.stream();
    }

    static double minimumLre(NistDataset d, Solver solver, StringBuilder report) {
        FittedModel fit = Glm.fit(d.spec(), d.table(), FitOptions.builder().solver(solver).build());
        double s2 = fit.deviance() / fit.residualDf();
        double[][] cov = fit.unscaledCovariance();
        double min = NistDataset.lre(Math.sqrt(s2), d.residualSd);
        report.append(String.format(Locale.ROOT, "%s (%s): residual sd LRE %.1f%n", d.name, solver, min));
        for (Map.Entry<Integer, double[]> e : d.certified.entrySet()) {
            String col = d.columnOf(e.getKey());
            int j = fit.indexOf(col);
            double est = fit.coefficients()[j];
            double sd = Math.sqrt(s2 * cov[j][j]);
            double l1 = NistDataset.lre(est, e.getValue()[0]);
            double l2 = NistDataset.lre(sd, e.getValue()[1]);
            report.append(String.format(Locale.ROOT, "  B%d %s: estimate LRE %.1f, sd LRE %.1f%n", e.getKey(), col, l1, l2));
            min = Math.min(min, Math.min(l1, l2));
        }
        return min;
    }

    private static void check(NistDataset d, Solver solver) {
        StringBuilder report = new StringBuilder();
        double min = minimumLre(d, solver, report);
        System.out.print(report);
        assertTrue(min >= REQUIRED_LRE, "LRE below " + REQUIRED_LRE + ":\n" + report);
    }
}
