package dev.reweigh.core;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * A small JSON document model on Jackson's streaming API: objects are {@code LinkedHashMap}s
 * (document order), arrays {@code ArrayList}s, numbers {@code Long} (integer tokens that fit) or
 * {@code Double}, plus {@code String}, {@code Boolean} and null.
 *
 * <p><b>Canonical form</b> (what the artifact checksum covers): compact UTF-8 JSON without
 * whitespace, object members sorted by key (String.compareTo), integers in plain decimal, other
 * numbers as Double.toString of their value (the shortest text that reads back to the same
 * double in Java), strings with Jackson's standard escaping.
 */
final class JsonDoc {
    /** Nesting allowed in an artifact (interactions nest; nothing legitimate comes near this). */
    static final int MAX_DEPTH = 64;

    private static final JsonFactory FACTORY = JsonFactory.builder()
            .streamReadConstraints(StreamReadConstraints.builder()
                    .maxNestingDepth(MAX_DEPTH)
                    .maxNumberLength(64)
                    .build())
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .build();

    private JsonDoc() {
    }

    /**
     * Parses a whole document.
     *
     * @throws ArtifactException when the text is not one complete JSON value
     */
    static Object parse(byte[] bytes) {
        try (JsonParser p = FACTORY.createParser(bytes)) {
            JsonToken first = p.nextToken();
            if (first == null) {
                throw new ArtifactException("document", "the artifact is empty; expected a JSON object");
            }
            Object value = read(p, first);
            JsonToken extra = p.nextToken();
            if (extra != null) {
                throw new ArtifactException("document", "unexpected content after the end of the JSON object, at "
                        + where(p.currentLocation()));
            }
            return value;
        } catch (JsonProcessingException e) {
            String msg = e.getOriginalMessage();
            JsonLocation loc = e.getLocation();
            boolean truncated = msg != null && msg.toLowerCase(java.util.Locale.ROOT).contains("end-of-input");
            throw new ArtifactException("document", (truncated ? "the artifact ends too early (truncated file?): "
                    : "the artifact is not valid JSON: ") + firstLine(msg)
                    + (loc == null ? "" : " at " + where(loc)), e);
        } catch (IOException e) {
            throw new ArtifactException("document", "the artifact cannot be decoded: " + firstLine(e.getMessage()), e);
        }
    }

    private static String firstLine(String s) {
        if (s == null) {
            return "(no detail)";
        }
        int nl = s.indexOf('\n');
        String line = nl < 0 ? s : s.substring(0, nl);
        return line.length() > 200 ? line.substring(0, 200) + "..." : line;
    }

    private static String where(JsonLocation loc) {
        return "line " + loc.getLineNr() + ", column " + loc.getColumnNr();
    }

    private static Object read(JsonParser p, JsonToken t) throws IOException {
        switch (t) {
            case START_OBJECT: {
                Map<String, Object> m = new LinkedHashMap<>();
                JsonToken k;
                while ((k = p.nextToken()) == JsonToken.FIELD_NAME) {
                    String name = p.currentName();
                    JsonToken v = p.nextToken();
                    if (v == null) {
                        throw new ArtifactException("document", "the artifact ends too early (truncated file?)");
                    }
                    m.put(name, read(p, v));
                }
                if (k != JsonToken.END_OBJECT) {
                    throw new ArtifactException("document", "the artifact ends too early (truncated file?)");
                }
                return m;
            }
            case START_ARRAY: {
                List<Object> a = new ArrayList<>();
                JsonToken v;
                while ((v = p.nextToken()) != JsonToken.END_ARRAY) {
                    if (v == null) {
                        throw new ArtifactException("document", "the artifact ends too early (truncated file?)");
                    }
                    a.add(read(p, v));
                }
                return a;
            }
            case VALUE_STRING:
                return p.getText();
            case VALUE_NUMBER_INT:
                if (p.getNumberType() == JsonParser.NumberType.INT || p.getNumberType() == JsonParser.NumberType.LONG) {
                    return p.getLongValue();
                }
                return finite(p);
            case VALUE_NUMBER_FLOAT:
                return finite(p);
            case VALUE_TRUE:
                return Boolean.TRUE;
            case VALUE_FALSE:
                return Boolean.FALSE;
            case VALUE_NULL:
                return null;
            default:
                throw new ArtifactException("document", "unexpected JSON token " + t + " at "
                        + where(p.currentLocation()));
        }
    }

    private static double finite(JsonParser p) throws IOException {
        double d = p.getDoubleValue();
        if (!Double.isFinite(d)) {
            throw new ArtifactException("document", "the number " + p.getText() + " at " + where(p.currentLocation())
                    + " is outside the range of a double; expected a finite number");
        }
        return d;
    }

    /** The document, indented for people to read (members in their given order). */
    static byte[] pretty(Object tree) {
        return write(tree, false);
    }

    /** The canonical form (see the class comment). */
    static byte[] canonical(Object tree) {
        return write(tree, true);
    }

    private static byte[] write(Object tree, boolean canonical) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try (JsonGenerator g = FACTORY.createGenerator(out)) {
            if (!canonical) {
                DefaultPrettyPrinter pp = new DefaultPrettyPrinter()
                        .withObjectIndenter(new DefaultIndenter("  ", "\n"))
                        .withArrayIndenter(DefaultPrettyPrinter.FixedSpaceIndenter.instance);
                g.setPrettyPrinter(pp);
            }
            write(g, tree, canonical);
            if (!canonical) {
                g.writeRaw('\n');
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e); // writing to memory does not fail
        }
        return out.toByteArray();
    }

    @SuppressWarnings("unchecked")
    private static void write(JsonGenerator g, Object v, boolean canonical) throws IOException {
        if (v == null) {
            g.writeNull();
        } else if (v instanceof Map) {
            Map<String, Object> m = (Map<String, Object>) v;
            g.writeStartObject();
            for (Map.Entry<String, Object> e : (canonical ? new TreeMap<>(m) : m).entrySet()) {
                g.writeFieldName(e.getKey());
                write(g, e.getValue(), canonical);
            }
            g.writeEndObject();
        } else if (v instanceof List) {
            g.writeStartArray();
            for (Object o : (List<Object>) v) {
                write(g, o, canonical);
            }
            g.writeEndArray();
        } else if (v instanceof String) {
            g.writeString((String) v);
        } else if (v instanceof Long || v instanceof Integer) {
            g.writeNumber(((Number) v).longValue());
        } else if (v instanceof Double) {
            double d = (Double) v;
            if (!Double.isFinite(d)) {
                throw new IllegalStateException("a non-finite number cannot be written to JSON: " + d);
            }
            g.writeNumber(Double.toString(d));
        } else if (v instanceof Boolean) {
            g.writeBoolean((Boolean) v);
        } else {
            throw new IllegalStateException("not a JSON value: " + v.getClass());
        }
    }
}
