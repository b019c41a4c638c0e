package dev.reweigh.core;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads a file of the NIST StRD linear least squares suite: the header states the line ranges of
 * the certified-values block and of the data block; the certified block lists parameters
 * B0..Bk with estimate and standard deviation, then the residual standard deviation; the data
 * block holds y followed by the predictor(s). With one predictor, Bj multiplies x^j; with
 * several, Bj multiplies xj. B0, when present, is the intercept.
 */
final class NistDataset {
    private static final Pattern RANGE = Pattern.compile("\\(lines\\s+(\\d+)\\s+to\\s+(\\d+)\\)");
    private static final Pattern PARAM = Pattern.compile("^\\s*B(\\d+)\\s+(\\S+)\\s+(\\S+)\\s*$");
    private static final Pattern RESID_SD = Pattern.compile("Standard Deviation\\s+(\\S+)");

    final String name;
    final TreeMap<Integer, double[]> certified = new TreeMap<>(); // power/index -> {estimate, sd}
    final double residualSd;
    final double[] y;
    final double[][] x; // [predictor][row]

    private NistDataset(String name, double residualSd, double[] y, double[][] x) {
        this.name = name;
        this.residualSd = residualSd;
        this.y = y;
        this.x = x;
    }

    static NistDataset read(Path file) throws IOException {
        List<String> lines = Files.readAllLines(file, StandardCharsets.US_ASCII);
        int[] cert = null;
        int[] data = null;
        for (int i = 0; i < Math.min(lines.size(), 15); i++) {
            Matcher m = RANGE.matcher(lines.get(i));
            if (m.find()) {
                int[] range = {Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2))};
                if (lines.get(i).contains("Certified")) {
                    cert = range;
                } else if (lines.get(i).contains("Data")) {
                    data = range;
                }
            }
        }
        if (cert == null || data == null) {
            throw new IOException(file + ": header does not state the line ranges");
        }
        TreeMap<Integer, double[]> params = new TreeMap<>();
        double resid = Double.NaN;
        boolean afterResidual = false;
        for (int ln = cert[0]; ln <= cert[1]; ln++) {
            String line = lines.get(ln - 1);
            Matcher pm = PARAM.matcher(line);
            if (pm.matches()) {
                params.put(Integer.parseInt(pm.group(1)), new double[] {parse(pm.group(2)), parse(pm.group(3))});
                continue;
            }
            if (line.trim().startsWith("Residual")) {
                afterResidual = true;
            }
            Matcher rm = RESID_SD.matcher(line);
            if (afterResidual && rm.find() && Double.isNaN(resid)) {
                resid = parse(rm.group(1));
            }
        }
        List<double[]> rows = new ArrayList<>();
        for (int ln = data[0]; ln <= data[1]; ln++) {
            String t = lines.get(ln - 1).trim();
            if (t.isEmpty() || !(Character.isDigit(t.charAt(0)) || t.charAt(0) == '-' || t.charAt(0) == '.'
                    || t.charAt(0) == '+')) {
                continue; // blank or a heading inside the stated range
            }
            String[] tok = t.split("\\s+");
            double[] v = new double[tok.length];
            for (int k = 0; k < tok.length; k++) {
                v[k] = parse(tok[k]);
            }
            rows.add(v);
        }
        int predictors = rows.get(0).length - 1;
        double[] y = new double[rows.size()];
        double[][] x = new double[predictors][rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            y[i] = rows.get(i)[0];
            for (int k = 0; k < predictors; k++) {
                x[k][i] = rows.get(i)[k + 1];
            }
        }
        String name = file.getFileName().toString().replace(".dat", "");
        NistDataset d = new NistDataset(name, resid, y, x);
        d.certified.putAll(params);
        if (params.isEmpty() || Double.isNaN(resid)) {
            throw new IOException(file + ": certified block not understood");
        }
        return d;
    }

    private static double parse(String s) {
        return Double.parseDouble(s.toUpperCase(Locale.ROOT).replace('D', 'E'));
    }

    boolean hasIntercept() {
        return certified.containsKey(0);
    }

    /** Builds the table: y, and x (one predictor) or x1..xk. */
    Table table() {
        Table.Builder b = Table.builder().numeric("y", y);
        if (x.length == 1) {
            b.numeric("x", x[0]);
        } else {
            for (int k = 0; k < x.length; k++) {
                b.numeric("x" + (k + 1), x[k]);
            }
        }
        return b.build();
    }

    /** The model the certified values belong to, as a Gaussian identity-link specification. */
    ModelSpec spec() {
        ModelSpec.Builder b = ModelSpec.builder("y").intercept(hasIntercept());
        if (x.length == 1) {
            int degree = certified.lastKey();
            if (degree == 1) {
                b.numeric("x");
            } else {
                b.polynomial("x", degree, false);
            }
        } else {
            for (int k = 0; k < x.length; k++) {
                b.numeric("x" + (k + 1));
            }
        }
        return b.build();
    }

    /** The model-matrix column name of parameter Bj. */
    String columnOf(int j) {
        if (j == 0) {
            return "intercept";
        }
        if (x.length == 1) {
            return certified.lastKey() == 1 ? "x" : "x^" + j;
        }
        return "x" + j;
    }

    /** NIST's log relative error, capped at 15; against a certified 0 it is -log10 |estimate|. */
    static double lre(double estimate, double certifiedValue) {
        double err = certifiedValue == 0 ? Math.abs(estimate) : Math.abs(estimate - certifiedValue) / Math.abs(certifiedValue);
        if (Double.isNaN(err)) {
            return 0;
        }
        return err == 0 ? 15 : Math.min(15, -Math.log10(err));
    }
}
