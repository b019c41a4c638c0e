package dev.reweigh.inference.internal;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;

/**
 * Bracketing and Brent's method, wrapped so that callers say what they look for rather than how.
 */
public final class Roots {
    private static final int MAX_EVALUATIONS = 500;

    private Roots() {
    }

    /**
     * Walks from {@code start} in steps that double each time until {@code f} changes sign, then
     * solves f = 0 by Brent's method between the last two points.
     *
     * @param f a continuous function with f(start) of one sign
     * @param start the starting point
     * @param firstStep the first step, signed: its sign gives the direction
     * @param maxSteps how many doublings to try
     * @param tolerance absolute tolerance of the root
     * @return the root, or NaN when no sign change was found within the steps
     */
    public static double crossing(DoubleUnaryOperator f, double start, double firstStep, int maxSteps,
                                  double tolerance) {
        double a = start;
        double fa = f.applyAsDouble(a);
        double step = firstStep;
        for (int k = 0; k < maxSteps; k++) {
            double b = a + step;
            double fb = f.applyAsDouble(b);
            if (Double.isNaN(fb)) {
                step /= 2;
                continue;
            }
            if (fa == 0) {
                return a;
            }
            if (Math.signum(fa) != Math.signum(fb)) {
                return solve(f, Math.min(a, b), Math.max(a, b), tolerance);
            }
            a = b;
            fa = fb;
            step *= 2;
        }
        return Double.NaN;
    }

    /**
     * Solves f = 0 on an interval whose ends have opposite signs, by the Illinois variant of false
     * position. Where f is NaN (a refit that failed at that value) it tries nearby points instead.
     *
     * @param f the function
     * @param lower lower end
     * @param upper upper end
     * @param tolerance absolute tolerance
     * @return the root, or NaN when the ends do not bracket a root or no usable point is found
     */
    public static double solve(DoubleUnaryOperator f, double lower, double upper, double tolerance) {
        double a = lower;
        double b = upper;
        double fa = f.applyAsDouble(a);
        double fb = f.applyAsDouble(b);
        if (fa == 0) {
            return a;
        }
        if (fb == 0) {
            return b;
        }
        if (Double.isNaN(fa) || Double.isNaN(fb) || Math.signum(fa) == Math.signum(fb)) {
            return Double.NaN;
        }
        int side = 0;
        for (int k = 0; k < MAX_EVALUATIONS && Math.abs(b - a) > tolerance; k++) {
            double x = b - fb * (b - a) / (fb - fa);
            if (!(x > Math.min(a, b) && x < Math.max(a, b))) {
                x = (a + b) / 2;
            }
            double fx = f.applyAsDouble(x);
            if (Double.isNaN(fx)) {
                x = (a + b) / 2;
                fx = f.applyAsDouble(x);
                if (Double.isNaN(fx)) {
                    x = a + 0.3 * (b - a);
                    fx = f.applyAsDouble(x);
                    if (Double.isNaN(fx)) {
                        return Double.NaN;
                    }
                }
            }
            if (fx == 0) {
                return x;
            }
            if (Math.signum(fx) == Math.signum(fb)) {
                b = x;
                fb = fx;
                if (side == -1) {
                    fa /= 2;
                }
                side = -1;
            } else {
                a = x;
                fa = fx;
                if (side == 1) {
                    fb /= 2;
                }
                side = 1;
            }
        }
        return Math.abs(fa) < Math.abs(fb) ? a : b;
    }

    /**
     * Maximises f on an interval by Brent's method (golden section with parabolic steps).
     *
     * @param f the function, unimodal on the interval
     * @param lower lower end
     * @param upper upper end
     * @param start a point inside the interval
     * @param absoluteTolerance how precisely the maximiser is wanted
     * @return the maximiser and the maximum as {point, value}
     */
    public static double[] maximise(DoubleUnaryOperator f, double lower, double upper, double start,
                                    double absoluteTolerance) {
        BrentOptimizer optimizer = new BrentOptimizer(1e-10, absoluteTolerance);
        UnivariatePointValuePair best = optimizer.optimize(new MaxEval(MAX_EVALUATIONS),
                new UnivariateObjectiveFunction(f::applyAsDouble), GoalType.MAXIMIZE,
                new SearchInterval(lower, upper, Math.min(Math.max(start, lower), upper)));
        return new double[] {best.getPoint(), best.getValue()};
    }

    /**
     * Maximises a function of a positive parameter on the log scale, first bracketing the
     * maximum by walking outwards from a starting value.
     *
     * @param f the function of the (positive) parameter
     * @param start a positive starting value
     * @param minimum the smallest parameter allowed
     * @param maximum the largest parameter allowed
     * @return {argmax, max}
     */
    public static double[] maximisePositive(DoubleUnaryOperator f, double start, double minimum, double maximum) {
        DoubleUnaryOperator g = t -> {
            double v = f.applyAsDouble(Math.exp(t));
            return Double.isNaN(v) ? Double.NEGATIVE_INFINITY : v;
        };
        double logMin = Math.log(minimum);
        double logMax = Math.log(maximum);
        double centre = Math.min(Math.max(Math.log(start), logMin), logMax);
        double lo = centre;
        double hi = centre;
        double fc = g.applyAsDouble(centre);
        double step = 0.5;
        // walk down while the function keeps rising
        double flo = fc;
        while (lo > logMin) {
            double next = Math.max(lo - step, logMin);
            double fn = g.applyAsDouble(next);
            lo = next;
            if (fn < flo) {
                break;
            }
            flo = fn;
            step *= 2;
        }
        step = 0.5;
        double fhi = fc;
        while (hi < logMax) {
            double next = Math.min(hi + step, logMax);
            double fn = g.applyAsDouble(next);
            hi = next;
            if (fn < fhi) {
                break;
            }
            fhi = fn;
            step *= 2;
        }
        // 1e-8 on the log scale: the parameter to eight significant digits
        double[] best = maximise(g, lo, hi, centre, 1e-8);
        return new double[] {Math.exp(best[0]), best[1]};
    }
}
