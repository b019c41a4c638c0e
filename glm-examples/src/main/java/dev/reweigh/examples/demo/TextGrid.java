package dev.reweigh.examples.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A small aligned text table for the demo's printout: first column left-aligned, the others
 * right-aligned, two spaces between columns.
 */
final class TextGrid {
    private final List<String[]> rows = new ArrayList<>();
    private final int width;

    TextGrid(String... headings) {
        this.width = headings.length;
        rows.add(headings);
    }

    TextGrid row(String... cells) {
        if (cells.length != width) {
            throw new IllegalArgumentException("expected " + width + " cells, got " + cells.length);
        }
        rows.add(cells);
        return this;
    }

    String render(String indent) {
        int[] w = new int[width];
        for (String[] r : rows) {
            for (int c = 0; c < width; c++) {
                w[c] = Math.max(w[c], r[c].length());
            }
        }
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < rows.size(); i++) {
            String[] r = rows.get(i);
            StringBuilder line = new StringBuilder(indent);
            for (int c = 0; c < width; c++) {
                if (c > 0) {
                    line.append("  ");
                }
                String cell = r[c];
                String pad = " ".repeat(w[c] - cell.length());
                line.append(c == 0 ? cell + pad : pad + cell);
            }
            sb.append(line.toString().stripTrailing()).append('\n');
            if (i == 0) {
                int total = 0;
                for (int c = 0; c < width; c++) {
                    total += w[c] + (c > 0 ? 2 : 0);
                }
                sb.append(indent).append("-".repeat(total)).append('\n');
            }
        }
        return sb.toString();
    }

    /** About 4 significant digits, locale-independent; NaN as "-". */
    static String num(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        double a = Math.abs(v);
        if (a >= 1e6 || (a != 0 && a < 1e-3)) {
            return String.format(Locale.ROOT, "%.3e", v);
        }
        if (a >= 1000) {
            return String.format(Locale.ROOT, "%.1f", v);
        }
        return String.format(Locale.ROOT, "%.4g", v);
    }

    /** A fixed number of decimals. */
    static String fixed(double v, int decimals) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    /** A p-value. */
    static String p(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        return v < 1e-4 ? String.format(Locale.ROOT, "%.1e", v) : String.format(Locale.ROOT, "%.4f", v);
    }
}
