package dev.reweigh.examples;

import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.Scorer;
import dev.reweigh.core.Scores;
import dev.reweigh.core.UnseenLevelException;
import dev.reweigh.examples.csv.CellException;
import dev.reweigh.examples.csv.CsvFile;
import dev.reweigh.examples.csv.CsvTableReader;
import dev.reweigh.examples.csv.DataFileException;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Link;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

/**
 * {@code score}: applies a saved model to the rows of a CSV file and writes them back with four
 * columns appended: the predicted mean, the ends of its 95% interval and the linear predictor.
 *
 * <p>The interval is formed on the linear-predictor scale (eta plus or minus 1.96 standard
 * errors, with the model's dispersion) and mapped through the inverse link, so it stays inside
 * the family's range of means.
 *
 * @since 0.1
 */
@Command(name = "score", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Scores the rows of a CSV file with a saved model.",
            "Appends predicted_mean, predicted_low and predicted_high (a 95%% interval) and linear_predictor to each"
                + " row; the model comes from fit --save-model."})
public final class ScoreCommand implements Callable<Integer> {
    /** Interval level of the appended range. */
    static final double LEVEL = 0.95;
    /** Names of the appended columns. */
    static final List<String> APPENDED = List.of("predicted_mean", "predicted_low", "predicted_high",
            "linear_predictor");

    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    @Option(names = "--model", required = true, paramLabel = "FILE", description = "model artifact (JSON)")
    private Path model;

    @Option(names = "--data", required = true, paramLabel = "FILE.csv", description = "rows to score")
    private Path data;

    @Option(names = "--out", paramLabel = "FILE.csv", description = "output file (default: standard output)")
    private Path out;

    /**
     * Creates the command (picocli instantiates it).
     *
     * @since 0.1
     */
    public ScoreCommand() {
    }

    /**
     * Runs the command.
     *
     * @return the exit status, 0
     * @throws dev.reweigh.families.ReweighException for bad input (mapped to status 2)
     * @since 0.1
     */
    @Override
    public Integer call() {
        ModelArtifact artifact = ModelFiles.load(model);
        Scorer scorer = artifact.scorerBuilder().intervalLevel(LEVEL).build();
        CsvTableReader.Builder reader = CsvTableReader.builder();
        for (String column : scorer.inputColumns()) {
            if (scorer.isFactor(column)) {
                reader.factor(column);
            } else {
                reader.numeric(column);
            }
        }
        String file = data.toString();
        CsvFile csv = reader.build().readFile(data);
        Scores scores;
        try {
            scores = scorer.score(csv.table());
        } catch (UnseenLevelException e) {
            throw new CellException(file, e.column(), e.row(), e.name(),
                    "a level seen when the model was fitted (" + String.join(", ", e.validNames()) + ")");
        } catch (InvalidDataException e) {
            throw CellException.inFile(file, e);
        }
        if (out == null) {
            PrintWriter w = spec.commandLine().getOut();
            write(csv, scores, scorer.link(), w, file);
            w.flush();
        } else {
            try (Writer w = Files.newBufferedWriter(out, StandardCharsets.UTF_8)) {
                write(csv, scores, scorer.link(), w, file);
            } catch (IOException e) {
                throw new DataFileException(out.toString(), "cannot write: " + e.getMessage(), e);
            }
            spec.commandLine().getErr().println("scored " + csv.table().rowCount() + " rows into " + out);
        }
        return 0;
    }

    private static void write(CsvFile csv, Scores scores, Link link, Writer w, String source) {
        List<String> header = new ArrayList<>(csv.header());
        for (String name : APPENDED) {
            header.add(header.contains(name) ? name + "_scored" : name);
        }
        double z = new org.apache.commons.math3.distribution.NormalDistribution(null, 0, 1)
                .inverseCumulativeProbability(0.5 + LEVEL / 2);
        double[] eta = scores.link();
        double[] mean = scores.mean();
        double[] meanSe = scores.standardError();
        CSVFormat format = CSVFormat.RFC4180.builder().setRecordSeparator('\n')
                .setHeader(header.toArray(new String[0])).build();
        try {
            CSVPrinter printer = new CSVPrinter(w, format);
            for (int i = 0; i < eta.length; i++) {
                List<Object> row = new ArrayList<>(csv.row(i));
                double slope = Math.abs(link.derivative(eta[i]));
                double seEta = meanSe[i] / slope;
                double a = link.inverse(eta[i] - z * seEta);
                double b = link.inverse(eta[i] + z * seEta);
                boolean finite = Double.isFinite(a) && Double.isFinite(b) && slope > 0;
                row.add(mean[i]);
                row.add(finite ? Math.min(a, b) : scores.lower(i));
                row.add(finite ? Math.max(a, b) : scores.upper(i));
                row.add(eta[i]);
                printer.printRecord(row);
            }
            printer.flush();
        } catch (IOException e) {
            throw new DataFileException(source, "cannot write the scores: " + e.getMessage(), e);
        }
    }
}
