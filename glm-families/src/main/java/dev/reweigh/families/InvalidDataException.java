package dev.reweigh.families;

import java.util.Objects;

/**
 * A value in the data is not valid for its role: a response outside the family's domain, a NaN
 * predictor, a negative weight, text in a numeric column. The message names the column, the row
 * (zero-based in the Java API) and the value, and says what would be valid.
 *
 * @since 0.1
 * @serial exclude
 */
public class InvalidDataException extends ReweighException {
    private static final long serialVersionUID = 1L;

    private final String column;
    private final long row;
    private final String value;

    /**
     * Creates the exception for one bad cell.
     *
     * @param column the column at fault
     * @param row the zero-based row at fault, or -1 when the fault is not in one row
     * @param value the offending value as text
     * @param validDescription what would be valid, e.g. "a positive finite number"
     * @since 0.1
     */
    public InvalidDataException(String column, long row, String value, String validDescription) {
        super(describe(column, row, value, validDescription));
        this.column = Objects.requireNonNull(column, "column");
        this.row = row;
        this.value = Objects.requireNonNull(value, "value");
    }

    private static String describe(String column, long row, String value, String valid) {
        String where = row >= 0 ? "column '" + column + "', row " + row : "column '" + column + "'";
        return where + ": value " + value + " is not valid; expected " + valid;
    }

    /**
     * Returns the column at fault.
     *
     * @return the column name
     * @since 0.1
     */
    public String column() {
        return column;
    }

    /**
     * Returns the zero-based row at fault, or -1 when the fault is not in one row.
     *
     * @return the row index or -1
     * @since 0.1
     */
    public long row() {
        return row;
    }

    /**
     * Returns the offending value as text.
     *
     * @return the value
     * @since 0.1
     */
    public String value() {
        return value;
    }
}
