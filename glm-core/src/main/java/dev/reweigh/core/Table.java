package dev.reweigh.core;

import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.ReweighException;
import dev.reweigh.families.UnknownNameException;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeSet;

/**
 * An immutable, column-oriented table of data: numeric columns (doubles, NaN for missing) and
 * categorical columns (text levels stored as integer codes into a level list, null for missing).
 *
 * <p>Missing values are kept; a fit rejects them with a message naming column and row unless its
 * specification asks to drop incomplete rows.
 *
 * <pre>{@code
 * Table t = Table.builder()
 *         .numeric("claims", 0, 2, 1)
 *         .numeric("exposure", 0.5, 1.0, 0.8)
 *         .categorical("region", "North", "South", "North")
 *         .build();
 * }</pre>
 *
 * @since 0.1
 */
public final class Table {

    private static final int PREVIEW_ROWS = 5;

    private final Map<String, Object> columns; // double[] or Categorical
    private final int rowCount;

    /** Codes and levels of one categorical column; code -1 means missing. */
    static final class Categorical {
        final int[] codes;
        final List<String> levels;

        Categorical(int[] codes, List<String> levels) {
            this.codes = codes;
            this.levels = levels;
        }
    }

    private Table(Map<String, Object> columns, int rowCount) {
        this.columns = columns;
        this.rowCount = rowCount;
    }

    /**
     * Starts a new table.
     *
     * @return an empty builder
     * @since 0.1
     */
    public static Builder builder() {
        return new Builder();
    }

    /**
     * Returns the number of rows.
     *
     * @return the row count, possibly 0
     * @since 0.1
     */
    public int rowCount() {
        return rowCount;
    }

    /**
     * Returns the column names in the order they were added.
     *
     * @return an immutable list of names
     * @since 0.1
     */
    public List<String> columnNames() {
        return List.copyOf(columns.keySet());
    }

    /**
     * Tells whether a column of that name exists.
     *
     * @param name a column name
     * @return true when the table has the column
     * @since 0.1
     */
    public boolean hasColumn(String name) {
        return columns.containsKey(name);
    }

    /**
     * Tells whether the column is numeric.
     *
     * @param column a column name
     * @return true for a numeric column, false for a categorical one
     * @throws UnknownNameException when the column does not exist (the message lists the columns)
     * @since 0.1
     */
    public boolean isNumeric(String column) {
        return get(column) instanceof double[];
    }

    /**
     * Tells whether the column is categorical.
     *
     * @param column a column name
     * @return true for a categorical column, false for a numeric one
     * @throws UnknownNameException when the column does not exist (the message lists the columns)
     * @since 0.1
     */
    public boolean isCategorical(String column) {
        return get(column) instanceof Categorical;
    }

    /**
     * Returns a copy of a numeric column; NaN marks a missing value.
     *
     * @param column a numeric column
     * @return a new array of length {@link #rowCount()}
     * @throws UnknownNameException when the column does not exist
     * @throws ReweighException when the column is categorical
     * @since 0.1
     */
    public double[] numeric(String column) {
        return numericView(column).clone();
    }

    /**
     * Returns the level list of a categorical column, in level order.
     *
     * @param column a categorical column
     * @return an immutable list of levels
     * @throws UnknownNameException when the column does not exist
     * @throws ReweighException when the column is numeric
     * @since 0.1
     */
    public List<String> levels(String column) {
        return categorical(column).levels;
    }

    /**
     * Returns a copy of the level codes of a categorical column: indices into
     * {@link #levels(String)}, -1 for a missing value.
     *
     * @param column a categorical column
     * @return a new array of length {@link #rowCount()}
     * @throws UnknownNameException when the column does not exist
     * @throws ReweighException when the column is numeric
     * @since 0.1
     */
    public int[] codes(String column) {
        return categorical(column).codes.clone();
    }

    /**
     * Returns one cell as text: numbers as {@link Double#toString(double)}, levels as given,
     * "NA" for a missing value.
     *
     * @param column a column name
     * @param row a zero-based row index
     * @return the cell's text
     * @throws UnknownNameException when the column does not exist
     * @throws IndexOutOfBoundsException when the row is out of range
     * @since 0.1
     */
    public String value(String column, int row) {
        Objects.checkIndex(row, rowCount);
        Object c = get(column);
        if (c instanceof double[]) {
            double v = ((double[]) c)[row];
            return Double.isNaN(v) ? "NA" : Double.toString(v);
        }
        Categorical cat = (Categorical) c;
        int code = cat.codes[row];
        return code < 0 ? "NA" : cat.levels.get(code);
    }

