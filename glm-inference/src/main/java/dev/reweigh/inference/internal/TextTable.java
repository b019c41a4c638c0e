package dev.reweigh.inference.internal;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A plain text table: a title line, column titles in words, text columns left-aligned and number
 * columns right-aligned, separated by two spaces. Used by the toString methods.
 */
public final class TextTable {
    private final List<String> titles;
    private final boolean[] numeric;
    private final List<String[]> rows = new ArrayList<>();

    private TextTable(List<String> titles, boolean[] numeric) {
        this.titles = titles;
        this.numeric = numeric;
    }

    /**
     * Starts a table; the first column is text, the others are numbers.
     *
     * @param titles the column titles
     * @return the table
     */
    public static TextTable withTitles(String... titles) {
        boolean[] numeric = new boolean[titles.length];
        for (int i = 1; i < titles.length; i++) {
            numeric[i] = true;
        }
        return new TextTable(List.of(titles), numeric);
    }

    /**
     * Adds a row of cells, already formatted.
     *
     * @param cells one per column
     * @return this table
     */
    public TextTable row(String... cells) {
        if (cells.length != titles.size()) {
            throw new IllegalArgumentException("expected " + titles.size() + " cells, got " + cells.length);
        }
        rows.add(cells.clone());
        return this;
    }

    /**
     * Renders the table.
     *
     * @return the lines joined by newlines, ending with a newline
     */
    public String render() {
        int[] width = new int[titles.size()];
        for (int c = 0; c < width.length; c++) {
            width[c] = titles.get(c).length();
            for (String[] r : rows) {
                width[c] = Math.max(width[c], r[c].length());
            }
        }
        StringBuilder sb = new StringBuilder();
        appendLine(sb, titles.toArray(new String[0]), width);
        for (String[] r : rows) {
            appendLine(sb, r, width);
        }
        return sb.toString();
    }

    private void appendLine(StringBuilder sb, String[] cells, int[] width) {
        StringBuilder line = new StringBuilder();
        for (int c = 0; c < cells.length; c++) {
            if (c > 0) {
                line.append("  ");
            }
            String cell = cells[c];
            int pad = width[c] - cell.length();
            if (numeric[c]) {
                line.append(" ".repeat(pad)).append(cell);
            } else {
                line.append(cell).append(" ".repeat(pad));
            }
        }
        sb.append(line.toString().stripTrailing()).append('\n');
    }

    /**
     * Formats a number with about five significant digits, switching to scientific notation for
     * very large or very small magnitudes; NaN becomes an empty cell's dash.
     *
     * @param x the number
     * @return the text
     */
    public static String number(double x) {
        if (Double.isNaN(x)) {
            return "-";
        }
        if (Double.isInfinite(x)) {
            return x > 0 ? "inf" : "-inf";
        }
        double a = Math.abs(x);
        if (a != 0 && (a >= 1e7 || a < 1e-4)) {
            return String.format(Locale.ROOT, "%.4e", x);
        }
        if (a >= 1e4) {
            return String.format(Locale.ROOT, "%.1f", x);
        }
        String s = String.format(Locale.ROOT, "%.5g", x);
        if (s.contains(".") && !s.contains("e")) {
            s = s.replaceAll("0+$", "");
            if (s.endsWith(".")) {
                s = s + "0";
            }
        }
        return s;
    }

    /**
     * Formats a probability: four decimals, or scientific notation below 0.0001.
     *
     * @param p the probability
     * @return the text
     */
    public static String probability(double p) {
        if (Double.isNaN(p)) {
            return "-";
        }
        if (p < 1e-4) {
            return p == 0 ? "< 1e-300" : String.format(Locale.ROOT, "%.1e", p);
        }
        return String.format(Locale.ROOT, "%.4f", p);
    }

    /**
     * Formats a confidence level as a percentage, e.g. 0.95 as "95%".
     *
     * @param level the level
     * @return the text
     */
    public static String percent(double level) {
        double pct = level * 100;
        if (Math.abs(pct - Math.rint(pct)) < 1e-9) {
            return (long) Math.rint(pct) + "%";
        }
        return String.format(Locale.ROOT, "%.1f%%", pct);
    }
}
