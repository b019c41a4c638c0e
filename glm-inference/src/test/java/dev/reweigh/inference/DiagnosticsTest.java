package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import org.junit.jupiter.api.Test;

class DiagnosticsTest {

    @Test
    void leveragesSumToTheRank() {
        FittedModel ships = ReferenceDataTest.shipsMainEffects();
        assertEquals(ships.rank(), TestData.sum(Inference.of(ships).diagnostics().leverage()), 1e-9);
        FittedModel beetles = ReferenceDataTest.beetles(Links.cloglog());
        assertEquals(beetles.rank(), TestData.sum(Inference.of(beetles).diagnostics().leverage()), 1e-9);
        FittedModel weighted = Glm.fit(TestData.vehicleAndAge("severity", Families.gamma()).link(Links.log())
                .weights("claims").build(), TestData.weightedGammaSeverities(120, 2.0, 81));
        double[] h = Inference.of(weighted).diagnostics().leverage();
        assertEquals(weighted.rank(), TestData.sum(h), 1e-9);
        for (double v : h) {
            assertTrue(v >= 0 && v <= 1);
        }
    }

    @Test
    void cooksDistanceEqualsItsLeaveOneOutDefinitionForALinearModel() {
        // Cook's distance by definition: D_i = (b - b_(i))' X'X (b - b_(i)) / (p s^2), with b_(i) the fit without
        // row i, computed here by brute-force refits (common practice, no source)
        Table t = TestData.gaussianSeverities(25, 150, 91);
        ModelSpec spec = TestData.vehicleAndAge("severity", Families.gaussian()).build();
        FittedModel fit = Glm.fit(spec, t);
        Inference inference = Inference.of(fit);
        double[] cooks = inference.diagnostics().cooksDistance();
        double s2 = inference.dispersion().value();
        int n = fit.rowCount();
        int p = fit.rank();
        double[] b = fit.coefficients();
        double[][] x = new double[n][p];
        for (int i = 0; i < n; i++) {
            fit.modelMatrixRow(i, x[i]);
        }
        for (int drop = 0; drop < n; drop++) {
            int[] keep = new int[n - 1];
            for (int i = 0, k = 0; i < n; i++) {
                if (i != drop) {
                    keep[k++] = i;
                }
            }
            double[] bi = Glm.fit(spec, t.select(keep)).coefficients();
            double q = 0;
            for (int i = 0; i < n; i++) {
                double xd = 0;
                for (int j = 0; j < p; j++) {
                    xd += x[i][j] * (b[j] - bi[j]);
                }
                q += xd * xd;
            }
            assertEquals(q / (p * s2), cooks[drop], 1e-7 * (1 + cooks[drop]), "row " + drop);
        }
    }

    @Test
    void mostInfluentialRowsComeFirst() {
        Diagnostics d = Inference.of(ReferenceDataTest.shipsMainEffects()).diagnostics();
        int[] top = d.mostInfluential(3);
        double[] cooks = d.cooksDistance();
        assertTrue(cooks[top[0]] >= cooks[top[1]] && cooks[top[1]] >= cooks[top[2]]);
        for (double c : cooks) {
            assertTrue(c <= cooks[top[0]]);
        }
    }
}
