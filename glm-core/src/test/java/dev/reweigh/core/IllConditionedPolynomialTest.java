package dev.reweigh.core;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.Locale;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Robustness on designs as hard as the hardest NIST polynomial problem (degree 10 on x in [-9, -3],
 * condition number about 4e9 after column scaling, 1e15 before): y is generated from a
 * degree-10 polynomial plus noise, and the fit must agree with an exact-arithmetic least-squares
 * solution ({@link ExactLeastSquares}) to at least 9 digits in every estimate, standard error
 * and the residual standard deviation.
 */
class IllConditionedPolynomialTest {
    // A smooth decreasing-then-flat curve on [-9, -3]; the coefficients only shape the data.
    private static final double[] SHAPE = {-1467.49, -2772.18, -2316.37, -1127.97, -354.478, -75.1242,
        -10.8753, -1.06221, -0.0670191, -0.00246781, -0.0000402963};

    private static final double[] QUADRATIC = {6.7e-4, 7.3e-7, -3.2e-15};

    @ParameterizedTest
    @CsvSource({"10, -9, -3, 82, 1, 0.0033, filip", "10, -9, -3, 82, 2, 0.0033, filip",
        "8, -9, -3, 60, 3, 0.0033, filip", "10, -8.8, -3.1, 82, 4, 0.0033, filip", "6, 0, 20, 21, 5, 0.0033, filip",
        "10, 3, 9, 82, 6, 0.0033, filip",
        // like the NIST Wampler problems: 1 + x + ... + x^5 on 0..20 with small and very large noise
        "5, 0, 20, 21, 7, 236, ones", "5, 0, 20, 21, 8, 23600, ones", "5, 0, 20, 21, 9, 1e-3, ones",
        // like the NIST Pontius problem: a quadratic in x up to 3e6
        "2, 150000, 3000000, 40, 10, 2e-4, quadratic"})
    void recoversTheExactSolution(int degree, double lo, double hi, int n, long seed, double noise, String shape) {
        Random rnd = new Random(seed);
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            // ten significant digits, like a measured abscissa
            x[i] = Math.round((lo + (hi - lo) * rnd.nextDouble()) * 1e9) / 1e9;
            double v = 0;
            for (int k = Math.min(degree, SHAPE.length - 1); k >= 0; k--) {
                v = v * x[i] + (shape.equals("ones") ? 1.0 : shape.equals("quadratic") ? QUADRATIC[k] : SHAPE[k]);
            }
            y[i] = v + noise * rnd.nextGaussian();
        }
        ExactLeastSquares exact = ExactLeastSquares.fit(ExactLeastSquares.polynomial(x, degree), y);
        Table t = Table.builder().numeric("x", x).numeric("y", y).build();
        for (Solver solver : new Solver[] {Solver.AUTO, Solver.PIVOTED_QR}) {
            FittedModel fit = Glm.fit(ModelSpec.builder("y").polynomial("x", degree, false).build(), t,
                    FitOptions.builder().solver(solver).build());
            double s2 = fit.deviance() / fit.residualDf();
            double min = NistDataset.lre(Math.sqrt(s2), exact.residualSd);
            StringBuilder sb = new StringBuilder();
            for (int j = 0; j <= degree; j++) {
                double l1 = NistDataset.lre(fit.coefficients()[j], exact.beta[j]);
                double l2 = NistDataset.lre(Math.sqrt(s2 * fit.unscaledCovariance()[j][j]), exact.standardErrors[j]);
                sb.append(String.format(Locale.ROOT, " %s: %.1f/%.1f", fit.columnNames().get(j), l1, l2));
                min = Math.min(min, Math.min(l1, l2));
            }
            System.out.printf(Locale.ROOT, "%s degree %d seed %d: minimum LRE %.2f%n", solver, degree, seed, min);
            assertTrue(min >= 9, solver + " minimum LRE " + min + ":" + sb);
            assertTrue(fit.aliasedColumns().isEmpty(), "nothing is aliased");
        }
    }
}
