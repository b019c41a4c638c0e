package dev.reweigh.core;

import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.junit.jupiter.api.Test;

import java.util.Random;
import java.util.function.ToDoubleFunction;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Fits that plain IRLS finds hard must still reach the maximum likelihood: each result is checked
 * against an independent maximisation of a log-likelihood written here (Commons Math
 * distributions where they exist) and the score equations.
 */
class HardCasesTest {

    private static void assertAgree(double[] ours, double[] theirs, double tol, String what) {
        for (int j = 0; j < ours.length; j++) {
            assertTrue(Math.abs(ours[j] - theirs[j]) <= tol * Math.max(1e-3, Math.abs(theirs[j])),
                    what + " coefficient " + j + ": ours " + ours[j] + ", independent " + theirs[j]);
        }
    }

    /** Score of each coefficient, relative to the sum of the absolute terms. */
    private static double maxRelativeScore(double[][] x, double[] terms) {
        double worst = 0;
        for (int j = 0; j < x[0].length; j++) {
            double s = 0;
            double a = 0;
            for (int i = 0; i < x.length; i++) {
                s += x[i][j] * terms[i];
                a += Math.abs(x[i][j] * terms[i]);
            }
            worst = Math.max(worst, Math.abs(s) / a);
        }
        return worst;
    }

