package dev.reweigh.examples.demo;

import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.Scorer;
import dev.reweigh.inference.DispersionEstimate;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Runs the demo on a smaller portfolio (40,000 policies, its own seed) and checks that the
 * estimates recover the simulated truth within tolerances set by their standard errors, and that
 * the output folder holds what the demo promises.
 */
class MotorDemoTest {
    @TempDir
    static Path dir;
    static DemoResult result;
    static String report;

    @BeforeAll
    static void runDemo() {
        StringWriter text = new StringWriter();
        result = MotorDemo.run(DemoSettings.defaults().withPolicies(40_000).withOutput(dir.resolve("out")),
                new PrintWriter(text));
        report = text.toString();
    }

    @Test
    void everyRelativityRecoversTheTruthWithinFourStandardErrors() {
        List<Recovery> recoveries = result.recoveries();
        // 21 frequency columns (intercept, 4 + 4 + 11 levels, mileage) and 20 severity columns.
        assertEquals(41, recoveries.size());
        for (Recovery r : recoveries) {
            assertTrue(Double.isFinite(r.truth()), () -> "truth known for " + r);
            assertTrue(r.standardError() > 0, () -> "standard error for " + r);
            assertTrue(Math.abs(r.estimate() - r.truth()) < 4 * r.standardError(), () -> "within 4 s.e.: " + r);
        }
        long within2 = recoveries.stream().filter(r -> Math.abs(r.standardizedError()) <= 2).count();
        // About 95% should be within 2 s.e.; 41 draws make fewer than 34 very unlikely (binomial tail below 1e-3).
        assertTrue(within2 >= 34, "coefficients within 2 s.e.: " + within2 + " of 41");
    }

    @Test
    void severityDispersionRecoversTheGammaShape() {
        TrueModel truth = result.portfolio().truth();
        List<DispersionEstimate> d = result.severityDispersions();
        DispersionEstimate pearson = d.get(0);
        DispersionEstimate ml = d.get(2);
        assertTrue(Math.abs(ml.value() - truth.severityDispersion()) < 4 * ml.standardError().orElseThrow(),
                "ML dispersion " + ml.value() + " vs true " + truth.severityDispersion());
        assertTrue(Math.abs(pearson.value() - truth.severityDispersion()) < 4 * pearson.standardError().orElseThrow(),
                "Pearson dispersion " + pearson.value() + " vs true " + truth.severityDispersion());
    }

    @Test
    void theTweediePowerFromTheShapeAgreesWithItsProfileLikelihood() {
        // A Poisson number of Gamma(k) amounts is Tweedie with p = (k + 2) / (k + 1) (common practice, no
        // source): the profile's maximum should sit near the simulated p and near the shortcut from the
        // estimated shape; 0.03 is a loose allowance for 100,000 policies (common practice, no source).
        TrueModel truth = result.portfolio().truth();
        double trueP = (truth.severityShape() + 2) / (truth.severityShape() + 1);
        double profileP = result.tweedieProfilePower();
        assertEquals(trueP, profileP, 0.03, "profile power against the simulated power");
        String family = result.tweedie().family().name();
        double shortcutP = Double.parseDouble(family.substring(family.indexOf(':') + 1));
        assertEquals(shortcutP, profileP, 0.03, "profile power against the shape shortcut " + family);
    }

    @Test
    void likelihoodRatioTestsTellARealFactorFromANullOne() {
        // Region moves frequency by up to 30% in the simulation; age has no effect on severity.
        assertTrue(result.frequencyWithoutRegion().pValue() < 1e-4, "region needed for frequency");
        assertTrue(result.severityWithoutAge().pValue() > 0.001, "age not needed for severity");
        assertEquals(11, result.frequencyWithoutRegion().dfDifference());
        assertEquals(4, result.severityWithoutAge().dfDifference());
    }

    @Test
    void negativeBinomialFindsNoOverdispersionInPoissonCounts() {
        // With Poisson counts 1/theta estimates zero: theta is large, or at least its interval reaches far.
        double theta = result.negativeBinomial().theta();
        assertTrue(theta > 50 || theta + 4 * result.negativeBinomial().standardError() > 50, "theta " + theta);
    }

    @Test
    void reportHasEverySectionAndEndsWithTheCautions() {
        for (String s : List.of("== 1. Claim frequency", "== 2. Average claim amount", "== 3. Severity dispersion",
                "== 4. Does a rating factor", "== 5. Relativities", "== 6. True simulated parameters", "== 7. Files",
                "== 8. Cautions", "Gamma, identity link", "Gaussian, log link", "inverse Gaussian, log link",
                "maximum likelihood", "Tweedie", "pure premium", "profile likelihood of the power")) {
            assertTrue(report.contains(s), () -> "report contains '" + s + "'");
        }
        int cautions = report.indexOf("== 8. Cautions");
        for (String line : MotorDemo.CAUTIONS) {
            assertTrue(report.indexOf(line) > cautions, "caution printed: " + line);
        }
        assertTrue(report.contains("not actuarial sign-off") && report.contains("qualified actuary")
                && report.contains("regulation"));
    }

    @Test
    void outputFolderHoldsArtifactsScoredCsvAndCharts() throws IOException {
        Path out = dir.resolve("out");
        for (String chart : List.of(DemoFiles.CHART_FREQUENCY, DemoFiles.CHART_RESIDUALS, DemoFiles.CHART_QQ)) {
            Path png = out.resolve(chart);
            assertTrue(Files.size(png) > 10_000, chart + " has a non-trivial size");
            byte[] head = new byte[8];
            try (InputStream in = Files.newInputStream(png)) {
                assertEquals(8, in.read(head));
            }
            // The PNG signature (ISO/IEC 15948, section 5.2).
            assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'}, head, chart);
        }
        try (Stream<String> lines = Files.lines(out.resolve(DemoFiles.SCORED))) {
            assertEquals(40_000 + 1, lines.count(), "header plus one line per policy");
        }
        String header = Files.newBufferedReader(out.resolve(DemoFiles.SCORED)).readLine();
        assertTrue(header.contains("pure_premium") && header.contains("tweedie_pure_premium"), header);
        assertEquals(7, result.files().size(), "3 artifacts, the scored CSV and 3 charts");
        for (String name : List.of(DemoArtifacts.FREQUENCY, DemoArtifacts.SEVERITY, DemoArtifacts.PURE_PREMIUM)) {
            assertTrue(result.files().contains(out.resolve(name)), name);
        }
    }

    @Test
    void artifactsScoreLikeTheFittedModels() throws IOException {
        Path out = dir.resolve("out");
        ModelArtifact frequency = ModelArtifact.read(out.resolve(DemoArtifacts.FREQUENCY));
        Scorer scorer = frequency.scorer();
        double[] expected = result.frequency().predictMean(result.portfolio().policies());
        double[] actual = new double[expected.length];
        scorer.scoreMean(result.portfolio().policies(), actual);
        assertArrayEquals(expected, actual, 0.0, "bit-identical scores from the artifact");

        ModelArtifact severity = ModelArtifact.read(out.resolve(DemoArtifacts.SEVERITY));
        assertEquals(result.severityDispersions().get(2).value(), severity.dispersion(), 0.0,
                "severity artifact carries the maximum-likelihood dispersion");
        assertEquals(result.severity().columnNames(), severity.columnNames());
        assertTrue(Arrays.equals(result.severity().coefficients(), severity.coefficients()));
    }
}
