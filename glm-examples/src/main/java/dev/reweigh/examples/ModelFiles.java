package dev.reweigh.examples;

import dev.reweigh.core.ArtifactException;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.examples.csv.DataFileException;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Saving and loading model artifacts for the command line, with failures re-stated as
 * {@link DataFileException}s that name the file.
 *
 * @since 0.1
 */
public final class ModelFiles {
    private ModelFiles() {
    }

    /**
     * Writes the artifact of a fitted model (default dispersion: fixed by the family, else Pearson).
     *
     * @param fit the fitted model
     * @param file the file to write (replaced if present)
     * @throws DataFileException when the file cannot be written
     * @since 0.1
     */
    public static void save(FittedModel fit, Path file) {
        save(ModelArtifact.of(fit), file);
    }

    /**
     * Writes an artifact.
     *
     * @param artifact the artifact
     * @param file the file to write (replaced if present)
     * @throws DataFileException when the file cannot be written
     * @since 0.1
     */
    public static void save(ModelArtifact artifact, Path file) {
        try {
            Path parent = file.toAbsolutePath().getParent();
            if (parent != null) {
                Files.createDirectories(parent);
            }
            artifact.write(file);
        } catch (IOException e) {
            throw new DataFileException(file.toString(), "cannot write the model: " + e.getMessage(), e);
        }
    }

    /**
     * Reads an artifact.
     *
     * @param file the model file
     * @return the artifact
     * @throws DataFileException when the file is missing, unreadable or not a valid artifact
     * @since 0.1
     */
    public static ModelArtifact load(Path file) {
        String name = file.toString();
        if (!Files.isRegularFile(file)) {
            throw new DataFileException(name, Files.exists(file) ? "is not a regular file" : "no such file");
        }
        try {
            return ModelArtifact.read(file);
        } catch (NoSuchFileException e) {
            throw new DataFileException(name, "no such file", e);
        } catch (IOException e) {
            throw new DataFileException(name, "cannot be read: " + e.getMessage(), e);
        } catch (ArtifactException e) {
            throw new DataFileException(name, "is not a valid Reweigh model: " + e.getMessage(), e);
        }
    }
}
