package dev.reweigh.core;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * A Gaussian identity-link fit is ordinary least squares: estimates and standard errors agree
 * with Commons Math's OLSMultipleLinearRegression on random designs.
 */
class OlsAgreementPropertyTest {

    @Property(tries = 200)
    void gaussianIdentityMatchesCommonsMathOls(@ForAll @IntRange(min = 1, max = 6) int predictors,
            @ForAll @IntRange(min = 0, max = 40) int extraRows, @ForAll @LongRange(min = 0, max = 1_000_000) long seed) {
        Random rnd = new Random(seed);
        int n = predictors + 3 + extraRows;
        double[][] x = new double[n][predictors];
        double[] y = new double[n];
        Table.Builder tb = Table.builder();
        ModelSpec.Builder sb = ModelSpec.builder("y");
        double[] scales = new double[predictors];
        for (int k = 0; k < predictors; k++) {
            scales[k] = Math.pow(10, rnd.nextInt(7) - 3);
        }
        for (int i = 0; i < n; i++) {
            double v = rnd.nextGaussian() * 5;
            for (int k = 0; k < predictors; k++) {
                x[i][k] = scales[k] * (rnd.nextGaussian() + k);
                v += (k + 1) * x[i][k] / scales[k];
            }
            y[i] = v + rnd.nextGaussian();
        }
        for (int k = 0; k < predictors; k++) {
            double[] col = new double[n];
            for (int i = 0; i < n; i++) {
                col[i] = x[i][k];
            }
            tb.numeric("x" + k, col);
            sb.numeric("x" + k);
        }
        tb.numeric("y", y);
        FittedModel fit = Glm.fit(sb.build(), tb.build());
        OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
        ols.newSampleData(y, x);
        double[] b = ols.estimateRegressionParameters();
        double[] se = ols.estimateRegressionParametersStandardErrors();
        double s2 = fit.deviance() / fit.residualDf();
        double[][] cov = fit.unscaledCovariance();
        for (int j = 0; j <= predictors; j++) {
            double ours = fit.coefficients()[j];
            assertEquals(b[j], ours, 1e-8 * (Math.abs(b[j]) + se[j]), "estimate " + j);
            assertEquals(se[j], Math.sqrt(s2 * cov[j][j]), 1e-8 * se[j], "standard error " + j);
        }
        assertEquals(ols.calculateResidualSumOfSquares(), fit.deviance(), 1e-8 * fit.deviance());
    }
}
