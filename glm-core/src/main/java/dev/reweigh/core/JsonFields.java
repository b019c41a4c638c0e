package dev.reweigh.core;

import java.util.List;
import java.util.Map;

/**
 * Typed reading of a {@link JsonDoc} tree, with messages naming the field's path and what was
 * expected. Fields of the current format version are required; unknown fields are ignored.
 */
final class JsonFields {
    private JsonFields() {
    }

    static String child(String path, String key) {
        return path.isEmpty() ? key : path + "." + key;
    }

    static String element(String path, int index) {
        return path + "[" + index + "]";
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> object(Object node, String path) {
        if (!(node instanceof Map)) {
            throw wrongType(path, "an object", node);
        }
        return (Map<String, Object>) node;
    }

    @SuppressWarnings("unchecked")
    static List<Object> array(Object node, String path) {
        if (!(node instanceof List)) {
            throw wrongType(path, "an array", node);
        }
        return (List<Object>) node;
    }

    static Object required(Map<String, Object> m, String key, String path) {
        if (!m.containsKey(key)) {
            throw new ArtifactException(child(path, key), "the field is missing");
        }
        return m.get(key);
    }

    static Map<String, Object> object(Map<String, Object> m, String key, String path) {
        return object(required(m, key, path), child(path, key));
    }

    static List<Object> array(Map<String, Object> m, String key, String path) {
        return array(required(m, key, path), child(path, key));
    }

    static String string(Map<String, Object> m, String key, String path) {
        Object v = required(m, key, path);
        return string(v, child(path, key));
    }

    static String string(Object v, String path) {
        if (!(v instanceof String)) {
            throw wrongType(path, "a string", v);
        }
        return (String) v;
    }

    static String stringOrNull(Map<String, Object> m, String key, String path) {
        Object v = required(m, key, path);
        return v == null ? null : string(v, child(path, key));
    }

    static boolean bool(Map<String, Object> m, String key, String path) {
        Object v = required(m, key, path);
        if (!(v instanceof Boolean)) {
            throw wrongType(child(path, key), "true or false", v);
        }
        return (Boolean) v;
    }

    static double number(Object v, String path) {
        if (!(v instanceof Long || v instanceof Double)) {
            throw wrongType(path, "a number", v);
        }
        return ((Number) v).doubleValue();
    }

    static double number(Map<String, Object> m, String key, String path) {
        return number(required(m, key, path), child(path, key));
    }

    /** A number, or NaN for null (a value that was not available when the artifact was written). */
    static double numberOrNull(Map<String, Object> m, String key, String path) {
        Object v = required(m, key, path);
        return v == null ? Double.NaN : number(v, child(path, key));
    }

    static double numberOrNull(Object v, String path) {
        return v == null ? Double.NaN : number(v, path);
    }

    static int integer(Map<String, Object> m, String key, String path, int min, int max) {
        return (int) wholeNumber(m, key, path, min, max);
    }

    static long wholeNumber(Map<String, Object> m, String key, String path, long min, long max) {
        Object v = required(m, key, path);
        String p = child(path, key);
        if (!(v instanceof Long)) {
            throw wrongType(p, "a whole number from " + min + " to " + max, v);
        }
        long x = (Long) v;
        if (x < min || x > max) {
            throw new ArtifactException(p, "value " + x + " is out of range; expected a whole number from " + min
                    + " to " + max);
        }
        return x;
    }

    static ArtifactException wrongType(String path, String expected, Object found) {
        return new ArtifactException(path, "expected " + expected + ", found " + describe(found));
    }

    static String describe(Object v) {
        if (v == null) {
            return "null";
        }
        if (v instanceof Map) {
            return "an object";
        }
        if (v instanceof List) {
            return "an array";
        }
        if (v instanceof String) {
            String s = (String) v;
            return "the string \"" + (s.length() > 40 ? s.substring(0, 40) + "..." : s) + "\"";
        }
        if (v instanceof Boolean) {
            return "the boolean " + v;
        }
        return "the number " + v;
    }
}
