package dev.reweigh.examples;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import dev.reweigh.inference.Inference;
import dev.reweigh.inference.Prediction;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** fit --save-model then score: the scores match the Java API's predictions row by row. */
class CliScoreTest {
    @TempDir
    Path dir;

    @Test
    void scoreRoundTripMatchesTheFittedModel() throws IOException {
        PortfolioCsv data = new PortfolioCsv(2_000, 11L);
        Path csv = data.write(dir.resolve("train.csv"));
        Path model = dir.resolve("model.json");
        CliRun fit = CliRun.of("fit", "--data", csv.toString(), "--response", "claims", "--family", "poisson",
                "--factor", "driver_age", "--factor", "region", "--numeric", "mileage", "--log-offset", "exposure",
                "--save-model", model.toString());
        assertEquals(0, fit.status, fit::toString);

        PortfolioCsv fresh = new PortfolioCsv(300, 99L);
        Path newRows = fresh.write(dir.resolve("new.csv"));
        Path scored = dir.resolve("scored.csv");
        CliRun score = CliRun.of("score", "--model", model.toString(), "--data", newRows.toString(), "--out",
                scored.toString());
        assertEquals(0, score.status, score::toString);

        FittedModel java = Glm.fit(ModelSpec.builder("claims").family(Families.poisson()).factor("driver_age")
                .factor("region").numeric("mileage").logOffset("exposure").build(), data.table());
        Table rows = fresh.table();
        List<Prediction> expected = Inference.of(java).predict(rows).predictions();
        List<CSVRecord> records;
        try (CSVParser p = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).build()
                .parse(new StringReader(Files.readString(scored)))) {
            records = p.getRecords();
            assertEquals(List.of("claims", "exposure", "driver_age", "region", "mileage", "amount", "predicted_mean",
                    "predicted_low", "predicted_high", "linear_predictor"), p.getHeaderNames());
        }
        assertEquals(rows.rowCount(), records.size());
        for (int i = 0; i < records.size(); i++) {
            CSVRecord r = records.get(i);
            Prediction e = expected.get(i);
            assertEquals(Double.toString(fresh.exposure[i]), r.get("exposure"), "input echoed unchanged");
            assertEquals(fresh.region[i], r.get("region"));
            double mean = Double.parseDouble(r.get("predicted_mean"));
            double eta = Double.parseDouble(r.get("linear_predictor"));
            double low = Double.parseDouble(r.get("predicted_low"));
            double high = Double.parseDouble(r.get("predicted_high"));
            assertEquals(e.mean(), mean, 1e-12 * e.mean(), "mean of row " + i);
            assertEquals(e.linearPredictor(), eta, 1e-12 * Math.abs(eta), "linear predictor of row " + i);
            // Both intervals are formed on the log scale with the same standard error.
            assertEquals(e.interval().lower(), low, 1e-9 * low, "lower end of row " + i);
            assertEquals(e.interval().upper(), high, 1e-9 * high, "upper end of row " + i);
            assertTrue(low < mean && mean < high, "mean inside its interval");
        }
    }

    @Test
    void scoresGoToStandardOutputWithoutOut() {
        PortfolioCsv data = new PortfolioCsv(1_000, 5L);
        Path csv = data.write(dir.resolve("train.csv"));
        Path model = dir.resolve("gamma.json");
        assertEquals(0, CliRun.of("fit", "--data", csv.toString(), "--response", "amount", "--family", "gamma",
                "--link", "log", "--factor", "region", "--save-model", model.toString()).status);
        CliRun score = CliRun.of("score", "--model", model.toString(), "--data", csv.toString());
        assertEquals(0, score.status, score::toString);
        String[] lines = score.out.split("\n");
        assertEquals(1 + 1_000, lines.length);
        assertTrue(lines[0].endsWith(",predicted_mean,predicted_low,predicted_high,linear_predictor"), lines[0]);
    }
}
