package dev.reweigh.core.internal;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Numbers as error messages show them: the fewest significant digits that read back to the same
 * double, without a trailing ".0" on whole numbers, so a cell holding -1 is reported as "-1".
 * Java 17's {@code Double.toString} always writes a fractional digit and is sometimes a digit
 * longer than needed.
 */
public final class NumberText {
    private NumberText() {
    }

    /**
     * Shortest round-trip text of a double: plain notation for magnitudes in [1e-3, 1e7) ("-1",
     * "0.25", "1234567"), otherwise a mantissa and a power of ten ("1.5E-7", "2E9"); "NaN",
     * "Infinity", "-Infinity" and "-0" as they are. {@code Double.parseDouble} reads every result
     * back to the same value.
     *
     * @param x any double
     * @return the text
     */
    public static String of(double x) {
        if (!Double.isFinite(x)) {
            return Double.toString(x);
        }
        if (x == 0.0) {
            return 1.0 / x < 0 ? "-0" : "0";
        }
        BigDecimal exact = new BigDecimal(x);
        BigDecimal shortest = new BigDecimal(Double.toString(x)).stripTrailingZeros();
        // Double.toString reads back exactly but may carry a digit too many: try fewer digits
        for (int digits = shortest.precision() - 1; digits >= 1; digits--) {
            BigDecimal candidate = exact.round(new MathContext(digits, RoundingMode.HALF_EVEN));
            if (candidate.doubleValue() == x) {
                shortest = candidate.stripTrailingZeros();
            }
        }
        double magnitude = Math.abs(x);
        if (magnitude >= 1e-3 && magnitude < 1e7) {
            return shortest.toPlainString();
        }
        String digits = shortest.unscaledValue().abs().toString();
        int exponent = digits.length() - 1 - shortest.scale();
        String mantissa = digits.length() == 1 ? digits : digits.charAt(0) + "." + digits.substring(1);
        return (x < 0 ? "-" : "") + mantissa + "E" + exponent;
    }
}
