package dev.reweigh.families;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.regex.Pattern;

/**
 * Text form of the numeric parameters in family and link names. Java 17's Double.toString does
 * not always give the shortest digits that read back to the same double, so names would not be
 * canonical; this writes the fewest significant digits that round-trip.
 */
final class DoubleText {
    /** Plain decimal numbers only: no NaN, no infinities, no hexadecimal, no type suffixes. */
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");

    private DoubleText() {
    }

    /**
     * Shortest round-trip text: plain notation with at least one fractional digit for magnitudes
     * in [1e-3, 1e7) (as "1.5", "2.0", "-0.5"), otherwise "d.dddE-n".
     */
    static String format(double x) {
        if (!Double.isFinite(x)) {
            return Double.toString(x);
        }
        if (x == 0.0) {
            return (1.0 / x < 0) ? "-0.0" : "0.0";
        }
        // Double.toString reads back exactly and is at most a digit or so too long; try fewer digits.
        BigDecimal exact = new BigDecimal(x);
        BigDecimal shortest = new BigDecimal(Double.toString(x));
        for (int digits = shortest.stripTrailingZeros().precision() - 1; digits >= 1; digits--) {
            BigDecimal candidate = exact.round(new MathContext(digits, RoundingMode.HALF_EVEN));
            if (candidate.doubleValue() == x) {
                shortest = candidate;
            }
        }
        shortest = shortest.stripTrailingZeros();
        double magnitude = Math.abs(x);
        if (magnitude >= 1e-3 && magnitude < 1e7) {
            String plain = shortest.toPlainString();
            return plain.contains(".") ? plain : plain + ".0";
        }
        String unscaled = shortest.unscaledValue().abs().toString();
        int exponent = unscaled.length() - 1 - shortest.scale();
        String mantissa = unscaled.substring(0, 1) + "." + (unscaled.length() > 1 ? unscaled.substring(1) : "0");
        return (x < 0 ? "-" : "") + mantissa + "E" + exponent;
    }

    /** Parses a plain decimal number, or returns NaN when the text is not one. */
    static double parse(String text) {
        String t = text.trim();
        if (!DECIMAL.matcher(t).matches()) {
            return Double.NaN;
        }
        return Double.parseDouble(t);
    }
}
