package dev.reweigh.examples.csv;

import dev.reweigh.core.Table;

import java.util.List;

/**
 * A CSV file as read: its table and its cells as written (trimmed), so that a command can echo
 * the input rows unchanged beside its own columns.
 *
 * @since 0.1
 */
public final class CsvFile {
    private final Table table;
    private final List<String[]> records;

    CsvFile(Table table, List<String[]> records) {
        this.table = table;
        this.records = records;
    }

    /**
     * Returns the table.
     *
     * @return the table
     * @since 0.1
     */
    public Table table() {
        return table;
    }

    /**
     * Returns the column names of the header.
     *
     * @return the names, in file order
     * @since 0.1
     */
    public List<String> header() {
        return List.of(records.get(0));
    }

    /**
     * Returns the cells of one data row as written (an empty text for an empty cell).
     *
     * @param row the 0-based data row
     * @return the cells, in column order
     * @throws IndexOutOfBoundsException when the row does not exist
     * @since 0.1
     */
    public List<String> row(int row) {
        if (row < 0 || row >= table.rowCount()) {
            throw new IndexOutOfBoundsException("row " + row + " of " + table.rowCount());
        }
        return List.of(records.get(row + 1));
    }
}
