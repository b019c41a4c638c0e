package dev.reweigh.core;

import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SmokeTest {
    @Test
    void beetleLogit() {
        Table t = Table.builder()
                .numeric("dose", 1.6907, 1.7242, 1.7552, 1.7842, 1.8113, 1.8369, 1.8610, 1.8839)
                .numeric("n", 59, 60, 62, 56, 63, 59, 62, 60)
                .numeric("killed", 6, 13, 18, 28, 52, 53, 61, 60)
                .build();
        ModelSpec s = ModelSpec.builder("killed").trials("n").family(Families.binomial()).numeric("dose").build();
        FittedModel f = Glm.fit(s, t);
        System.out.println(f);
        // Dobson & Barnett (2008), Table 7.2 / Section 7.3 (from memory): -60.72 + 34.27 x, deviance 11.23
        assertEquals(-60.72, f.coefficient("intercept"), 0.005);
        assertEquals(34.27, f.coefficient("dose"), 0.005);
        assertEquals(11.23, f.deviance(), 0.005);
        assertTrue(f.converged());
        FittedModel c = Glm.fit(s.withLink(Links.cloglog()), t, FitOptions.builder().solver(Solver.CHOLESKY).build());
        System.out.println(c);
    }
}
