package dev.reweigh.families;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * Integral of a smooth function over a short interval [a, b], for differences A(y) - A(mu) of
 * Anscombe transforms when y is close to mu: the difference of two nearly equal values would lose
 * digits, the integral over [mu, y] does not. Callers use it only when the interval's half-width is
 * at most a twentieth of its distance from the integrand's singularity, where 8-point
 * Gauss-Legendre quadrature is exact to double precision.
 */
final class NearbyIntegral {
    private static final double[] NODES = new double[8];
    private static final double[] WEIGHTS = new double[8];

    static {
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(8);
        for (int i = 0; i < 8; i++) {
            NODES[i] = rule.getPoint(i);
            WEIGHTS[i] = rule.getWeight(i);
        }
    }

    private NearbyIntegral() {
    }

    /** Signed integral from a to b. */
    static double integrate(DoubleUnaryOperator f, double a, double b) {
        if (a == b) {
            return 0.0;
        }
        // Applied by hand rather than through the Commons Math integrator, which rejects intervals
        // so short that neighbouring nodes coincide in floating point.
        double half = 0.5 * (b - a);
        double middle = 0.5 * (a + b);
        double sum = 0.0;
        for (int i = 0; i < NODES.length; i++) {
            sum += WEIGHTS[i] * f.applyAsDouble(middle + half * NODES[i]);
        }
        return half * sum;
    }
}
