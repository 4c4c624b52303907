package org.targetbench.formats;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.source.SourceException;

import java.lang.reflect.Field;
import java.lang.reflect.Modifier;
import java.util.Iterator;
import java.util.Map;

/**
 * A config object (one of the house's config classes: public documented fields, {@code copy()}, {@code checkValidity()})
 * as JSON and back, field by field, so that a session keeps every setting without a list of names to keep up to date.
 * Fields: numbers, booleans, strings, enums (by constant name), arrays of doubles or ints, and nested config objects
 * (such as a detector's refinement settings). A non-finite double is written as the text "NaN", "Infinity" or
 * "-Infinity". Reading sets only the fields the JSON names and refuses a name the class does not have, a value of the
 * wrong kind or an unknown enum constant, with one line; the caller checks the result with {@code checkValidity()}.
 */
public final class ConfigJson {
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private ConfigJson() {}

    private static boolean kept(Field f) {
        int m = f.getModifiers();
        return Modifier.isPublic(m) && !Modifier.isStatic(m) && !Modifier.isFinal(m) && !f.isSynthetic();
    }

    /** Every public settable field of {@code config}. */
    public static ObjectNode toJson(Object config) {
        ObjectNode o = MAPPER.createObjectNode();
        for (Field f : config.getClass().getFields()) {
            if (!kept(f)) continue;
            try {
                put(o, f.getName(), f.getType(), f.get(config));
            } catch (IllegalAccessException e) {
                throw new IllegalStateException(e);
            }
        }
        return o;
    }

    private static void put(ObjectNode o, String k, Class<?> t, Object v) {
        if (v == null) o.putNull(k);
        else if (t == double.class || t == Double.class) putDouble(o, k, (Double) v);
        else if (t == float.class || t == Float.class) putDouble(o, k, ((Float) v).doubleValue());
        else if (t == int.class || t == Integer.class) o.put(k, (Integer) v);
        else if (t == long.class || t == Long.class) o.put(k, (Long) v);
        else if (t == boolean.class || t == Boolean.class) o.put(k, (Boolean) v);
        else if (t == String.class) o.put(k, (String) v);
        else if (t.isEnum()) o.put(k, ((Enum<?>) v).name());
        else if (t == double[].class) {
            ArrayNode a = o.putArray(k);
            for (double d : (double[]) v) {
                if (Double.isFinite(d)) a.add(d);
                else a.add(Double.toString(d));
            }
        } else if (t == int[].class) {
            ArrayNode a = o.putArray(k);
            for (int i : (int[]) v) a.add(i);
        } else o.set(k, toJson(v));
    }

    private static void putDouble(ObjectNode o, String k, double d) {
        if (Double.isFinite(d)) o.put(k, d);
        else o.put(k, Double.toString(d));
    }

    /**
     * Sets the fields of {@code config} that {@code json} names.
     *
     * @param what names the settings in a refusal, e.g. "detectors.harris"
     * @throws SourceException one line naming the key that cannot be read
     */
    public static void fill(Object config, JsonNode json, String what) throws SourceException {
        if (json == null || json.isNull() || json.isMissingNode()) return;
        if (!json.isObject()) throw new SourceException(what + " must be an object");
        for (Iterator<Map.Entry<String, JsonNode>> it = json.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            Field f;
            try {
                f = config.getClass().getField(e.getKey());
            } catch (NoSuchFieldException x) {
                throw new SourceException(what + ": no setting named \"" + e.getKey() + "\"");
            }
            if (!kept(f)) throw new SourceException(what + ": \"" + e.getKey() + "\" cannot be set");
            try {
                set(config, f, e.getValue(), what + "." + e.getKey());
            } catch (IllegalAccessException x) {
                throw new IllegalStateException(x);
            }
        }
    }

    private static void set(Object config, Field f, JsonNode v, String where) throws SourceException, IllegalAccessException {
        Class<?> t = f.getType();
        if (t == double.class) f.setDouble(config, number(v, where));
        else if (t == float.class) f.setFloat(config, (float) number(v, where));
        else if (t == int.class) f.setInt(config, integer(v, where));
        else if (t == long.class) {
            if (!v.canConvertToLong() || !v.isIntegralNumber()) throw new SourceException(where + " must be a whole number, got " + v);
            f.setLong(config, v.asLong());
        } else if (t == boolean.class) {
            if (!v.isBoolean()) throw new SourceException(where + " must be true or false, got " + v);
            f.setBoolean(config, v.asBoolean());
        } else if (t == String.class) f.set(config, v.isNull() ? null : v.asText());
        else if (t.isEnum()) f.set(config, constant(t, v, where));
        else if (t == double[].class) {
            if (!v.isArray()) throw new SourceException(where + " must be a list of numbers");
            double[] a = new double[v.size()];
            for (int i = 0; i < a.length; i++) a[i] = number(v.get(i), where);
            f.set(config, a);
        } else if (t == int[].class) {
            if (!v.isArray()) throw new SourceException(where + " must be a list of whole numbers");
            int[] a = new int[v.size()];
            for (int i = 0; i < a.length; i++) a[i] = integer(v.get(i), where);
            f.set(config, a);
        } else {
            Object nested = f.get(config);
            if (nested == null) throw new SourceException(where + " cannot be read into an empty setting");
            fill(nested, v, where);
        }
    }

    private static double number(JsonNode v, String where) throws SourceException {
        if (v.isNumber()) return v.asDouble();
        if (v.isTextual()) switch (v.asText()) {
            case "NaN": return Double.NaN;
            case "Infinity": return Double.POSITIVE_INFINITY;
            case "-Infinity": return Double.NEGATIVE_INFINITY;
            default: break;
        }
        throw new SourceException(where + " must be a number, got " + v);
    }

    private static int integer(JsonNode v, String where) throws SourceException {
        if (!v.isIntegralNumber() || !v.canConvertToInt()) throw new SourceException(where + " must be a whole number, got " + v);
        return v.asInt();
    }

    @SuppressWarnings({"unchecked", "rawtypes"})
    private static Object constant(Class<?> t, JsonNode v, String where) throws SourceException {
        try {
            return Enum.valueOf((Class) t, v.asText());
        } catch (IllegalArgumentException e) {
            throw new SourceException(where + ": unknown value \"" + v.asText() + "\"");
        }
    }
}
