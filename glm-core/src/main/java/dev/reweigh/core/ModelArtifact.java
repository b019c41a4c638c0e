package dev.reweigh.core;

import dev.reweigh.families.Families;
import dev.reweigh.families.Family;
import dev.reweigh.families.Link;
import dev.reweigh.families.Links;
import dev.reweigh.families.ReweighException;
import dev.reweigh.families.UnknownNameException;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * A fitted model as a self-contained, checksummed JSON document for production scoring: what
 * is needed to score new rows exactly as the fitted model does (family and link by name, the
 * specification with factor levels, reference levels and polynomial recurrences, column names,
 * coefficients, unscaled covariance, dispersion) and a summary of the fit. Reading needs only
 * glm-families and glm-core; a read model scores bit-identically to the one written. In-memory
 * fits ({@link #of(FittedModel)}) and streaming fits ({@link #of(StreamingFit)}) give the same kind
 * of artifact.
 *
 * <pre>{@code
 * ModelArtifact.of(fit).write(Path.of("frequency.json"));
 * // ... in the scoring service:
 * Scorer scorer = ModelArtifact.read(Path.of("frequency.json")).scorer();
 * }</pre>
 *
 * <p><b>Format</b> (version {@value #FORMAT_VERSION}): a JSON object with members
 * {@code format} (the text {@value #FORMAT_NAME}), {@code formatVersion} ("major.minor"),
 * {@code model} (library version, family, link, specification, columns, coefficients with
 * null for aliased columns, covariance with null rows and columns for aliased columns,
 * dispersion value and method, fit summary) and {@code checksum} (algorithm and hex value).
 * Numbers are written in the shortest form that reads back to the same double.
 * A newer minor version may add members, which are ignored; a newer major version is refused.
 *
 * <p><b>Checksum</b>: SHA-256 of the document's canonical form without the top-level
 * {@code checksum} member. The canonical form is compact UTF-8 JSON with no whitespace, object
 * members sorted by name (Java String order), whole numbers in plain decimal, other numbers as
 * Java's {@code Double.toString} of their value, strings with standard JSON escaping. So layout
 * and member order do not matter, any change of a name or value does.
 *
 * <p>Reading fails with an {@link ArtifactException} naming the field when the text is not
 * complete JSON, the major version is newer, the checksum does not match, or a field is missing,
 * of the wrong type or inconsistent; no model is returned. Instances are immutable.
 *
 * @since 0.1
 */
public final class ModelArtifact {
    /**
     * The format version this library writes, "major.minor".
     *
     * @since 0.1
     */
    public static final String FORMAT_VERSION = "1.0";

    /**
     * The value of the {@code format} member that marks a Reweigh model artifact.
     *
     * @since 0.1
     */
    public static final String FORMAT_NAME = "reweigh-model-artifact";

    /**
     * The dispersion method recorded when the Pearson estimate is used.
     *
     * @since 0.1
     */
    public static final String PEARSON = "pearson";

    /**
     * The dispersion method recorded for families whose dispersion is fixed at 1.
     *
     * @since 0.1
     */
    public static final String FIXED_BY_FAMILY = "fixed by family";

    private static final int MAJOR = 1;
    private static final int MAX_COUNT = Integer.MAX_VALUE;
    // streaming fits count rows in a long
    private static final long MAX_ROWS = Long.MAX_VALUE;

    private final String formatVersion;
    private final String libraryVersion;
    private final ModelSpec spec;
    private final ScoringModel scoring;
    private final String dispersionMethod;
    private final long rowCount;
    private final long droppedRows;
    private final double deviance;
    private final double nullDeviance;
    private final long residualDf;
    private final long nullDf;
    private final int iterations;
    private final boolean converged;
    private final double logLikelihood;
    private final List<String> warnings;
    private final String checksum;

    private ModelArtifact(String formatVersion, String libraryVersion, ModelSpec spec, ScoringModel scoring,
            String dispersionMethod, long rowCount, long droppedRows, double deviance, double nullDeviance,
            long residualDf, long nullDf, int iterations, boolean converged, double logLikelihood,
            List<String> warnings) {
        this.formatVersion = formatVersion;
        this.libraryVersion = libraryVersion;
        this.spec = spec;
        this.scoring = scoring;
        this.dispersionMethod = dispersionMethod;
        this.rowCount = rowCount;
        this.droppedRows = droppedRows;
        this.deviance = deviance;
        this.nullDeviance = nullDeviance;
        this.residualDf = residualDf;
        this.nullDf = nullDf;
        this.iterations = iterations;
        this.converged = converged;
        this.logLikelihood = logLikelihood;
        this.warnings = List.copyOf(warnings);
        this.checksum = sha256Hex(JsonDoc.canonical(document(false)));
    }

    // ------------------------------------------------------------------ from a fit

    /**
     * Makes the artifact of a fitted model with the default dispersion: 1 (method
     * {@value #FIXED_BY_FAMILY}) for families whose dispersion is fixed, else the Pearson
     * estimate (method {@value #PEARSON}), which is not available (null) without residual
     * degrees of freedom.
     *
     * @param fit the fitted model
     * @return the artifact
     * @throws ReweighException when the family or link is the caller's own implementation, whose
     *     name the library cannot look up when reading
     * @since 0.1
     */
    public static ModelArtifact of(FittedModel fit) {
        Objects.requireNonNull(fit, "fit");
        double phi = ScoringModel.defaultDispersion(fit);
        return create(fit, phi, fit.family().isDispersionFixed() ? FIXED_BY_FAMILY : PEARSON);
    }

    /**
     * Makes the artifact of a fitted model with a dispersion estimated by the caller (for
     * example by maximum likelihood in glm-inference).
     *
     * @param fit the fitted model
     * @param dispersion a positive finite dispersion
     * @param method how it was estimated, recorded as given (e.g. "maximum likelihood")
     * @return the artifact
     * @throws IllegalArgumentException when the dispersion is not positive and finite or the
     *     method is blank
     * @throws ReweighException when the family or link is the caller's own implementation, whose
     *     name the library cannot look up when reading
     * @since 0.1
     */
    public static ModelArtifact of(FittedModel fit, double dispersion, String method) {
        Objects.requireNonNull(fit, "fit");
        Objects.requireNonNull(method, "method");
        requireDispersion(dispersion, method);
        return create(fit, dispersion, method);
    }

    private static void requireDispersion(double dispersion, String method) {
        if (!(dispersion > 0) || Double.isInfinite(dispersion)) {
            throw new IllegalArgumentException("the dispersion must be positive and finite, got " + dispersion);
        }
        if (method.isBlank()) {
            throw new IllegalArgumentException("the dispersion method must be named");
        }
    }

    private static ModelArtifact create(FittedModel fit, double phi, String method) {
        requireStorableNames(fit.family(), fit.link());
        ScoringModel sm = ScoringModel.of(fit, phi);
        double ll = logLikelihood(fit, phi);
        return new ModelArtifact(FORMAT_VERSION, Reweigh.version(), rebuildSpec(fit.spec(), sm),
                sm, method, fit.rowCount(), fit.droppedRows(), fit.deviance(), fit.nullDeviance(), fit.residualDf(),
                fit.nullDf(), fit.iterations(), fit.converged(), ll, fit.warnings());
    }

    /**
     * Makes the artifact of a streaming fit ({@link StreamingGlm}), so a model fitted chunk by
     * chunk, for example straight from a database, can be deployed like one fitted in memory. The
     * dispersion is 1 for families that fix it and otherwise the Pearson estimate from the fit's
     * last pass ({@link StreamingFit#pearsonChiSquare()} over the residual degrees of freedom). The
     * log-likelihood is recorded for families that fix the dispersion (gathered during the fit);
     * for the others it would need one more pass over the data at the chosen dispersion, so it is
     * left out ({@link #logLikelihood()} is empty).
     *
     * <pre>{@code
     * StreamingFit fit = StreamingGlm.fit(spec, JdbcChunkSource.of(...));
     * ModelArtifact.of(fit).write(Path.of("frequency.json"));
     * }</pre>
     *
     * @param fit the streaming fit
     * @return the artifact
     * @throws ReweighException when the family or link is the caller's own implementation, whose
     *     name the library cannot look up when reading
     * @since 0.1
     */
    public static ModelArtifact of(StreamingFit fit) {
        Objects.requireNonNull(fit, "fit");
        return create(fit, ScoringModel.defaultDispersion(fit),
                fit.spec().family().isDispersionFixed() ? FIXED_BY_FAMILY : PEARSON);
    }

    /**
     * Makes the artifact of a streaming fit with a dispersion estimated by the caller.
     *
     * @param fit the streaming fit
     * @param dispersion a positive finite dispersion
     * @param method how it was estimated, recorded as given
     * @return the artifact
     * @throws IllegalArgumentException when the dispersion is not positive and finite or the
     *     method is blank
     * @throws ReweighException when the family or link is the caller's own implementation
     * @since 0.1
     */
    public static ModelArtifact of(StreamingFit fit, double dispersion, String method) {
        Objects.requireNonNull(fit, "fit");
        Objects.requireNonNull(method, "method");
        requireDispersion(dispersion, method);
        return create(fit, dispersion, method);
    }

    private static ModelArtifact create(StreamingFit fit, double phi, String method) {
        Family family = fit.spec().family();
        requireStorableNames(family, fit.spec().link());
        ScoringModel sm = ScoringModel.of(fit, phi);
        double ll = family.isDispersionFixed() && phi == 1.0 ? fit.logLikelihoodAtUnitDispersion() : Double.NaN;
        long nullDf = fit.residualDf() + fit.rank() - (fit.spec().hasIntercept() ? 1 : 0);
        return new ModelArtifact(FORMAT_VERSION, Reweigh.version(), rebuildSpec(fit.spec(), sm), sm, method,
                fit.rowCount(), fit.droppedRows(), fit.deviance(), fit.nullDeviance(), fit.residualDf(), nullDf,
                fit.iterations(), fit.converged(), ll, fit.warnings());
    }

    /** The artifact stores family and link by name: a caller's own implementation cannot be read back. */
    private static void requireStorableNames(Family family, Link link) {
        try {
            if (!Families.byName(family.name()).name().equals(family.name())) {
                throw new UnknownNameException("family", family.name(), Families.names());
            }
        } catch (ReweighException e) {
            throw new ReweighException("the family '" + family.name() + "' cannot be stored in a model artifact: its"
                    + " name does not identify one of the library's families (" + String.join(", ", Families.names())
                    + ")", e);
        }
        try {
            if (!Links.byName(link.name()).name().equals(link.name())) {
                throw new UnknownNameException("link", link.name(), Links.names());
            }
        } catch (ReweighException e) {
            throw new ReweighException("the link '" + link.name() + "' cannot be stored in a model artifact: its"
                    + " name does not identify one of the library's links (" + String.join(", ", Links.names())
                    + ")", e);
        }
    }

    private static ModelSpec rebuildSpec(ModelSpec original, ScoringModel sm) {
        List<Term> terms = new ArrayList<>();
        for (ScoringTerm t : sm.terms) {
            terms.add(t.toTerm());
        }
        return original.withTerms(terms);
    }

    private static double logLikelihood(FittedModel fit, double phi) {
        Family f = fit.family();
        if (!f.hasDensity() || !(phi > 0) || Double.isInfinite(phi)) {
            return Double.NaN;
        }
        double[] y = fit.response();
        double[] mu = fit.fittedValues();
        double[] w = fit.priorWeights();
        double s = 0;
        try {
            for (int i = 0; i < y.length; i++) {
                if (w[i] > 0) {
                    s += f.logDensity(y[i], mu[i], phi, w[i]);
                }
            }
        } catch (ReweighException | IllegalArgumentException e) {
            return Double.NaN;
        }
        return s;
    }

    // ------------------------------------------------------------------ getters

    /**
     * Returns the format version of the artifact as read or written, "major.minor".
     *
     * @return the format version
     * @since 0.1
     */
    public String formatVersion() {
        return formatVersion;
    }

    /**
     * Returns the version of the library that wrote the artifact.
     *
     * @return the library version, e.g. "0.1.0"
     * @since 0.1
     */
    public String libraryVersion() {
        return libraryVersion;
    }

    /**
     * Returns the family.
     *
     * @return the family
     * @since 0.1
     */
    public Family family() {
        return scoring.family;
    }

    /**
     * Returns the link.
     *
     * @return the link
     * @since 0.1
     */
    public Link link() {
        return scoring.link;
    }

    /**
     * Returns the specification. Factors carry the reference level the fit used, so a refit
     * of this specification codes them the same way.
     *
     * @return the specification
     * @since 0.1
     */
    public ModelSpec spec() {
        return spec;
    }

    /**
     * Returns the model-matrix column names, aliased ones included, in model order.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<String> columnNames() {
        return scoring.columnNames;
    }

    /**
     * Returns the coefficients in model order, NaN for aliased columns.
     *
     * @return a copy
     * @since 0.1
     */
    public double[] coefficients() {
        return scoring.beta.clone();
    }

    /**
     * Returns the unscaled covariance, p x p in model order, NaN rows and columns for aliased
     * columns; multiply by the dispersion for the covariance of the estimates.
     *
     * @return a new array
     * @since 0.1
     */
    public double[][] unscaledCovariance() {
        double[][] out = new double[scoring.covariance.length][];
        for (int i = 0; i < out.length; i++) {
            out[i] = scoring.covariance[i].clone();
        }
        return out;
    }

    /**
     * Returns the dispersion recorded with the model.
     *
     * @return the dispersion, NaN when it was not available
     * @since 0.1
     */
    public double dispersion() {
        return scoring.dispersion;
    }

    /**
     * Returns how the dispersion was obtained: {@value #FIXED_BY_FAMILY}, {@value #PEARSON}, or
     * the caller's method name.
     *
     * @return the method
     * @since 0.1
     */
    public String dispersionMethod() {
        return dispersionMethod;
    }

    /**
     * Returns the number of rows used in the fit.
     *
     * @return the row count
     * @since 0.1
     */
    public long rowCount() {
        return rowCount;
    }

    /**
     * Returns the number of incomplete rows the fit dropped.
     *
     * @return the count
     * @since 0.1
     */
    public long droppedRows() {
        return droppedRows;
    }

    /**
     * Returns the fit's deviance.
     *
     * @return the deviance, NaN when not available
     * @since 0.1
     */
    public double deviance() {
        return deviance;
    }

    /**
     * Returns the null model's deviance.
     *
     * @return the null deviance, NaN when not available
     * @since 0.1
     */
    public double nullDeviance() {
        return nullDeviance;
    }

    /**
     * Returns the residual degrees of freedom.
     *
     * @return the residual degrees of freedom
     * @since 0.1
     */
    public long residualDf() {
        return residualDf;
    }

    /**
     * Returns the null model's degrees of freedom.
     *
     * @return the null degrees of freedom
     * @since 0.1
     */
    public long nullDf() {
        return nullDf;
    }

    /**
     * Returns the number of IRLS iterations of the fit.
     *
     * @return the iteration count
     * @since 0.1
     */
    public int iterations() {
        return iterations;
    }

    /**
     * Tells whether the fit converged.
     *
     * @return true when converged
     * @since 0.1
     */
    public boolean converged() {
        return converged;
    }

    /**
     * Returns the log-likelihood of the fit at the recorded dispersion, when the family has a
     * density and the dispersion is available.
     *
     * @return the log-likelihood, or empty
     * @since 0.1
     */
    public OptionalDouble logLikelihood() {
        return Double.isFinite(logLikelihood) ? OptionalDouble.of(logLikelihood) : OptionalDouble.empty();
    }

    /**
     * Returns the fit's warnings.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<String> warnings() {
        return warnings;
    }

    /**
     * Returns the SHA-256 checksum of the artifact's canonical content as this library writes
     * it, in lower-case hex. For an artifact read from a file of the current format version
     * without unknown members, it equals the checksum recorded in the file.
     *
     * @return 64 hex digits
     * @since 0.1
     */
    public String checksum() {
        return checksum;
    }

    /**
     * Builds a scorer with the default options (unseen levels are an error, no intervals).
     *
     * @return the scorer
     * @since 0.1
     */
    public Scorer scorer() {
        return scorerBuilder().build();
    }

    /**
     * Starts a scorer with options.
     *
     * @return a builder; its dispersion defaults to the artifact's
     * @since 0.1
     */
    public Scorer.Builder scorerBuilder() {
        return Scorer.builder(this);
    }

    ScoringModel scoringModel() {
        return scoring;
    }

    // ------------------------------------------------------------------ writing

    /**
     * Writes the artifact to a file (created or replaced), UTF-8 JSON.
     *
     * @param file the file
     * @throws IOException when the file cannot be written
     * @since 0.1
     */
    public void write(Path file) throws IOException {
        Files.write(file, JsonDoc.pretty(document(true)));
    }

    /**
     * Writes the artifact to a stream, UTF-8 JSON; the stream is left open.
     *
     * @param out the stream
     * @throws IOException when the stream fails
     * @since 0.1
     */
    public void write(OutputStream out) throws IOException {
        out.write(JsonDoc.pretty(document(true)));
    }

    /**
     * Returns the artifact as JSON text.
     *
     * @return the JSON document
     * @since 0.1
     */
    public String toJson() {
        return new String(JsonDoc.pretty(document(true)), StandardCharsets.UTF_8);
    }

    private Map<String, Object> document(boolean withChecksum) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("format", FORMAT_NAME);
        root.put("formatVersion", FORMAT_VERSION);
        Map<String, Object> model = new LinkedHashMap<>();
        model.put("libraryVersion", libraryVersion);
        model.put("family", scoring.family.name());
        model.put("link", scoring.link.name());
        Map<String, Object> s = new LinkedHashMap<>();
        s.put("response", spec.response());
        s.put("trials", spec.trials().orElse(null));
        s.put("weights", spec.weights().orElse(null));
        s.put("offset", spec.offset().orElse(null));
        s.put("logOffset", spec.logOffset().orElse(null));
        s.put("intercept", spec.hasIntercept());
        s.put("dropIncompleteRows", spec.dropsIncompleteRows());
        List<Object> terms = new ArrayList<>();
        for (ScoringTerm t : scoring.terms) {
            terms.add(t.toJson());
        }
        s.put("terms", terms);
        model.put("specification", s);
        model.put("columns", new ArrayList<Object>(scoring.columnNames));
        model.put("coefficients", numbers(scoring.beta));
        List<Object> cov = new ArrayList<>();
        for (double[] row : scoring.covariance) {
            cov.add(numbers(row));
        }
        model.put("covariance", cov);
        Map<String, Object> d = new LinkedHashMap<>();
        d.put("value", orNull(scoring.dispersion));
        d.put("method", dispersionMethod);
        model.put("dispersion", d);
        Map<String, Object> f = new LinkedHashMap<>();
        f.put("rows", rowCount);
        f.put("droppedRows", droppedRows);
        f.put("deviance", orNull(deviance));
        f.put("nullDeviance", orNull(nullDeviance));
        f.put("residualDf", residualDf);
        f.put("nullDf", nullDf);
        f.put("iterations", (long) iterations);
        f.put("converged", converged);
        f.put("logLikelihood", orNull(logLikelihood));
        f.put("warnings", new ArrayList<Object>(warnings));
        model.put("fit", f);
        root.put("model", model);
        if (withChecksum) {
            Map<String, Object> c = new LinkedHashMap<>();
            c.put("algorithm", "SHA-256");
            c.put("value", checksum);
            root.put("checksum", c);
        }
        return root;
    }

    private static List<Object> numbers(double[] v) {
        List<Object> out = new ArrayList<>(v.length);
        for (double d : v) {
            out.add(orNull(d));
        }
        return out;
    }

    private static Object orNull(double v) {
        return Double.isFinite(v) ? (Object) v : null;
    }

    // ------------------------------------------------------------------ reading

    /**
     * Reads an artifact from a file.
     *
     * @param file the file
     * @return the artifact
     * @throws IOException when the file cannot be read
     * @throws ArtifactException when the content is not a valid artifact (naming the field)
     * @since 0.1
     */
    public static ModelArtifact read(Path file) throws IOException {
        return parse(Files.readAllBytes(file));
    }

    /**
     * Reads an artifact from a stream, to its end; the stream is left open.
     *
     * @param in the stream
     * @return the artifact
     * @throws IOException when the stream fails
     * @throws ArtifactException when the content is not a valid artifact (naming the field)
     * @since 0.1
     */
    public static ModelArtifact read(InputStream in) throws IOException {
        return parse(in.readAllBytes());
    }

    /**
     * Reads an artifact from JSON text.
     *
     * @param json the document
     * @return the artifact
     * @throws ArtifactException when the text is not a valid artifact (naming the field)
     * @since 0.1
     */
    public static ModelArtifact fromJson(String json) {
        return parse(json.getBytes(StandardCharsets.UTF_8));
    }

    private static ModelArtifact parse(byte[] bytes) {
        Map<String, Object> root = JsonFields.object(JsonDoc.parse(bytes), "document");
        String format = JsonFields.string(root, "format", "");
        if (!FORMAT_NAME.equals(format)) {
            throw new ArtifactException("format", "expected \"" + FORMAT_NAME + "\", found \"" + format
                    + "\": this is not a Reweigh model artifact");
        }
        String version = JsonFields.string(root, "formatVersion", "");
        int major = major(version);
        if (major > MAJOR) {
            throw new ArtifactException("formatVersion", "version " + version + " was written by a newer library;"
                    + " this library (" + Reweigh.version() + ") reads format versions " + MAJOR + ".x");
        }
        if (major < MAJOR) {
            throw new ArtifactException("formatVersion", "version " + version + " is not supported; this library"
                    + " reads format versions " + MAJOR + ".x");
        }
        Map<String, Object> sum = JsonFields.object(root, "checksum", "");
        String algorithm = JsonFields.string(sum, "algorithm", "checksum");
        if (!"SHA-256".equals(algorithm)) {
            throw new ArtifactException("checksum.algorithm", "expected \"SHA-256\", found \"" + algorithm + "\"");
        }
        String expected = JsonFields.string(sum, "value", "checksum");
        Map<String, Object> content = new LinkedHashMap<>(root);
        content.remove("checksum");
        String actual = sha256Hex(JsonDoc.canonical(content));
        if (!actual.equals(expected.toLowerCase(Locale.ROOT))) {
            throw new ArtifactException("checksum.value", "the content does not match its checksum (recorded "
                    + abbreviate(expected) + ", computed " + actual + "): the artifact was changed or damaged");
        }
        return readModel(JsonFields.object(root, "model", ""), version);
    }

    private static String abbreviate(String s) {
        return s.length() > 80 ? s.substring(0, 80) + "..." : s;
    }

    private static int major(String version) {
        int dot = version.indexOf('.');
        String a = dot < 0 ? "" : version.substring(0, dot);
        String b = dot < 0 ? "" : version.substring(dot + 1);
        if (!a.matches("[0-9]{1,6}") || !b.matches("[0-9]{1,6}")) {
            throw new ArtifactException("formatVersion", "expected \"major.minor\" such as \"" + FORMAT_VERSION
                    + "\", found \"" + abbreviate(version) + "\"");
        }
        return Integer.parseInt(a);
    }

    private static ModelArtifact readModel(Map<String, Object> m, String version) {
        final String path = "model";
        String libraryVersion = JsonFields.string(m, "libraryVersion", path);
        String familyName = JsonFields.string(m, "family", path);
        Family family;
        try {
            family = Families.byName(familyName);
        } catch (ReweighException e) {
            throw new ArtifactException("model.family", "'" + abbreviate(familyName) + "' is not a family name: "
                    + e.getMessage(), e);
        }
        String linkName = JsonFields.string(m, "link", path);
        Link link;
        try {
            link = Links.byName(linkName);
        } catch (ReweighException e) {
            throw new ArtifactException("model.link", "'" + abbreviate(linkName) + "' is not a link name: "
                    + e.getMessage(), e);
        }

        String sp = "model.specification";
        Map<String, Object> s = JsonFields.object(m, "specification", path);
        String response = JsonFields.string(s, "response", sp);
        String trials = JsonFields.stringOrNull(s, "trials", sp);
        String weights = JsonFields.stringOrNull(s, "weights", sp);
        String offset = JsonFields.stringOrNull(s, "offset", sp);
        String logOffset = JsonFields.stringOrNull(s, "logOffset", sp);
        boolean intercept = JsonFields.bool(s, "intercept", sp);
        boolean dropIncomplete = JsonFields.bool(s, "dropIncompleteRows", sp);
        List<Object> rawTerms = JsonFields.array(s, "terms", sp);
        List<ScoringTerm> terms = new ArrayList<>();
        long p = intercept ? 1 : 0;
        for (int i = 0; i < rawTerms.size(); i++) {
            String tp = JsonFields.element(sp + ".terms", i);
            ScoringTerm t = ScoringTerm.fromJson(rawTerms.get(i), tp, 0);
            p += t.columnCount();
            if (p > ScoringTerm.MAX_COLUMNS) {
                throw new ArtifactException(tp, "the terms make more than " + ScoringTerm.MAX_COLUMNS + " columns");
            }
            terms.add(t);
        }

        List<Object> rawColumns = JsonFields.array(m, "columns", path);
        if (rawColumns.size() != p) {
            throw new ArtifactException("model.columns", "expected " + p + " column names (from the intercept and"
                    + " the terms), found " + rawColumns.size());
        }
        List<String> expectedNames = new ArrayList<>();
        if (intercept) {
            expectedNames.add("intercept");
        }
        for (ScoringTerm t : terms) {
            expectedNames.addAll(t.columnNames());
        }
        List<String> names = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (int j = 0; j < rawColumns.size(); j++) {
            String cp = JsonFields.element("model.columns", j);
            String name = JsonFields.string(rawColumns.get(j), cp);
            if (!name.equals(expectedNames.get(j))) {
                throw new ArtifactException(cp, "expected '" + abbreviate(expectedNames.get(j))
                        + "' (from the specification's terms), found '" + abbreviate(name) + "'");
            }
            if (!seen.add(name)) {
                throw new ArtifactException(cp, "column '" + name + "' appears twice; a term is repeated");
            }
            names.add(name);
        }
        int cols = (int) p;
        double[] beta = vector(JsonFields.array(m, "coefficients", path), "model.coefficients", cols);
        List<Object> rawCov = JsonFields.array(m, "covariance", path);
        if (rawCov.size() != cols) {
            throw new ArtifactException("model.covariance", "expected " + cols + " rows, found " + rawCov.size());
        }
        double[][] cov = new double[cols][];
        for (int i = 0; i < cols; i++) {
            String rp = JsonFields.element("model.covariance", i);
            cov[i] = vector(JsonFields.array(rawCov.get(i), rp), rp, cols);
        }

        Map<String, Object> d = JsonFields.object(m, "dispersion", path);
        double dispersion = JsonFields.numberOrNull(d, "value", "model.dispersion");
        if (!Double.isNaN(dispersion) && !(dispersion > 0)) {
            throw new ArtifactException("model.dispersion.value", "value " + dispersion + " is not valid; expected a"
                    + " positive number or null");
        }
        String method = JsonFields.string(d, "method", "model.dispersion");

        String fp = "model.fit";
        Map<String, Object> f = JsonFields.object(m, "fit", path);
        long rows = JsonFields.wholeNumber(f, "rows", fp, 0, MAX_ROWS);
        long dropped = JsonFields.wholeNumber(f, "droppedRows", fp, 0, MAX_ROWS);
        double dev = JsonFields.numberOrNull(f, "deviance", fp);
        double nullDev = JsonFields.numberOrNull(f, "nullDeviance", fp);
        long resDf = JsonFields.wholeNumber(f, "residualDf", fp, -MAX_ROWS, MAX_ROWS);
        long nullDf = JsonFields.wholeNumber(f, "nullDf", fp, 0, MAX_ROWS);
        int iterations = JsonFields.integer(f, "iterations", fp, 0, MAX_COUNT);
        boolean converged = JsonFields.bool(f, "converged", fp);
        double ll = JsonFields.numberOrNull(f, "logLikelihood", fp);
        List<Object> rawWarnings = JsonFields.array(f, "warnings", fp);
        List<String> warnings = new ArrayList<>();
        for (int i = 0; i < rawWarnings.size(); i++) {
            warnings.add(JsonFields.string(rawWarnings.get(i), JsonFields.element(fp + ".warnings", i)));
        }

        ModelSpec spec;
        try {
            ModelSpec.Builder b = ModelSpec.builder(response).family(family).link(link).intercept(intercept)
                    .dropIncompleteRows(dropIncomplete);
            if (trials != null) {
                b.trials(trials);
            }
            if (weights != null) {
                b.weights(weights);
            }
            if (offset != null) {
                b.offset(offset);
            }
            if (logOffset != null) {
                b.logOffset(logOffset);
            }
            for (ScoringTerm t : terms) {
                b.term(t.toTerm());
            }
            spec = b.build();
        } catch (ReweighException | IllegalArgumentException e) {
            throw new ArtifactException(sp, "the specification is not valid: " + e.getMessage(), e);
        }
        ScoringModel sm = new ScoringModel(family, link, intercept, terms, names, beta, cov, dispersion, offset,
                logOffset);
        // compiling checks that each column is used one consistent way
        new CompiledDesign(intercept, terms, beta, offset, logOffset);
        return new ModelArtifact(version, libraryVersion, spec, sm, method, rows, dropped, dev, nullDev, resDf, nullDf,
                iterations, converged, ll, warnings);
    }

    private static double[] vector(List<Object> raw, String path, int length) {
        if (raw.size() != length) {
            throw new ArtifactException(path, "expected " + length + " entries (one per column), found " + raw.size());
        }
        double[] out = new double[length];
        for (int j = 0; j < length; j++) {
            out[j] = JsonFields.numberOrNull(raw.get(j), JsonFields.element(path, j));
        }
        return out;
    }

    static String sha256Hex(byte[] bytes) {
        try {
            byte[] h = MessageDigest.getInstance("SHA-256").digest(bytes);
            StringBuilder sb = new StringBuilder(64);
            for (byte x : h) {
                sb.append(Character.forDigit((x >> 4) & 0xf, 16)).append(Character.forDigit(x & 0xf, 16));
            }
            return sb.toString();
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    // ------------------------------------------------------------------ identity

    /**
     * Artifacts are equal when their checksums are: the same content.
     *
     * @param o another object
     * @return true when equal
     * @since 0.1
     */
    @Override
    public boolean equals(Object o) {
        return o instanceof ModelArtifact && ((ModelArtifact) o).checksum.equals(checksum);
    }

    /**
     * Returns a hash code consistent with {@link #equals(Object)}.
     *
     * @return the hash code
     * @since 0.1
     */
    @Override
    public int hashCode() {
        return checksum.hashCode();
    }

    /**
     * Returns a one-line description: family, link, columns, format and checksum prefix.
     *
     * @return a description
     * @since 0.1
     */
    @Override
    public String toString() {
        return "Model artifact of " + spec.response() + " (" + scoring.family.name() + " family, " + scoring.link.name()
                + " link, " + scoring.columnNames.size() + " columns; format " + formatVersion + ", written by "
                + libraryVersion + ", checksum " + checksum.substring(0, Math.min(12, checksum.length())) + ")";
    }
}
