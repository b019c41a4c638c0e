package dev.reweigh.core;

import dev.reweigh.families.UnknownNameException;

import java.util.List;
import java.util.Objects;

/**
 * A row to be scored has a factor level that the model never saw when it was fitted. Thrown by a
 * {@link Scorer} unless it was built to score such rows at the reference level
 * ({@link Scorer.Builder#unseenLevelsAtReference(boolean)}).
 *
 * @since 0.1
 * @serial exclude
 */
public class UnseenLevelException extends UnknownNameException {
    private static final long serialVersionUID = 1L;

    private final String column;
    private final long row;

    /**
     * Creates the exception.
     *
     * @param column the factor column
     * @param row the row index in the scored data
     * @param level the unseen level
     * @param knownLevels the levels the model knows
     * @since 0.1
     */
    public UnseenLevelException(String column, long row, String level, List<String> knownLevels) {
        super("level of column '" + Objects.requireNonNull(column, "column") + "'", level, knownLevels);
        this.column = column;
        this.row = row;
    }

    /**
     * Returns the factor column.
     *
     * @return the column's name
     * @since 0.1
     */
    public String column() {
        return column;
    }

    /**
     * Returns the row index in the scored data.
     *
     * @return the row
     * @since 0.1
     */
    public long row() {
        return row;
    }

    /**
     * Describes the column, row and level, and the levels that would be valid.
     *
     * @return the message
     * @since 0.1
     */
    @Override
    public String getMessage() {
        return "column '" + column + "', row " + row + ": level '" + name() + "' was not seen when the model was"
                + " fitted; expected one of: " + String.join(", ", validNames())
                + " (or build the scorer to score unseen levels at the reference level)";
    }
}
