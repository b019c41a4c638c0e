package dev.reweigh.examples;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.examples.csv.CellException;
import dev.reweigh.examples.csv.CsvTableReader;
import dev.reweigh.examples.csv.DataFileException;
import dev.reweigh.families.Families;
import dev.reweigh.families.Family;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Links;
import dev.reweigh.families.UnknownNameException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;

/**
 * {@code fit}: reads a CSV file, fits one model and prints a readable report (or, with
 * {@code --json}, one JSON object); {@code --save-model} also writes the model artifact.
 *
 * @since 0.1
 */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Fits a model to a CSV file and reports it.",
            "Prints coefficients (with relativities under a log link), deviance, dispersion, log-likelihood, AIC, BIC"
                + " and warnings; terms enter the model in the order their options are given."})
public final class FitCommand implements Callable<Integer> {
    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    @Option(names = "--data", required = true, paramLabel = "FILE.csv",
            description = "CSV file with a header row (UTF-8; empty cell = missing value)")
    private Path data;

    @Option(names = "--response", required = true, paramLabel = "COL", description = "response column")
    private String response;

    @Option(names = "--trials", paramLabel = "COL",
            description = "number of trials (binomial family; the response then counts successes)")
    private String trials;

    @Option(names = "--family", required = true, paramLabel = "NAME",
            description = "family: gaussian, binomial, poisson, gamma, inverse-gaussian, tweedie:P,"
                    + " negative-binomial:THETA, quasi:...")
    private String family;

    @Option(names = "--link", paramLabel = "NAME", description = "link (default: the family's default link)")
    private String link;

    @Option(names = "--numeric", paramLabel = "COL", description = "a numeric term (repeatable)")
    private List<String> numerics = new ArrayList<>();

    @Option(names = "--factor", paramLabel = "COL[:REFERENCE]",
            description = "a factor term, optionally with its reference level (repeatable; default reference:"
                    + " the level with the most weight)")
    private List<String> factors = new ArrayList<>();

    @Option(names = "--interaction", paramLabel = "COL,COL", description = "an interaction of two columns (repeatable)")
    private List<String> interactions = new ArrayList<>();

    @Option(names = "--offset", paramLabel = "COL", description = "offset on the linear-predictor scale")
    private String offset;

    @Option(names = "--log-offset", paramLabel = "COL", description = "exposure column; its log is the offset")
    private String logOffset;

    @Option(names = "--weights", paramLabel = "COL", description = "prior weights")
    private String weights;

    @Option(names = "--no-intercept", description = "fit without an intercept")
    private boolean noIntercept;

    @Option(names = "--json", description = "print one JSON object instead of the text report")
    private boolean json;

    @Option(names = "--save-model", paramLabel = "FILE", description = "also write the fitted model artifact (JSON)")
    private Path saveModel;

    /**
     * Creates the command (picocli instantiates it).
     *
     * @since 0.1
     */
    public FitCommand() {
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
        Family fam = Families.byName(family);
        ModelSpec.Builder b = ModelSpec.builder(response).family(fam);
        if (link != null) {
            b.link(Links.byName(link));
        }
        CsvTableReader.Builder reader = CsvTableReader.builder();
        Set<String> needed = new LinkedHashSet<>();
        needed.add(response);
        reader.numeric(response);
        for (String numericRole : new String[] {trials, offset, logOffset, weights}) {
            if (numericRole != null) {
                reader.numeric(numericRole);
            }
        }
        if (trials != null) {
            b.trials(trials);
        }
        Map<String, Integer> seen = new HashMap<>();
        for (CommandLine.Model.ArgSpec arg : spec.commandLine().getParseResult().matchedArgs()) {
            if (!(arg instanceof CommandLine.Model.OptionSpec)) {
                continue;
            }
            String option = ((CommandLine.Model.OptionSpec) arg).longestName();
            int k = seen.merge(option, 1, Integer::sum) - 1;
            switch (option) {
                case "--numeric": {
                    String col = numerics.get(k);
                    reader.numeric(col);
                    b.numeric(col);
                    break;
                }
                case "--factor": {
                    String value = factors.get(k);
                    int colon = value.indexOf(':');
                    String col = colon < 0 ? value : value.substring(0, colon);
                    reader.factor(col);
                    if (colon < 0) {
                        b.factor(col);
                    } else {
                        b.factor(col, value.substring(colon + 1));
                    }
                    break;
                }
                case "--interaction": {
                    String[] cols = interactions.get(k).split(",", -1);
                    if (cols.length != 2 || cols[0].isBlank() || cols[1].isBlank()) {
                        throw new CommandLine.ParameterException(spec.commandLine(),
                                "--interaction takes two column names separated by a comma, got '"
                                        + interactions.get(k) + "'");
                    }
                    needed.add(cols[0].strip());
                    needed.add(cols[1].strip());
                    b.interaction(cols[0].strip(), cols[1].strip());
                    break;
                }
                default:
                    break;
            }
        }
        if (offset != null) {
            b.offset(offset);
        }
        if (logOffset != null) {
            b.logOffset(logOffset);
        }
        if (weights != null) {
            b.weights(weights);
        }
        b.intercept(!noIntercept);
        ModelSpec model = b.build();
        String file = data.toString();
        Table table = reader.require(needed).build().read(data);
        FittedModel fit = fitInFile(model, table, file);
        FitSummary summary = FitSummary.of(fit);
        PrintWriter out = spec.commandLine().getOut();
        if (saveModel != null) {
            ModelFiles.save(fit, saveModel);
        }
        if (json) {
            FitJson.write(summary, out);
        } else {
            out.print(FitReport.render(summary, file));
            if (saveModel != null) {
                out.println("model saved to " + saveModel);
            }
        }
        out.flush();
        return 0;
    }

    /**
     * Fits a model to a table read from a file, re-stating data errors so that they name the file.
     */
    static FittedModel fitInFile(ModelSpec model, Table table, String file) {
        try {
            return Glm.fit(model, table);
        } catch (InvalidDataException e) {
            throw CellException.inFile(file, e);
        } catch (UnknownNameException e) {
            if ("column".equals(e.kind())) {
                throw new DataFileException(file, "has no column '" + e.name() + "'; its columns are: "
                        + String.join(", ", e.validNames()), e);
            }
            if (e.kind().startsWith("reference level of column ")) {
                throw new DataFileException(file, e.kind().substring("reference level of ".length())
                        + " has no level '" + e.name() + "' to use as the reference; its levels are: "
                        + String.join(", ", e.validNames()), e);
            }
            throw e;
        }
    }
}
