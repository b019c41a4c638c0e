package dev.reweigh.examples.csv;

import dev.reweigh.families.InvalidDataException;

import java.util.Locale;
import java.util.Objects;

/**
 * A cell of a data file whose value cannot be used. Like every {@link InvalidDataException},
 * {@link #row()} is the 0-based index of the table row; the message, meant for people, counts data
 * rows from 1 (the first row after the header is data row 1) and says so.
 *
 * <p>Example message: {@code file 'claims.csv', column 'claims', data row 7 (1 = first row after
 * the header): value "two" is not valid; expected a number}.
 *
 * @since 0.1
 */
public class CellException extends InvalidDataException {
    private static final long serialVersionUID = 1L;

    private final String file;
    private final String expected;

    /**
     * Creates the exception.
     *
     * @param file the file as the user named it
     * @param column the column name
     * @param row the 0-based table row
     * @param value the offending value as text
     * @param expected what would be valid
     * @since 0.1
     */
    public CellException(String file, String column, long row, String value, String expected) {
        super(column, row, value, expected);
        this.file = Objects.requireNonNull(file, "file");
        this.expected = Objects.requireNonNull(expected, "expected");
    }

    /**
     * Re-states a library {@link InvalidDataException} about a table read from a file, so that its
     * message names the file too.
     *
     * @param file the file the table was read from
     * @param e the exception raised by the library
     * @return the same facts with the file named
     * @since 0.1
     */
    public static CellException inFile(String file, InvalidDataException e) {
        if (e instanceof CellException) {
            return (CellException) e;
        }
        String message = e.getMessage() == null ? "" : e.getMessage();
        int at = message.indexOf("; expected ");
        String expected = at >= 0 ? message.substring(at + "; expected ".length()) : message;
        CellException c = new CellException(file, e.column(), e.row(), e.value(), expected);
        c.initCause(e);
        return c;
    }

    /**
     * Returns the file as the user named it.
     *
     * @return the file name
     * @since 0.1
     */
    public String file() {
        return file;
    }

    /**
     * Returns the description of a valid value.
     *
     * @return what would be valid
     * @since 0.1
     */
    public String expected() {
        return expected;
    }

    /**
     * Returns the data row counted from 1 (the first row after the header), or -1 when the problem
     * concerns the whole column.
     *
     * @return the 1-based data row
     * @since 0.1
     */
    public long dataRow() {
        return row() >= 0 ? row() + 1 : -1;
    }

    /**
     * Returns a one-line message naming file, column, 1-based data row and value.
     *
     * @return the message
     * @since 0.1
     */
    @Override
    public String getMessage() {
        String where = row() >= 0
                ? String.format(Locale.ROOT, ", data row %d (1 = first row after the header)", dataRow())
                : "";
        return DataFileException.oneLine("file '" + file + "', column '" + column() + "'" + where + ": value "
                + quote(value()) + " is not valid; expected " + expected);
    }

    private static String quote(String value) {
        String shown = value.length() > 60 ? value.substring(0, 57) + "..." : value;
        return "\"" + shown + "\"";
    }
}
