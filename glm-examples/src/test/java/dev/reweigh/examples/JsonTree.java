package dev.reweigh.examples;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Reads JSON text into maps, lists, strings, doubles, booleans and nulls (tests only; jackson-core streaming). */
final class JsonTree {
    private JsonTree() {
    }

    static Object parse(String text) {
        try (JsonParser p = new JsonFactory().createParser(text)) {
            p.nextToken();
            Object value = read(p);
            if (p.nextToken() != null) {
                throw new IllegalStateException("more than one JSON value in the text");
            }
            return value;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static Object read(JsonParser p) throws IOException {
        JsonToken t = p.currentToken();
        switch (t) {
            case START_OBJECT: {
                Map<String, Object> m = new LinkedHashMap<>();
                while (p.nextToken() != JsonToken.END_OBJECT) {
                    String name = p.currentName();
                    p.nextToken();
                    m.put(name, read(p));
                }
                return m;
            }
            case START_ARRAY: {
                List<Object> l = new ArrayList<>();
                while (p.nextToken() != JsonToken.END_ARRAY) {
                    l.add(read(p));
                }
                return l;
            }
            case VALUE_STRING:
                return p.getText();
            case VALUE_NUMBER_INT:
            case VALUE_NUMBER_FLOAT:
                return p.getDoubleValue();
            case VALUE_TRUE:
                return Boolean.TRUE;
            case VALUE_FALSE:
                return Boolean.FALSE;
            case VALUE_NULL:
                return null;
            default:
                throw new IllegalStateException("unexpected token " + t);
        }
    }
}
