package dev.reweigh.core.artifact;

import dev.reweigh.core.ArtifactException;
import dev.reweigh.core.ModelArtifact;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayInputStream;
import java.util.List;
import java.util.Map;

import static dev.reweigh.core.artifact.ArtifactText.object;
import static dev.reweigh.core.artifact.ArtifactText.parse;
import static dev.reweigh.core.artifact.ArtifactText.signed;
import static dev.reweigh.core.artifact.ArtifactText.unsigned;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Damaged, tampered and future artifacts are refused with the field named; newer minors load. */
class CorruptArtifactTest {

    private static ArtifactException refused(String json) {
        return assertThrows(ArtifactException.class, () -> ModelArtifact.fromJson(json));
    }

    private static void assertMentions(ArtifactException e, String field, String... words) {
        assertEquals(field, e.field(), e.getMessage());
        assertTrue(e.getMessage().contains(field), e.getMessage());
        for (String w : words) {
            assertTrue(e.getMessage().contains(w), "message should mention '" + w + "': " + e.getMessage());
        }
    }

    @Test
    void theSignedTestCopyOfAValidArtifactLoads() {
        // guards the tests below: re-signing with the documented canonical form is accepted
        ModelArtifact a = ModelArtifact.fromJson(signed(parse(Fixtures.JSON)));
        assertEquals(Fixtures.ARTIFACT.checksum(), a.checksum());
    }

