package dev.reweigh.families;

/**
 * Unit deviance and Anscombe residual of the power variance functions V(mu) = mu^p, shared by the
 * Gaussian, Poisson, Gamma, inverse Gaussian, Tweedie and quasi power families.
 */
final class PowerVariance {
    private PowerVariance() {
    }

    /**
     * Unit deviance of V(mu) = mu^p: 2 [y^(2-p)/((1-p)(2-p)) - y mu^(1-p)/(1-p) + mu^(2-p)/(2-p)]
     * with the limits at p = 1 and p = 2. Near y = mu the bracket cancels to O((y-mu)^2), so it is
     * evaluated as 2 mu^(2-p) h(log(y/mu)) where h(u) = sum over k &gt;= 2 of
     * (1 + b + ... + b^(k-2)) u^k / k!, b = 2 - p, a series with no cancellation for small u.
     * Farther out h(u) = (expm1(b u)/b - expm1(u)) / (b - 1), which loses about log10(1/|p - 1|)
     * digits as p approaches 1 (3 digits at p = 1.001); p = 1 itself has its own exact form.
     */
    static double unitDeviance(double y, double mu, double p) {
        if (p == 0.0) {
            double r = y - mu;
            return r * r;
        }
        if (p == 1.0) {
            return 2.0 * ProbabilityMath.bd0(y, mu);
        }
        if (p == 2.0) {
            return 2.0 * ProbabilityMath.bd0(mu, y) / mu;
        }
        if (p == 3.0) {
            double r = y - mu;
            return r * r / (y * mu * mu);
        }
        double b = 2.0 - p;
        if (y == 0.0) {
            // Only reached for p < 2, where y^(2-p) vanishes.
            return 2.0 * Math.pow(mu, b) / b;
        }
        double u = logRatio(y, mu);
        double h;
        if (Math.abs(u) * Math.max(1.0, Math.abs(b)) < 1.0) {
            h = smallLogRatioSeries(u, b);
        } else {
            h = (Math.expm1(b * u) / b - Math.expm1(u)) / (b - 1.0);
        }
        return Math.max(0.0, 2.0 * Math.pow(mu, b) * h);
    }

    /**
     * log(y / mu) for y, mu &gt; 0: through log1p of the exact difference when y is within a factor
     * of two of mu (where y / mu would lose the digits of a small logarithm), through the ratio
     * otherwise (where (y - mu) / mu would round to -1 for a tiny y and lose log y altogether).
     */
    static double logRatio(double y, double mu) {
        double relative = (y - mu) / mu;
        if (relative > -0.5 && relative < 1.0) {
            return Math.log1p(relative);
        }
        double ratio = y / mu;
        if (ratio > 0 && ratio < Double.POSITIVE_INFINITY) {
            return Math.log(ratio);
        }
        return Math.log(y) - Math.log(mu);
    }

    private static double smallLogRatioSeries(double u, double b) {
        double power = u * u / 2.0;   // u^k / k!
        double coefficient = 1.0;     // 1 + b + ... + b^(k-2)
        double bPower = 1.0;          // b^(k-2)
        double sum = power;
        for (int k = 3; k < 80; k++) {
            power *= u / k;
            bPower *= b;
            coefficient += bPower;
            double term = coefficient * power;
            double next = sum + term;
            if (next == sum) {
                break;
            }
            sum = next;
        }
        return sum;
    }

    /**
     * Anscombe residual of V(mu) = mu^p at unit weight and dispersion: with A'(mu) = mu^(-p/3),
     * (y^c - mu^c) / (c mu^(p/6)) where c = 1 - p/3, and log(y/mu) / sqrt(mu) at p = 3. The
     * difference y^c - mu^c is written as mu^c expm1(c log1p((y - mu)/mu)), which keeps its digits
     * when y is close to mu.
     */
    static double anscombeResidual(double y, double mu, double p) {
        if (p == 0.0) {
            return y - mu;
        }
        double logRatio = logRatio(y, mu);
        if (p == 3.0) {
            return logRatio / Math.sqrt(mu);
        }
        double c = 1.0 - p / 3.0;
        double difference = y == 0.0 ? -Math.pow(mu, c) : Math.pow(mu, c) * Math.expm1(c * logRatio);
        return difference / (c * Math.pow(mu, p / 6.0));
    }
}