    @Test
    void identityLinkGammaWhoseFullStepsLeaveTheDomain() {
        Random rnd = new Random(12);
        int n = 30;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 10 * rnd.nextDouble();
            y[i] = Portfolios.gamma(rnd, 0.6) * (0.2 + x[i]) / 0.6;
        }
        Table t = Table.builder().numeric("x", x).numeric("y", y).build();
        int[] halvings = {0};
        FittedModel fit = Glm.fit(ModelSpec.builder("y").family(Families.gamma()).link(Links.identity()).numeric("x")
                .build(), t, FitOptions.builder().listener(e -> halvings[0] += e.stepHalvings()).build());
        assertTrue(halvings[0] > 0, "the data should force step-halving");
        assertTrue(fit.converged(), fit.warnings().toString());
        double[] mu = fit.fittedValues();
        double[] terms = new double[n];
        for (int i = 0; i < n; i++) {
            assertTrue(mu[i] > 0);
            terms[i] = (y[i] - mu[i]) / (mu[i] * mu[i]);
        }
        assertTrue(maxRelativeScore(fit.modelMatrix(t), terms) < 1e-9);
        // free parameters: the logs of the means at the smallest and largest x, so that every
        // mean in between is positive and the optimizer meets no cliff
        double lo = java.util.Arrays.stream(x).min().orElseThrow();
        double hi = java.util.Arrays.stream(x).max().orElseThrow();
        ToDoubleFunction<double[]> ll = b -> {
            double s = 0;
            for (int i = 0; i < n; i++) {
                double m = Math.exp(b[0]) + (Math.exp(b[1]) - Math.exp(b[0])) * (x[i] - lo) / (hi - lo);
                s += new GammaDistribution(0.6, m / 0.6).logDensity(y[i]);
            }
            return s;
        };
        double[] b = IndependentMaximiser.maximise(ll, new double[] {0, 2}, 0.3);
        double slope = (Math.exp(b[1]) - Math.exp(b[0])) / (hi - lo);
        assertAgree(fit.coefficients(), new double[] {Math.exp(b[0]) - slope * lo, slope}, 1e-6, "identity gamma");
    }

    @Test
    void identityLinkPoissonAndInverseLinkGammaStayInTheirDomains() {
        Random rnd = new Random(5);
        int n = 60;
        double[] x = new double[n];
        double[] counts = new double[n];
        double[] sizes = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 4 * rnd.nextDouble();
            counts[i] = Portfolios.poisson(rnd, 0.05 + 1.5 * x[i]);
            sizes[i] = Portfolios.gamma(rnd, 0.8) / (0.05 + 0.5 * x[i]) / 0.8;
        }
        Table t = Table.builder().numeric("x", x).numeric("counts", counts).numeric("sizes", sizes).build();
        FittedModel pois = Glm.fit(ModelSpec.builder("counts").family(Families.poisson()).link(Links.identity())
                .numeric("x").build(), t);
        FittedModel gam = Glm.fit(ModelSpec.builder("sizes").family(Families.gamma()).numeric("x").build(), t);
        assertTrue(pois.converged(), pois.warnings().toString());
        assertTrue(gam.converged(), gam.warnings().toString());
        double[] mp = pois.fittedValues();
        double[] mg = gam.fittedValues();
        double[] tp = new double[n];
        double[] tg = new double[n];
        for (int i = 0; i < n; i++) {
            assertTrue(mp[i] > 0 && mg[i] > 0);
            tp[i] = (counts[i] - mp[i]) / mp[i];        // identity link: dmu/deta = 1, V = mu
            tg[i] = -(sizes[i] - mg[i]) / (mg[i] * mg[i]) * mg[i] * mg[i]; // inverse link: dmu/deta = -mu^2
        }
        assertTrue(maxRelativeScore(pois.modelMatrix(t), tp) < 1e-9);
        assertTrue(maxRelativeScore(gam.modelMatrix(t), tg) < 1e-9);
    }

    @Test
    void poissonWithManyZerosAndExposuresOverSixOrdersOfMagnitude() {
        Random rnd = new Random(7);
        int n = 400;
        double[] exposure = new double[n];
        double[] age = new double[n];
        String[] region = new String[n];
        double[] claims = new double[n];
        int zeros = 0;
        for (int i = 0; i < n; i++) {
            exposure[i] = Math.pow(10, -3 + 6 * rnd.nextDouble());
            age[i] = rnd.nextDouble() * 3 - 1.5;
            int r = rnd.nextInt(3);
            region[i] = Portfolios.REGIONS[r];
            claims[i] = Portfolios.poisson(rnd, Math.min(1e4, exposure[i] * Math.exp(-4 + 0.5 * age[i] + 0.4 * r)));
            zeros += claims[i] == 0 ? 1 : 0;
        }
        assertTrue(zeros > n / 2, "most rows have no claim");
        Table t = Table.builder().numeric("exposure", exposure).numeric("age", age).categorical("region", region)
                .numeric("claims", claims).build();
        FittedModel fit = Glm.fit(ModelSpec.builder("claims").family(Families.poisson()).factor("region", "North")
                .numeric("age").logOffset("exposure").build(), t);
        assertTrue(fit.converged(), fit.warnings().toString());
        double[] mu = fit.fittedValues();
        double[] terms = new double[n];
        for (int i = 0; i < n; i++) {
            terms[i] = claims[i] - mu[i];
        }
        double[][] xm = fit.modelMatrix(t);
        assertTrue(maxRelativeScore(xm, terms) < 1e-9);
        ToDoubleFunction<double[]> ll = b -> {
            double s = 0;
            for (int i = 0; i < n; i++) {
                double eta = Math.log(exposure[i]);
                for (int j = 0; j < b.length; j++) {
                    eta += xm[i][j] * b[j];
                }
                s += new PoissonDistribution(Math.exp(eta)).logProbability((int) claims[i]);
            }
            return s;
        };
        double[] b = IndependentMaximiser.maximise(ll, new double[] {-3, 0, 0, 0}, 0.5);
        assertAgree(fit.coefficients(), b, 1e-6, "poisson");
    }

    @Test
    void inverseGaussianWithCanonicalAndLogLinks() {
        Random rnd = new Random(3);
        int n = 80;
        double[] x = new double[n];
        double[] y = new double[n];
        double lambda = 4.0;
        for (int i = 0; i < n; i++) {
            x[i] = rnd.nextDouble();
            double m = Math.exp(0.5 + 0.8 * x[i]);
            // Michael, Schucany and Haas (1976) transformation
            double v = rnd.nextGaussian();
            double yy = v * v;
            double c = m + m * m * yy / (2 * lambda)
                    - m / (2 * lambda) * Math.sqrt(4 * m * lambda * yy + m * m * yy * yy);
            y[i] = rnd.nextDouble() <= m / (m + c) ? c : m * m / c;
        }
        Table t = Table.builder().numeric("x", x).numeric("y", y).build();
        for (String linkName : new String[] {"inverse-squared", "log"}) {
            FittedModel fit = Glm.fit(ModelSpec.builder("y").family(Families.inverseGaussian())
                    .link(Links.byName(linkName)).numeric("x").build(), t);
            assertTrue(fit.converged(), linkName + " " + fit.warnings());
            double[] mu = fit.fittedValues();
            double[] eta = fit.linearPredictor();
            double[] terms = new double[n];
            for (int i = 0; i < n; i++) {
                // (y - mu) / V(mu) * dmu/deta, V = mu^3
                double dmu = linkName.equals("log") ? mu[i] : -0.5 * Math.pow(eta[i], -1.5);
                terms[i] = (y[i] - mu[i]) / Math.pow(mu[i], 3) * dmu;
            }
            assertTrue(maxRelativeScore(fit.modelMatrix(t), terms) < 1e-9, linkName);
            // inverse Gaussian log-density written out (Commons Math has none); lambda does not
            // move the estimates
            boolean log = linkName.equals("log");
            ToDoubleFunction<double[]> ll = b -> {
                double s = 0;
                for (int i = 0; i < n; i++) {
                    double e = b[0] + b[1] * (x[i] - 0.5);
                    if (!log && !(e > 0)) {
                        return Double.NEGATIVE_INFINITY;
                    }
                    double m = log ? Math.exp(e) : 1 / Math.sqrt(e);
                    s += 0.5 * Math.log(lambda / (2 * Math.PI * y[i] * y[i] * y[i]))
                            - lambda * (y[i] - m) * (y[i] - m) / (2 * m * m * y[i]);
                }
                return s;
            };
            double[] b = IndependentMaximiser.maximise(ll, log ? new double[] {0.9, 0} : new double[] {0.2, 0}, 0.1);
            assertAgree(fit.coefficients(), new double[] {b[0] - 0.5 * b[1], b[1]}, 1e-6, linkName);
        }
    }

    @Test
    void separatedBinomialDataGiveAWarningNotAnException() {
        double[] x = {-5, -4, -3, -2, -1, 0, 0, 1, 2, 3, 4, 5};
        double[] quasi = {0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1};
        double[] complete = {0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1};
        for (double[] y : new double[][] {quasi, complete}) {
            Table t = Table.builder().numeric("x", x).numeric("y", y).build();
            FittedModel fit = Glm.fit(ModelSpec.builder("y").family(Families.binomial()).numeric("x").build(), t);
            assertTrue(fit.warnings().stream().anyMatch(w -> w.contains("numerically 0 or 1")), fit.warnings().toString());
            assertFalse(Double.isNaN(fit.deviance()));
            assertTrue(fit.toString().contains("warning"));
        }
    }
}