    @Test
    void memberOrderAndLayoutDoNotMatterToTheChecksum() {
        Map<String, Object> reversed = reverse(parse(Fixtures.JSON));
        String compact = unsigned(reversed);   // one line, members in reverse order, original checksum
        assertTrue(compact.indexOf("\"checksum\"") < compact.indexOf("\"format\""));
        assertEquals(Fixtures.ARTIFACT.checksum(), ModelArtifact.fromJson(compact).checksum());
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> reverse(Map<String, Object> m) {
        List<String> keys = new java.util.ArrayList<>(m.keySet());
        java.util.Collections.reverse(keys);
        Map<String, Object> out = new java.util.LinkedHashMap<>();
        for (String k : keys) {
            Object v = m.get(k);
            out.put(k, v instanceof Map ? reverse((Map<String, Object>) v) : v);
        }
        return out;
    }

    @Test
    void newerMajorVersionIsRefused() {
        Map<String, Object> d = parse(Fixtures.JSON);
        d.put("formatVersion", "2.0");
        assertMentions(refused(signed(d)), "formatVersion", "2.0", "newer");
    }

    @Test
    void newerMinorVersionWithExtraFieldsLoadsAndScoresTheSame() {
        Map<String, Object> d = parse(Fixtures.JSON);
        d.put("formatVersion", "1.9");
        d.put("producedBy", "a later release");
        object(d, "model").put("calibration", Map.of("method", "isotonic", "points", List.of(1.0, 2.0)));
        object(d, "model", "fit").put("elapsedSeconds", 1.5);
        ModelArtifact a = ModelArtifact.fromJson(signed(d));
        assertEquals("1.9", a.formatVersion());
        ArtifactRoundTripTest.assertBits(Fixtures.FIT.predictMean(Fixtures.FRESH_TABLE),
                a.scorer().score(Fixtures.FRESH_TABLE).mean(), "mean after reading a newer minor version");
    }

    @Test
    void tamperedCoefficientFailsTheChecksum() {
        Map<String, Object> d = parse(Fixtures.JSON);
        @SuppressWarnings("unchecked")
        List<Object> beta = (List<Object>) object(d, "model").get("coefficients");
        beta.set(1, (Double) beta.get(1) + 1e-9);
        assertMentions(refused(unsigned(d)), "checksum.value", "does not match", "changed or damaged");
    }

    @Test
    void tamperedTextFailsTheChecksum() {
        String t = Fixtures.JSON.replace("\"North\"", "\"Norht\"");
        assertTrue(!t.equals(Fixtures.JSON));
        assertMentions(refused(t), "checksum.value", "does not match");
    }

    @Test
    void truncatedFileIsRefused() {
        for (int cut : new int[] {1, 10, Fixtures.JSON.length() / 2, Fixtures.JSON.length() - 3}) {
            ArtifactException e = refused(Fixtures.JSON.substring(0, cut));
            assertMentions(e, "document", "truncated");
        }
    }

    @Test
    void missingFieldIsNamed() {
        Map<String, Object> d = parse(Fixtures.JSON);
        object(d, "model").remove("link");
        assertMentions(refused(signed(d)), "model.link", "missing");
        Map<String, Object> e = parse(Fixtures.JSON);
        object(e, "model", "fit").remove("deviance");
        assertMentions(refused(signed(e)), "model.fit.deviance", "missing");
        Map<String, Object> f = parse(Fixtures.JSON);
        f.remove("checksum");
        assertMentions(refused(unsigned(f)), "checksum", "missing");
    }

    @Test
    void mistypedFieldIsNamedWithWhatWasExpected() {
        Map<String, Object> d = parse(Fixtures.JSON);
        object(d, "model", "fit").put("iterations", "eight");
        assertMentions(refused(signed(d)), "model.fit.iterations", "expected a whole number", "\"eight\"");
        Map<String, Object> e = parse(Fixtures.JSON);
        @SuppressWarnings("unchecked")
        List<Object> beta = (List<Object>) object(e, "model").get("coefficients");
        beta.set(2, "0.5");
        assertMentions(refused(signed(e)), "model.coefficients[2]", "expected a number");
        Map<String, Object> f = parse(Fixtures.JSON);
        object(f, "model", "specification").put("intercept", "yes");
        assertMentions(refused(signed(f)), "model.specification.intercept", "true or false");
    }

    @Test
    void inconsistentContentIsNamed() {
        Map<String, Object> d = parse(Fixtures.JSON);
        @SuppressWarnings("unchecked")
        List<Object> cov = (List<Object>) object(d, "model").get("covariance");
        @SuppressWarnings("unchecked")
        List<Object> row = (List<Object>) cov.get(2);
        row.remove(0);
        assertMentions(refused(signed(d)), "model.covariance[2]", "expected");

        Map<String, Object> e = parse(Fixtures.JSON);
        @SuppressWarnings("unchecked")
        List<Object> names = (List<Object>) object(e, "model").get("columns");
        names.set(1, "region=Atlantis");
        assertMentions(refused(signed(e)), "model.columns[1]", "region=Atlantis");

        Map<String, Object> f = parse(Fixtures.JSON);
        object(f, "model").put("family", "poison");
        assertMentions(refused(signed(f)), "model.family", "poison");

        Map<String, Object> g = parse(Fixtures.JSON);
        @SuppressWarnings("unchecked")
        Map<String, Object> term = (Map<String, Object>) ((List<Object>) object(g, "model", "specification")
                .get("terms")).get(0);
        term.put("reference", "Atlantis");
        assertMentions(refused(signed(g)), "model.specification.terms[0].reference", "Atlantis");

        Map<String, Object> h = parse(Fixtures.JSON);
        object(h, "model", "dispersion").put("value", -1.0);
        assertMentions(refused(signed(h)), "model.dispersion.value", "positive");
    }

    @Test
    void aNumberBeyondTheRangeOfADoubleIsRefused() {
        // found by ArtifactFuzzTest: a flipped exponent digit made a number overflow to infinity
        String t = Fixtures.JSON.replaceFirst("\"deviance\" : [0-9.Ee+-]+", "\"deviance\" : 1.0E999");
        assertTrue(t.contains("1.0E999"));
        assertMentions(refused(t), "document", "1.0E999", "finite number");
    }

    @Test
    void hostileSizesAreRefusedWithoutBuildingThem() {
        // a signed artifact whose terms would make 10^14 columns: refused from the counts alone
        Map<String, Object> d = parse(Fixtures.JSON);
        Map<String, Object> big = Map.of("kind", "polynomial", "column", "age", "degree", 10_000_000L,
                "orthogonal", false);
        @SuppressWarnings("unchecked")
        List<Object> terms = (List<Object>) object(d, "model", "specification").get("terms");
        terms.add(Map.of("kind", "interaction", "left", big, "right", big));
        long t0 = System.nanoTime();
        ArtifactException e = refused(signed(d));
        assertTrue(e.field().startsWith("model.specification.terms[" + (terms.size() - 1) + "]"), e.getMessage());
        assertTrue(System.nanoTime() - t0 < 5_000_000_000L, "refused promptly");
    }

    @Test
    void garbageAndStrangersAreRefused() {
        assertMentions(refused("hello"), "document", "not valid JSON");
        assertMentions(refused(""), "document", "empty");
        assertMentions(refused("[1, 2, 3]"), "document", "expected an object");
        assertMentions(refused("{\"a\": 1} {\"b\": 2}"), "document", "after the end");
        Map<String, Object> d = parse(Fixtures.JSON);
        d.put("format", "something-else");
        assertMentions(refused(signed(d)), "format", "not a Reweigh model artifact");
        assertThrows(ArtifactException.class,
                () -> ModelArtifact.read(new ByteArrayInputStream(new byte[] {(byte) 0xff, (byte) 0xfe, 0, 0x7b})));
    }
}