    /**
     * Returns a new table with the given rows, in the given order (rows may repeat). Categorical
     * columns keep their full level lists.
     *
     * @param rows zero-based row indices
     * @return the selected table
     * @throws IndexOutOfBoundsException when an index is out of range
     * @since 0.1
     */
    public Table select(int[] rows) {
        for (int r : rows) {
            Objects.checkIndex(r, rowCount);
        }
        Map<String, Object> out = new LinkedHashMap<>();
        for (Map.Entry<String, Object> e : columns.entrySet()) {
            if (e.getValue() instanceof double[]) {
                double[] src = (double[]) e.getValue();
                double[] dst = new double[rows.length];
                for (int i = 0; i < rows.length; i++) {
                    dst[i] = src[rows[i]];
                }
                out.put(e.getKey(), dst);
            } else {
                Categorical src = (Categorical) e.getValue();
                int[] dst = new int[rows.length];
                for (int i = 0; i < rows.length; i++) {
                    dst[i] = src.codes[rows[i]];
                }
                out.put(e.getKey(), new Categorical(dst, src.levels));
            }
        }
        return new Table(out, rows.length);
    }

    /**
     * Returns a short preview: the size, each column's kind, and the first few rows.
     *
     * @return a multi-line description
     * @since 0.1
     */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append("Table with ").append(rowCount).append(" rows and ").append(columns.size())
                .append(" columns\n");
        List<String> names = columnNames();
        int shown = Math.min(PREVIEW_ROWS, rowCount);
        int[] width = new int[names.size()];
        for (int c = 0; c < names.size(); c++) {
            width[c] = Math.max(names.get(c).length(), isNumeric(names.get(c)) ? 7 : 11);
            for (int r = 0; r < shown; r++) {
                width[c] = Math.max(width[c], value(names.get(c), r).length());
            }
        }
        for (int c = 0; c < names.size(); c++) {
            sb.append(pad(names.get(c), width[c])).append(c + 1 < names.size() ? "  " : "\n");
        }
        for (int c = 0; c < names.size(); c++) {
            String kind = isNumeric(names.get(c)) ? "numeric" : "categorical";
            sb.append(pad(kind, width[c])).append(c + 1 < names.size() ? "  " : "\n");
        }
        for (int r = 0; r < shown; r++) {
            for (int c = 0; c < names.size(); c++) {
                sb.append(pad(value(names.get(c), r), width[c])).append(c + 1 < names.size() ? "  " : "\n");
            }
        }
        if (rowCount > shown) {
            sb.append("... ").append(rowCount - shown).append(" more rows\n");
        }
        return sb.toString();
    }

    private static String pad(String s, int w) {
        StringBuilder sb = new StringBuilder(s);
        while (sb.length() < w) {
            sb.append(' ');
        }
        return sb.toString();
    }

    double[] numericView(String column) {
        Object c = get(column);
        if (!(c instanceof double[])) {
            throw new ReweighException("column '" + column + "' is categorical, not numeric");
        }
        return (double[]) c;
    }

    double[] numericViewChecked(String column) {
        if (isCategorical(column)) {
            throw new ModelSpecException("column '" + column + "' is categorical; a numeric column is needed here");
        }
        return (double[]) get(column);
    }

    Categorical categorical(String column) {
        Object c = get(column);
        if (!(c instanceof Categorical)) {
            throw new ReweighException("column '" + column + "' is numeric, not categorical");
        }
        return (Categorical) c;
    }

    private Object get(String column) {
        Objects.requireNonNull(column, "column");
        Object c = columns.get(column);
        if (c == null) {
            throw new UnknownNameException("column", column, columnNames());
        }
        return c;
    }

    /**
     * Compares level texts in natural order: numbers by value (so "2" precedes "10") before any
     * other text, other text by its characters.
     */
    static final Comparator<String> NATURAL_ORDER = (a, b) -> {
        BigDecimal na = parseNumber(a);
        BigDecimal nb = parseNumber(b);
        if (na != null && nb != null) {
            int c = na.compareTo(nb);
            return c != 0 ? c : a.compareTo(b);
        }
        if (na != null) {
            return -1;
        }
        if (nb != null) {
            return 1;
        }
        return a.compareTo(b);
    };

    private static BigDecimal parseNumber(String s) {
        String t = s.trim();
        if (t.isEmpty() || !(Character.isDigit(t.charAt(t.length() - 1)) || t.endsWith("."))) {
            return null;
        }
        try {
            return new BigDecimal(t);
        } catch (NumberFormatException e) {
            return null;
        }
    }

    /**
     * Collects columns for a {@link Table}. A builder can be reused; {@link #build()} copies.
     *
     * @since 0.1
     */
    public static final class Builder {
        private final Map<String, Object> columns = new LinkedHashMap<>();

        private Builder() {
        }

        /**
         * Adds a numeric column; NaN marks a missing value (the values are copied).
         *
         * @param name a new column name
         * @param values the column's values
         * @return this builder
         * @throws ReweighException when the name is already used
         * @since 0.1
         */
        public Builder numeric(String name, double... values) {
            checkNew(name);
            columns.put(name, values.clone());
            return this;
        }

        /**
         * Adds a categorical column whose levels are sorted in natural order (numbers by value,
         * so "2" precedes "10", then other text). A null value marks a missing value.
         *
         * @param name a new column name
         * @param values the column's values as text
         * @return this builder
         * @throws ReweighException when the name is already used
         * @since 0.1
         */
        public Builder categorical(String name, String... values) {
            checkNew(name);
            TreeSet<String> distinct = new TreeSet<>(NATURAL_ORDER);
            for (String v : values) {
                if (v != null) {
                    distinct.add(v);
                }
            }
            columns.put(name, encode(name, new ArrayList<>(distinct), values));
            return this;
        }

        /**
         * Adds a categorical column with the caller's level order. Levels that never occur are
         * kept (a fit reports their columns as aliased). A null value marks a missing value.
         *
         * @param name a new column name
         * @param levelOrder every level, in the order wanted, without duplicates
         * @param values the column's values as text
         * @return this builder
         * @throws ReweighException when the name is already used or a level repeats
         * @throws UnknownNameException when a value is not in the level list
         * @since 0.1
         */
        public Builder categorical(String name, List<String> levelOrder, String... values) {
            checkNew(name);
            List<String> levels = List.copyOf(levelOrder);
            if (levels.size() != new TreeSet<>(levels).size()) {
                throw new ReweighException("column '" + name + "': the level list repeats a level: " + levels
                        + "; expected distinct levels");
            }
            columns.put(name, encode(name, levels, values));
            return this;
        }

        private static Categorical encode(String name, List<String> levels, String[] values) {
            Map<String, Integer> index = new HashMap<>();
            for (int i = 0; i < levels.size(); i++) {
                index.put(levels.get(i), i);
            }
            int[] codes = new int[values.length];
            for (int r = 0; r < values.length; r++) {
                if (values[r] == null) {
                    codes[r] = -1;
                    continue;
                }
                Integer code = index.get(values[r]);
                if (code == null) {
                    throw new UnknownNameException("level of column '" + name + "' (row " + r + ")", values[r], levels);
                }
                codes[r] = code;
            }
            return new Categorical(codes, Collections.unmodifiableList(new ArrayList<>(levels)));
        }

        private void checkNew(String name) {
            Objects.requireNonNull(name, "name");
            if (columns.containsKey(name)) {
                throw new ReweighException("column '" + name + "' was already added; every column needs its own name");
            }
        }

        /**
         * Builds the table.
         *
         * @return an immutable table
         * @throws ReweighException when there is no column
         * @throws InvalidDataException when the columns differ in length (the message names the
         *     first column whose length differs and lists each column's length)
         * @since 0.1
         */
        public Table build() {
            if (columns.isEmpty()) {
                throw new ReweighException("a table needs at least one column");
            }
            int n = -1;
            boolean equal = true;
            String firstName = null;
            String badName = null;
            int badLength = 0;
            StringBuilder lengths = new StringBuilder();
            Map<String, Object> copy = new LinkedHashMap<>();
            for (Map.Entry<String, Object> e : columns.entrySet()) {
                int len = e.getValue() instanceof double[] ? ((double[]) e.getValue()).length
                        : ((Categorical) e.getValue()).codes.length;
                if (n >= 0 && len != n && equal) {
                    equal = false;
                    badName = e.getKey();
                    badLength = len;
                }
                if (n < 0) {
                    n = len;
                    firstName = e.getKey();
                }
                lengths.append(lengths.length() == 0 ? "" : ", ").append(e.getKey()).append('=').append(len);
                Object v = e.getValue() instanceof double[] ? ((double[]) e.getValue()).clone()
                        : new Categorical(((Categorical) e.getValue()).codes.clone(), ((Categorical) e.getValue()).levels);
                copy.put(e.getKey(), v);
            }
            if (!equal) {
                throw new InvalidDataException(badName, -1, "length " + badLength, "length " + n + ", the length of"
                        + " column '" + firstName + "' (every column has one value per row; lengths: " + lengths + ")");
            }
            return new Table(Collections.unmodifiableMap(copy), n);
        }
    }

}
