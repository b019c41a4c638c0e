package dev.reweigh.examples.demo;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Table;
import dev.reweigh.examples.csv.DataFileException;
import dev.reweigh.inference.Inference;
import dev.reweigh.inference.Prediction;
import dev.reweigh.inference.PredictionTable;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import static dev.reweigh.examples.demo.TrueModel.CLAIMS;
import static dev.reweigh.examples.demo.TrueModel.CLAIM_TOTAL;
import static dev.reweigh.examples.demo.TrueModel.DRIVER_AGE;
import static dev.reweigh.examples.demo.TrueModel.EXPOSURE;
import static dev.reweigh.examples.demo.TrueModel.MILEAGE;
import static dev.reweigh.examples.demo.TrueModel.POWER;
import static dev.reweigh.examples.demo.TrueModel.REGION;

/**
 * Writes the demo's files: the model artifacts, the scored portfolio and the charts.
 */
final class DemoFiles {
    static final String SCORED = "scored-policies.csv";
    static final String CHART_FREQUENCY = "frequency-by-region.png";
    static final String CHART_RESIDUALS = "severity-residuals-vs-fitted.png";
    static final String CHART_QQ = "frequency-quantile-residuals-qq.png";

    private DemoFiles() {
    }

    static List<Path> write(Path folder, MotorPortfolio portfolio, Inference frequency, Inference severity,
                            FittedModel tweedie, PrintWriter out) {
        prepare(folder);
        List<Path> files = new ArrayList<>();
        files.addAll(DemoArtifacts.write(folder, frequency.fit(), severity.fit(), tweedie));
        files.add(scored(folder.resolve(SCORED), portfolio.policies(), frequency, severity, Inference.of(tweedie)));
        files.add(frequencyChart(folder.resolve(CHART_FREQUENCY), frequency.fit(), portfolio.truth()));
        Path residuals = folder.resolve(CHART_RESIDUALS);
        DemoCharts.residualsVersusFitted(residuals, "Average claim amount (Gamma, log link): deviance residuals",
                severity.fit().fittedValues(), severity.residuals().deviance(),
                "deviance residual");
        files.add(residuals);
        Path qq = folder.resolve(CHART_QQ);
        DemoCharts.quantileQuantile(qq, "Claim counts (Poisson): randomized quantile residuals against the normal",
                frequency.residuals().randomizedQuantile());
        files.add(qq);
        for (Path p : files) {
            out.printf(Locale.ROOT, "  %-48s %,12d bytes%n", p.toString(), size(p));
        }
        out.println("  scored-policies.csv: expected claims for the policy's exposure, frequency per policy-year,");
        out.println("  severity, pure premium per policy-year (with 95% ranges) and the Tweedie pure premium;");
        out.println("  the *.json files are the fitted models, readable by 'reweigh score --model FILE'.");
        out.println("  In " + CHART_FREQUENCY + " observed and fitted frequencies agree for every region: a Poisson model");
        out.println("  with a log link reproduces the claim total of each level of its factors; the true expected");
        out.println("  frequency shows how far chance moved each region.");
        out.flush();
        return files;
    }

    /** Creates the output folder (early, so that a bad --out fails before the fitting). */
    static void prepare(Path folder) {
        try {
            Files.createDirectories(folder);
        } catch (IOException e) {
            String reason = e instanceof java.nio.file.FileSystemException
                    && ((java.nio.file.FileSystemException) e).getReason() != null
                    ? ((java.nio.file.FileSystemException) e).getReason() : e.getClass().getSimpleName();
            throw new DataFileException(folder.toString(), "cannot create the output folder (" + reason + ")", e);
        }
    }

    private static long size(Path p) {
        try {
            return Files.size(p);
        } catch (IOException e) {
            return -1;
        }
    }

    private static Path scored(Path file, Table policies, Inference frequency, Inference severity, Inference tweedie) {
        List<Prediction> f = frequency.predictions().predictions();
        PredictionTable s = severity.predict(policies);
        List<Prediction> t = tweedie.predictions().predictions();
        double z = 1.959963984540054; // normal 97.5% point, common practice, no source
        double[] exposure = policies.numeric(EXPOSURE);
        double[] mileage = policies.numeric(MILEAGE);
        double[] claims = policies.numeric(CLAIMS);
        double[] total = policies.numeric(CLAIM_TOTAL);
        CSVFormat format = CSVFormat.RFC4180.builder().setRecordSeparator('\n')
                .setHeader("policy", EXPOSURE, DRIVER_AGE, POWER, REGION, MILEAGE, CLAIMS, CLAIM_TOTAL,
                        "expected_claims", "frequency", "severity", "pure_premium", "pure_premium_low",
                        "pure_premium_high", "tweedie_pure_premium", "tweedie_low", "tweedie_high")
                .build();
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8);
             CSVPrinter printer = new CSVPrinter(w, format)) {
            for (int i = 0; i < policies.rowCount(); i++) {
                Prediction pf = f.get(i);
                Prediction ps = s.predictions().get(i);
                Prediction pt = t.get(i);
                double frequencyPerYear = pf.mean() / exposure[i];
                double pp = frequencyPerYear * ps.mean();
                double se = Math.hypot(pf.linkStandardError(), ps.linkStandardError());
                printer.printRecord(i + 1, exposure[i], policies.value(DRIVER_AGE, i), policies.value(POWER, i),
                        policies.value(REGION, i), mileage[i], (long) claims[i], total[i], round(pf.mean(), 6),
                        round(frequencyPerYear, 6), round(ps.mean(), 2), round(pp, 2), round(pp * Math.exp(-z * se), 2),
                        round(pp * Math.exp(z * se), 2), round(pt.mean(), 2), round(pt.interval().lower(), 2),
                        round(pt.interval().upper(), 2));
            }
        } catch (IOException e) {
            throw new DataFileException(file.toString(), "cannot write: " + e.getMessage(), e);
        }
        return file;
    }

    private static double round(double v, int decimals) {
        return new java.math.BigDecimal(v).setScale(decimals, java.math.RoundingMode.HALF_EVEN).doubleValue();
    }

    private static Path frequencyChart(Path file, FittedModel poisson, TrueModel truth) {
        Table t = poisson.data();
        List<String> levels = t.levels(REGION);
        int[] codes = t.codes(REGION);
        double[] exposure = t.numeric(EXPOSURE);
        double[] claims = t.numeric(CLAIMS);
        double[] mileage = t.numeric(MILEAGE);
        double[] fitted = poisson.fittedValues();
        int[] used = poisson.usedRows();
        int m = levels.size();
        double[] e = new double[m];
        double[] observed = new double[m];
        double[] expected = new double[m];
        double[] trueExpected = new double[m];
        for (int k = 0; k < used.length; k++) {
            int i = used[k];
            e[codes[i]] += exposure[i];
            observed[codes[i]] += claims[i];
            expected[codes[i]] += fitted[k];
            trueExpected[codes[i]] += exposure[i] * truth.frequency(t.value(DRIVER_AGE, i), t.value(POWER, i),
                    t.value(REGION, i), mileage[i]);
        }
        for (int j = 0; j < m; j++) {
            observed[j] /= e[j];
            expected[j] /= e[j];
            trueExpected[j] /= e[j];
        }
        DemoCharts.observedVersusFitted(file, REGION, levels, e, observed, expected, trueExpected);
        return file;
    }
}
