package dev.reweigh.core;

import dev.reweigh.core.internal.NumberText;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.UnknownNameException;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The ways rows reach a {@link Scorer}, bound once per call to the compiled design's inputs: a
 * {@link Table}, a map of column arrays, or a map of one row's values. Each binding checks values
 * as it reads them (messages name column, row and value) and records whether the current row
 * used the reference level for an unseen level.
 */
final class ScoringInputs {
    private ScoringInputs() {
    }

    abstract static class Binding implements CompiledDesign.RowInput {
        final CompiledDesign design;
        final boolean fallback;
        final Object[] columns;
        boolean usedReference;

        Binding(CompiledDesign design, boolean fallback) {
            this.design = design;
            this.fallback = fallback;
            this.columns = new Object[design.inputNames.size()];
        }

        final double checked(int input, int row, double v) {
            boolean ok = input == design.logOffsetInput ? v > 0 && v < Double.POSITIVE_INFINITY : Double.isFinite(v);
            if (!ok) {
                throw new InvalidDataException(design.inputNames.get(input), row, NumberText.of(v),
                        input == design.logOffsetInput ? "a positive finite exposure (its logarithm enters the"
                                + " linear predictor)" : "a finite number");
            }
            return v;
        }

        final int levelOf(int input, int row, String level) {
            if (level == null) {
                throw new InvalidDataException(design.inputNames.get(input), row, "null (missing)",
                        "one of the levels " + design.inputLevels.get(input));
            }
            Integer k = design.levelIndex.get(input).get(level);
            if (k == null) {
                return unseen(input, row, level);
            }
            return k;
        }

        final int unseen(int input, int row, String level) {
            if (!fallback) {
                throw new UnseenLevelException(design.inputNames.get(input), row, level, design.inputLevels.get(input));
            }
            usedReference = true;
            return -1;
        }
    }

    /** Rows of a table; factor levels mapped once per call from the table's level list. */
    static final class TableBinding extends Binding {
        final int[][] levelMap;
        private final List<String>[] tableLevels;

        @SuppressWarnings("unchecked")
        TableBinding(CompiledDesign design, boolean fallback, Table t) {
            super(design, fallback);
            levelMap = new int[columns.length][];
            tableLevels = new List[columns.length];
            for (int i = 0; i < columns.length; i++) {
                String c = design.inputNames.get(i);
                if (!t.hasColumn(c)) {
                    throw new UnknownNameException("column", c, t.columnNames());
                }
                if (design.inputIsFactor[i]) {
                    if (!t.isCategorical(c)) {
                        throw kindMismatch(c, true);
                    }
                    Table.Categorical cat = t.categorical(c);
                    columns[i] = cat.codes;
                    tableLevels[i] = cat.levels;
                    int[] map = new int[cat.levels.size()];
                    for (int k = 0; k < map.length; k++) {
                        Integer idx = design.levelIndex.get(i).get(cat.levels.get(k));
                        map[k] = idx == null ? -2 : idx;
                    }
                    levelMap[i] = map;
                } else {
                    if (!t.isNumeric(c)) {
                        throw kindMismatch(c, false);
                    }
                    columns[i] = t.numericView(c);
                }
            }
        }

        @Override
        public double number(int input, int row) {
            return checked(input, row, ((double[]) columns[input])[row]);
        }

        @Override
        public int level(int input, int row) {
            int c = ((int[]) columns[input])[row];
            if (c < 0) {
                return levelOf(input, row, null);
            }
            int k = levelMap[input][c];
            if (k == -2) {
                return unseen(input, row, tableLevels[input].get(c));
            }
            return k;
        }
    }

    static ModelSpecException kindMismatch(String column, boolean factor) {
        return new ModelSpecException(factor
                ? "column '" + column + "' must be categorical (text levels): the model uses it as a factor"
                : "column '" + column + "' must be numeric: the model uses it as a number");
    }

    /** Column arrays by name: double[] for numeric inputs, String[] for factors. */
    static final class ArrayBinding extends Binding {
        final int rows;

        ArrayBinding(CompiledDesign design, boolean fallback, Map<String, ?> data, int defaultRows) {
            super(design, fallback);
            int n = -1;
            String first = null;
            for (int i = 0; i < columns.length; i++) {
                String c = design.inputNames.get(i);
                Object v = data.get(c);
                if (v == null) {
                    throw new UnknownNameException("column", c, new ArrayList<>(data.keySet()));
                }
                int len;
                if (design.inputIsFactor[i]) {
                    if (!(v instanceof String[])) {
                        throw new InvalidDataException(c, -1, v.getClass().getSimpleName(),
                                "a String[] of levels (the model uses the column as a factor)");
                    }
                    len = ((String[]) v).length;
                } else {
                    if (!(v instanceof double[])) {
                        throw new InvalidDataException(c, -1, v.getClass().getSimpleName(),
                                "a double[] of numbers (the model uses the column as a number)");
                    }
                    len = ((double[]) v).length;
                }
                if (n < 0) {
                    n = len;
                    first = c;
                } else if (len != n) {
                    throw new InvalidDataException(c, -1, "an array of length " + len,
                            "an array of length " + n + ", like column '" + first + "'");
                }
                columns[i] = v;
            }
            this.rows = n < 0 ? defaultRows : n;
        }

        @Override
        public double number(int input, int row) {
            return checked(input, row, ((double[]) columns[input])[row]);
        }

        @Override
        public int level(int input, int row) {
            return levelOf(input, row, ((String[]) columns[input])[row]);
        }
    }

    /** One row given as column name to value (Number or text). */
    static final class RowBinding extends Binding {
        private final double[] numbers;
        private final String[] levels;

        RowBinding(CompiledDesign design, boolean fallback, Map<String, ?> row) {
            super(design, fallback);
            numbers = new double[columns.length];
            levels = new String[columns.length];
            for (int i = 0; i < columns.length; i++) {
                String c = design.inputNames.get(i);
                if (!row.containsKey(c)) {
                    throw new UnknownNameException("column", c, new ArrayList<>(row.keySet()));
                }
                Object v = row.get(c);
                if (design.inputIsFactor[i]) {
                    if (v == null || v instanceof CharSequence) {
                        levels[i] = v == null ? null : v.toString();
                    } else if (v instanceof Integer || v instanceof Long || v instanceof Short || v instanceof Byte) {
                        levels[i] = v.toString();
                    } else {
                        throw new InvalidDataException(c, 0, String.valueOf(v),
                                "text naming one of the levels " + design.inputLevels.get(i));
                    }
                } else {
                    if (v == null) {
                        throw new InvalidDataException(c, 0, "null (missing)", "a finite number");
                    }
                    if (v instanceof Number) {
                        numbers[i] = ((Number) v).doubleValue();
                    } else if (v instanceof CharSequence) {
                        try {
                            numbers[i] = Double.parseDouble(v.toString().trim());
                        } catch (NumberFormatException e) {
                            throw new InvalidDataException(c, 0, "\"" + v + "\"", "a finite number");
                        }
                    } else {
                        throw new InvalidDataException(c, 0, String.valueOf(v), "a finite number");
                    }
                }
            }
        }

        @Override
        public double number(int input, int row) {
            return checked(input, row, numbers[input]);
        }

        @Override
        public int level(int input, int row) {
            return levelOf(input, row, levels[input]);
        }
    }
}
