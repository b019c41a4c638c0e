package dev.reweigh.core;

import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class FitBehaviourTest {
    private static final Table MOTOR = Portfolios.motor(2024, 300);
    private static final ModelSpec FREQUENCY = ModelSpec.builder("claims").family(Families.poisson())
            .factor("region").numeric("age").logOffset("exposure").build();

    @Test
    void theListenerSeesEveryIterationAndTheDevianceFalls() {
        List<IterationEvent> events = new ArrayList<>();
        FittedModel fit = Glm.fit(FREQUENCY, MOTOR, FitOptions.builder().listener(events::add).build());
        assertEquals(fit.iterations(), events.size());
        for (int k = 1; k < events.size(); k++) {
            assertEquals(k + 1, events.get(k).iteration());
            assertTrue(events.get(k).deviance() <= events.get(k - 1).deviance() * (1 + 1e-12));
            assertTrue(events.get(k).elapsedNanos() >= events.get(k - 1).elapsedNanos());
        }
        assertEquals(fit.deviance(), events.get(events.size() - 1).deviance(), 1e-9 * fit.deviance());
    }

    @Test
    void anInterruptedThreadStopsTheFit() {
        Thread.currentThread().interrupt();
        try {
            assertThrows(FitInterruptedException.class, () -> Glm.fit(FREQUENCY, MOTOR));
            assertTrue(Thread.interrupted(), "the interrupt status is kept");
        } finally {
            Thread.interrupted();
        }
    }

    @Test
    void bothSolverRoutesAgree() {
        FittedModel qr = Glm.fit(FREQUENCY, MOTOR, FitOptions.builder().solver(Solver.PIVOTED_QR).build());
        FittedModel chol = Glm.fit(FREQUENCY, MOTOR, FitOptions.builder().solver(Solver.CHOLESKY).build());
        assertEquals("pivoted QR", qr.solverRoute());
        assertEquals("Cholesky", chol.solverRoute());
        for (int j = 0; j < qr.columnCount(); j++) {
            assertEquals(qr.coefficients()[j], chol.coefficients()[j], 1e-9 * Math.max(1, Math.abs(qr.coefficients()[j])));
            assertEquals(qr.unscaledCovariance()[j][j], chol.unscaledCovariance()[j][j], 1e-8 * qr.unscaledCovariance()[j][j]);
        }
    }

    @Test
    void startingValuesFromTheCallerReachTheSameFit() {
        FittedModel a = Glm.fit(FREQUENCY, MOTOR);
        double[] start = new double[a.columnCount()];
        start[0] = -1;
        FittedModel b = Glm.fit(FREQUENCY, MOTOR, FitOptions.builder().startCoefficients(start).build());
        double[] means = new double[a.rowCount()];
        java.util.Arrays.fill(means, 0.3);
        FittedModel c = Glm.fit(FREQUENCY, MOTOR, FitOptions.builder().startMeans(means).build());
        for (int j = 0; j < a.columnCount(); j++) {
            assertEquals(a.coefficients()[j], b.coefficients()[j], 1e-8);
            assertEquals(a.coefficients()[j], c.coefficients()[j], 1e-8);
        }
        // a non-canonical link (Newton steps) from caller's coefficients
        ModelSpec severity = ModelSpec.builder("severity").family(Families.gamma()).link(Links.log()).factor("region")
                .numeric("age").build();
        FittedModel s = Glm.fit(severity, MOTOR);
        double[] s0 = new double[s.columnCount()];
        s0[0] = 7;
        FittedModel s2 = Glm.fit(severity, MOTOR, FitOptions.builder().startCoefficients(s0).build());
        for (int j = 0; j < s.columnCount(); j++) {
            assertEquals(s.coefficients()[j], s2.coefficients()[j], 1e-8);
        }
    }

    @Test
    void theNullDevianceIsAFittedInterceptOnlyModel() {
        FittedModel fit = Glm.fit(FREQUENCY, MOTOR);
        FittedModel interceptOnly = fit.refit(FREQUENCY.withTerms(List.of()));
        assertEquals(interceptOnly.deviance(), fit.nullDeviance(), 1e-9 * interceptOnly.deviance());
        assertEquals(MOTOR.rowCount() - 1, fit.nullDf());
        assertEquals(interceptOnly.residualDf(), fit.nullDf());
        // without an intercept the null model is mean = g^-1(offset)
        FittedModel noIntercept = fit.refit(FREQUENCY.toBuilder().intercept(false).build());
        double[] y = MOTOR.numeric("claims");
        double[] e = MOTOR.numeric("exposure");
        double d = 0;
        for (int i = 0; i < y.length; i++) {
            d += 2 * ((y[i] > 0 ? y[i] * Math.log(y[i] / e[i]) : 0) - (y[i] - e[i]));
        }
        assertEquals(d, noIntercept.nullDeviance(), 1e-9 * d);
        assertEquals(MOTOR.rowCount(), noIntercept.nullDf());
    }

    @Test
    void holdingACoefficientFixedMovesItIntoTheOffset() {
        FittedModel fit = Glm.fit(FREQUENCY, MOTOR);
        double age = fit.coefficient("age");
        FittedModel atEstimate = fit.refitWithFixed("age", age);
        assertEquals(fit.deviance(), atEstimate.deviance(), 1e-9 * fit.deviance());
        assertEquals(fit.residualDf() + 1, atEstimate.residualDf());
        assertEquals(List.of("age"), atEstimate.fixedColumns());
        assertEquals(age, atEstimate.coefficient("age"));
        FittedModel moved = fit.refitWithFixed("age", age + 0.01);
        assertTrue(moved.deviance() > fit.deviance());
        assertEquals(age + 0.01, moved.coefficient("age"));
        // the same as an explicit offset of 0.01 more per year of age, fitted without age
        double[] a = MOTOR.numeric("age");
        double[] off = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            off[i] = (age + 0.01) * a[i];
        }
        Table withOffset = Table.builder().numeric("age", a).categorical("region", MOTOR.levels("region"),
                InvariancePropertyTest.texts(MOTOR, "region")).numeric("exposure", MOTOR.numeric("exposure"))
                .numeric("claims", MOTOR.numeric("claims")).numeric("off", off).build();
        FittedModel explicit = Glm.fit(FREQUENCY.withoutTerm("age").withOffset("off"), withOffset);
        assertEquals(explicit.deviance(), moved.deviance(), 1e-9 * explicit.deviance());
        assertEquals(explicit.coefficient("intercept"), moved.coefficient("intercept"), 1e-8);
    }

    @Test
    void predictionReproducesTheFitAndUsesTheNewOffset() {
        FittedModel fit = Glm.fit(FREQUENCY, MOTOR);
        double[] mu = fit.predictMean(MOTOR);
        double[] fitted = fit.fittedValues();
        for (int i = 0; i < mu.length; i++) {
            assertEquals(fitted[i], mu[i], 1e-12 * fitted[i]);
        }
        Table one = Table.builder().numeric("age", 40).categorical("region", "South").numeric("exposure", 2.0).build();
        double expected = 2.0 * Math.exp(fit.coefficient("intercept") + fit.coefficient("region=South")
                + 40 * fit.coefficient("age"));
        assertEquals(expected, fit.predictMean(one)[0], 1e-12 * expected);
        assertEquals(Math.log(expected), fit.predictLink(one)[0], 1e-12);
        double[][] x = fit.modelMatrix(one);
        assertEquals(fit.columnCount(), x[0].length);
    }

    @Test
    void orthogonalPolynomialsAreOrthonormalAndPredictNewData() {
        ModelSpec spec = ModelSpec.builder("severity").family(Families.gamma()).link(Links.log())
                .polynomial("age", 3, true).build();
        FittedModel fit = Glm.fit(spec, MOTOR);
        double[][] x = fit.modelMatrix(MOTOR);
        for (int a = 1; a <= 3; a++) {
            for (int b = 0; b <= 3; b++) {
                double s = 0;
                for (double[] row : x) {
                    s += row[a] * row[b];
                }
                assertEquals(a == b ? 1.0 : 0.0, s, 1e-10, "columns " + a + "," + b);
            }
        }
        FittedModel raw = Glm.fit(ModelSpec.builder("severity").family(Families.gamma()).link(Links.log())
                .polynomial("age", 3, false).build(), MOTOR);
        assertEquals(raw.deviance(), fit.deviance(), 1e-9 * raw.deviance());
        Table newAges = Table.builder().numeric("age", 33, 71).build();
        assertArrayEquals(raw.predictMean(newAges), fit.predictMean(newAges), 1e-8 * raw.predictMean(newAges)[0]);
    }

    @Test
    void tweedieAndNegativeBinomialFitsSolveTheirScoreEquations() {
        double[] claims = MOTOR.numeric("claims");
        double[] severity = MOTOR.numeric("severity");
        double[] cost = new double[claims.length];
        for (int i = 0; i < cost.length; i++) {
            cost[i] = claims[i] * severity[i];
        }
        Table t = Table.builder().numeric("age", MOTOR.numeric("age"))
                .categorical("region", MOTOR.levels("region"), InvariancePropertyTest.texts(MOTOR, "region"))
                .numeric("exposure", MOTOR.numeric("exposure")).numeric("claims", claims).numeric("cost", cost).build();
        double p = 1.5;
        FittedModel tweedie = Glm.fit(ModelSpec.builder("cost").family(Families.tweedie(p)).link(Links.log()).factor("region")
                .numeric("age").logOffset("exposure").build(), t);
        FittedModel negbin = Glm.fit(FREQUENCY.withFamily(Families.negativeBinomial(2.0)), t);
        assertTrue(tweedie.converged(), tweedie.toString());
        assertTrue(negbin.converged(), negbin.toString());
        double[][] x = tweedie.modelMatrix(t);
        double[] mt = tweedie.fittedValues();
        double[] mn = negbin.fittedValues();
        for (int j = 0; j < x[0].length; j++) {
            double st = 0;
            double at = 0;
            double sn = 0;
            double an = 0;
            for (int i = 0; i < x.length; i++) {
                // log link: score = sum (y - mu) / V(mu) * mu * x
                double tt = (cost[i] - mt[i]) / Math.pow(mt[i], p) * mt[i] * x[i][j];
                double tn = (claims[i] - mn[i]) / (mn[i] + mn[i] * mn[i] / 2.0) * mn[i] * x[i][j];
                st += tt;
                at += Math.abs(tt);
                sn += tn;
                an += Math.abs(tn);
            }
            assertTrue(Math.abs(st) < 1e-9 * at, "tweedie score " + j);
            assertTrue(Math.abs(sn) < 1e-9 * an, "negative binomial score " + j);
        }
    }

    @Test
    void aLinkWhoseDomainTheOffsetCannotMeetFailsWithAMessage() {
        // the canonical Tweedie link needs eta > 0; log-exposures below 0 push every step out
        double[] claims = MOTOR.numeric("claims");
        Table t = Table.builder().numeric("age", MOTOR.numeric("age")).numeric("claims", claims)
                .numeric("exposure", MOTOR.numeric("exposure")).build();
        ModelSpec spec = ModelSpec.builder("claims").family(Families.tweedie(1.5)).numeric("age")
                .offset("exposure").build();
        try {
            FittedModel fit = Glm.fit(spec.toBuilder().offset("exposure").build(), t);
            // if a fit comes back it must be a real one
            assertFalse(Double.isNaN(fit.deviance()));
        } catch (dev.reweigh.families.ReweighException e) {
            assertTrue(e.getMessage().contains("domain"), e.getMessage());
        }
        double[] negative = new double[claims.length];
        java.util.Arrays.fill(negative, -50);
        Table bad = Table.builder().numeric("age", MOTOR.numeric("age")).numeric("claims", claims)
                .numeric("off", negative).build();
        dev.reweigh.families.ReweighException e = assertThrows(dev.reweigh.families.ReweighException.class,
                () -> Glm.fit(ModelSpec.builder("claims").family(Families.tweedie(1.5)).intercept(false)
                        .offset("off").build(), bad));
        assertTrue(e.getMessage().contains("domain"), e.getMessage());
    }

    @Test
    void theReportIsReadable() {
        FittedModel fit = Glm.fit(FREQUENCY, MOTOR);
        String s = fit.toString();
        assertTrue(s.contains("poisson family, log link"));
        assertTrue(s.contains("region=South") && s.contains("intercept") && s.contains("std error"));
        assertTrue(s.contains("dispersion used for standard errors: 1"));
        int[] codes = MOTOR.codes("region");
        int[] counts = new int[MOTOR.levels("region").size()];
        for (int c : codes) {
            counts[c]++;
        }
        int best = 0;
        for (int k = 1; k < counts.length; k++) {
            best = counts[k] > counts[best] ? k : best;
        }
        // the default reference level is the one with the largest total weight (here: most rows)
        String reference = "region=" + MOTOR.levels("region").get(best);
        assertTrue(s.contains("reference levels (no column): " + reference), s);
        assertFalse(s.contains("*"));
        assertTrue(fit.warnings().isEmpty());
        assertTrue(fit.converged());
    }
}
