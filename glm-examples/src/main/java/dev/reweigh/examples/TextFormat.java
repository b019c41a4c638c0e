package dev.reweigh.examples;

import java.util.Locale;

/**
 * Number formatting shared by the text reports: fixed significant digits, locale-independent,
 * "-" for a quantity that does not exist.
 */
final class TextFormat {
    private TextFormat() {
    }

    /** Formats with about 6 significant digits; NaN as "-". */
    static String num(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        double a = Math.abs(v);
        if (a != 0 && (a >= 1e7 || a < 1e-4)) {
            return String.format(Locale.ROOT, "%.4e", v);
        }
        String s = String.format(Locale.ROOT, "%.6g", v);
        if (s.contains(".") && !s.contains("e")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }

    /** Formats with a fixed number of decimals. */
    static String fixed(double v, int decimals) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    /** Formats a p-value: small values in scientific notation. */
    static String p(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        if (v < 1e-16) {
            return "<1e-16"; // beyond what double-precision tail areas resolve in this report
        }
        return v < 1e-4 ? String.format(Locale.ROOT, "%.1e", v) : String.format(Locale.ROOT, "%.4f", v);
    }

    /** Pads on the right to a width. */
    static String left(String s, int width) {
        return s.length() >= width ? s : s + " ".repeat(width - s.length());
    }

    /** Pads on the left to a width. */
    static String right(String s, int width) {
        return s.length() >= width ? s : " ".repeat(width - s.length()) + s;
    }
}
