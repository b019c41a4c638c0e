package dev.reweigh.core.artifact;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Test-side editing of artifact documents: parse to maps and lists, change, and sign again with
 * the checksum as the format documents it (SHA-256 of compact JSON with sorted member names,
 * whole numbers in decimal, other numbers by Double.toString), written here independently of the
 * library's own code so that it also checks the documented definition.
 */
final class ArtifactText {
    private static final JsonFactory JSON = new JsonFactory();

    private ArtifactText() {
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> parse(String json) {
        try (JsonParser p = JSON.createParser(json)) {
            return (Map<String, Object>) read(p, p.nextToken());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static Object read(JsonParser p, JsonToken t) throws IOException {
        switch (t) {
            case START_OBJECT: {
                Map<String, Object> m = new LinkedHashMap<>();
                while (p.nextToken() == JsonToken.FIELD_NAME) {
                    String k = p.currentName();
                    m.put(k, read(p, p.nextToken()));
                }
                return m;
            }
            case START_ARRAY: {
                List<Object> a = new ArrayList<>();
                JsonToken v;
                while ((v = p.nextToken()) != JsonToken.END_ARRAY) {
                    a.add(read(p, v));
                }
                return a;
            }
            case VALUE_STRING:
                return p.getText();
            case VALUE_NUMBER_INT:
                return p.getLongValue();
            case VALUE_NUMBER_FLOAT:
                return p.getDoubleValue();
            case VALUE_TRUE:
                return true;
            case VALUE_FALSE:
                return false;
            default:
                return null;
        }
    }

    /** Writes the document with a fresh checksum over its content. */
    @SuppressWarnings("unchecked")
    static String signed(Map<String, Object> doc) {
        Map<String, Object> content = new LinkedHashMap<>(doc);
        content.remove("checksum");
        String hex = sha256(write(content, true));
        Map<String, Object> out = new LinkedHashMap<>(content);
        Map<String, Object> c = new LinkedHashMap<>();
        c.put("algorithm", "SHA-256");
        c.put("value", hex);
        out.put("checksum", c);
        return new String(write(out, false), StandardCharsets.UTF_8);
    }

    /** Writes the document as it is (checksum untouched). */
    static String unsigned(Map<String, Object> doc) {
        return new String(write(doc, false), StandardCharsets.UTF_8);
    }

    private static byte[] write(Object v, boolean sorted) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try (JsonGenerator g = JSON.createGenerator(out)) {
            write(g, v, sorted);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toByteArray();
    }

    @SuppressWarnings("unchecked")
    private static void write(JsonGenerator g, Object v, boolean sorted) throws IOException {
        if (v == null) {
            g.writeNull();
        } else if (v instanceof Map) {
            g.writeStartObject();
            Map<String, Object> m = sorted ? new TreeMap<>((Map<String, Object>) v) : (Map<String, Object>) v;
            for (Map.Entry<String, Object> e : m.entrySet()) {
                g.writeFieldName(e.getKey());
                write(g, e.getValue(), sorted);
            }
            g.writeEndObject();
        } else if (v instanceof List) {
            g.writeStartArray();
            for (Object o : (List<Object>) v) {
                write(g, o, sorted);
            }
            g.writeEndArray();
        } else if (v instanceof String) {
            g.writeString((String) v);
        } else if (v instanceof Long || v instanceof Integer) {
            g.writeNumber(((Number) v).longValue());
        } else if (v instanceof Double) {
            g.writeNumber(Double.toString((Double) v));
        } else {
            g.writeBoolean((Boolean) v);
        }
    }

    static String sha256(byte[] b) {
        try {
            StringBuilder sb = new StringBuilder();
            for (byte x : MessageDigest.getInstance("SHA-256").digest(b)) {
                sb.append(String.format("%02x", x & 0xff));
            }
            return sb.toString();
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> object(Map<String, Object> m, String... path) {
        Map<String, Object> cur = m;
        for (String k : path) {
            cur = (Map<String, Object>) cur.get(k);
        }
        return cur;
    }
}
