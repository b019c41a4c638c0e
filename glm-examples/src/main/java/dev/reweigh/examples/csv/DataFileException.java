package dev.reweigh.examples.csv;

import dev.reweigh.families.ReweighException;

import java.util.Objects;

/**
 * A data or model file that cannot be used as a whole: it is missing or unreadable, it is not
 * well-formed CSV (or JSON), its header is empty or repeats a name, a record has the wrong number
 * of fields, or a column the command needs is absent. The message starts with the file name and is
 * one line.
 *
 * @since 0.1
 */
public class DataFileException extends ReweighException {
    private static final long serialVersionUID = 1L;

    private final String file;

    /**
     * Creates the exception.
     *
     * @param file the file as the user named it
     * @param problem what is wrong, in one line
     * @since 0.1
     */
    public DataFileException(String file, String problem) {
        super("file '" + Objects.requireNonNull(file, "file") + "': " + oneLine(problem));
        this.file = file;
    }

    /**
     * Creates the exception with its cause.
     *
     * @param file the file as the user named it
     * @param problem what is wrong, in one line
     * @param cause the underlying exception
     * @since 0.1
     */
    public DataFileException(String file, String problem, Throwable cause) {
        super("file '" + Objects.requireNonNull(file, "file") + "': " + oneLine(problem), cause);
        this.file = file;
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

    static String oneLine(String text) {
        return text == null ? "" : text.replaceAll("[\\r\\n]+", " ").strip();
    }
}
