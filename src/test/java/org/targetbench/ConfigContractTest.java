package org.targetbench;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.lang.reflect.Field;
import java.lang.reflect.Modifier;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Every config class (a concrete {@code *Config} class in the main sources): {@code copy()} carries every public field,
 * found by reflection and set to a value other than its default, and shares nothing mutable with the original; and
 * {@code checkValidity()} rejects a bad value of each field that has one.
 */
class ConfigContractTest {
    private static final Path MAIN = Path.of("src/main/java");
    /**
     * Fields for which every value of their type is valid (seeds), or whose NaN has a meaning (documented on the
     * field), so there is no bad value to reject.
     */
    private static final Set<String> ANY_VALUE = Set.of("seed", "noiseSigmaPx");

    static Stream<Class<?>> configs() throws Exception {
        List<Class<?>> out = new ArrayList<>();
        try (Stream<Path> s = Files.walk(MAIN)) {
            for (Path p : s.filter(f -> f.getFileName().toString().endsWith("Config.java")).sorted().toList()) {
                String name = MAIN.relativize(p).toString().replace('/', '.').replaceAll("\\.java$", "");
                Class<?> c = Class.forName(name);
                if (!Modifier.isAbstract(c.getModifiers()) && !c.isInterface() && !c.isEnum()) out.add(c);
            }
        }
        assertTrue(out.size() >= 15, "config classes found: " + out);
        return out.stream();
    }

    @ParameterizedTest
    @MethodSource("configs")
    void copyCarriesEveryFieldAndSharesNothing(Class<?> type) throws Exception {
        Object c = type.getConstructor().newInstance();
        Object defaults = type.getConstructor().newInstance();
        List<Field> fields = publicFields(type);
        assertFalse(fields.isEmpty(), type.getSimpleName());
        for (Field f : fields) {
            f.set(c, other(f.getType(), f.get(c)));
            assertFalse(deepEquals(f.get(c), f.get(defaults)), type.getSimpleName() + "." + f.getName() + " was not changed by the test");
        }
        Object copy = type.getMethod("copy").invoke(c);
        assertSame(type, copy.getClass());
        for (Field f : fields) {
            assertTrue(deepEquals(f.get(c), f.get(copy)), type.getSimpleName() + ".copy() loses " + f.getName());
            Object v = f.get(c);
            if (v != null && !(v instanceof Number || v instanceof Boolean || v instanceof String || v instanceof Enum<?> || v instanceof Character))
                assertNotSame(v, f.get(copy), type.getSimpleName() + ".copy() shares the mutable " + f.getName());
        }
    }

    @ParameterizedTest
    @MethodSource("configs")
    void checkValidityRejectsEachBadField(Class<?> type) throws Exception {
        type.getMethod("checkValidity").invoke(valid(type)); // the defaults (with the lists a run needs) are valid
        for (Field f : publicFields(type)) {
            if (ANY_VALUE.contains(f.getName())) continue;
            Object bad = bad(f.getType());
            if (bad == null) continue; // no scalar bad value for this type (lists, nested configs check themselves)
            Object c = valid(type);
            f.set(c, bad);
            var e = assertThrows(java.lang.reflect.InvocationTargetException.class, () -> type.getMethod("checkValidity").invoke(c),
                    type.getSimpleName() + ".checkValidity() accepts " + f.getName() + " = " + bad);
            assertInstanceOf(IllegalArgumentException.class, e.getCause(), type.getSimpleName() + "." + f.getName());
        }
    }

    /** The defaults, with the lists a sweep needs filled in. */
    private static Object valid(Class<?> type) throws Exception {
        Object c = type.getConstructor().newInstance();
        if (c instanceof org.targetbench.pipeline.SweepConfig s) {
            s.detectors.add(new org.targetbench.detect.HarrisConfig());
            s.parameters.add(org.targetbench.perturb.Perturbation.values()[0]);
        }
        return c;
    }

    private static List<Field> publicFields(Class<?> type) {
        List<Field> out = new ArrayList<>();
        for (Field f : type.getFields())
            if (!Modifier.isStatic(f.getModifiers()) && !Modifier.isFinal(f.getModifiers())) out.add(f);
        return out;
    }

    /** A value of the type other than {@code v}. */
    private static Object other(Class<?> t, Object v) throws Exception {
        if (t == double.class || t == Double.class) return v == null || Double.isNaN((Double) v) ? 0.75 : (Double) v + 0.375;
        if (t == int.class || t == Integer.class) return v == null ? 3 : (Integer) v + 1;
        if (t == long.class || t == Long.class) return v == null ? 3L : (Long) v + 1;
        if (t == float.class) return (Float) v + 0.375f;
        if (t == boolean.class || t == Boolean.class) return v == null || !(Boolean) v;
        if (t == String.class) return v + "x";
        if (t.isEnum()) {
            Object[] cs = t.getEnumConstants();
            return cs[(Arrays.asList(cs).indexOf(v) + 1) % cs.length];
        }
        if (t == double[].class) {
            double[] a = v == null ? new double[]{0.125, 0.25, 0.375, 0.5, 0.625, 0.75} : ((double[]) v).clone();
            for (int i = 0; i < a.length; i++) a[i] += 0.375;
            return a;
        }
        if (t == int[].class) {
            int[] a = ((int[]) v).clone();
            for (int i = 0; i < a.length; i++) a[i] += 1;
            return a;
        }
        if (List.class.isAssignableFrom(t)) {
            List<Object> l = new ArrayList<>((List<?>) v);
            l.add(listElement(l));
            return l;
        }
        if (Map.class.isAssignableFrom(t)) {
            Map<Object, Object> m = new LinkedHashMap<>((Map<?, ?>) v);
            m.put(org.targetbench.perturb.Perturbation.values()[0], new double[]{0.5});
            return m;
        }
        // a nested config: a copy of the current one with its first field changed
        Object n = v != null ? t.getMethod("copy").invoke(v) : t.getConstructor().newInstance();
        Field f = publicFields(t).get(0);
        f.set(n, other(f.getType(), f.get(n)));
        return n;
    }

    private static Object listElement(List<Object> l) {
        if (!l.isEmpty() && l.get(0) instanceof org.targetbench.perturb.Perturbation) return org.targetbench.perturb.Perturbation.values()[1];
        return new org.targetbench.detect.HarrisConfig(); // the only other list of a config holds detectors
    }

    /** A value no config accepts for a field of this type, or null. */
    private static Object bad(Class<?> t) {
        if (t == double.class || t == Double.class) return Double.NaN;
        if (t == int.class || t == Integer.class) return Integer.MIN_VALUE;
        return null;
    }

    static boolean deepEquals(Object a, Object b) throws IllegalAccessException {
        if (a == b) return true;
        if (a == null || b == null) return false;
        if (a instanceof double[] x) return Arrays.equals(x, (double[]) b);
        if (a instanceof int[] x) return Arrays.equals(x, (int[]) b);
        if (a instanceof List<?> x) {
            List<?> y = (List<?>) b;
            if (x.size() != y.size()) return false;
            for (int i = 0; i < x.size(); i++) if (!deepEquals(x.get(i), y.get(i))) return false;
            return true;
        }
        if (a instanceof Map<?, ?> x) {
            Map<?, ?> y = (Map<?, ?>) b;
            if (!x.keySet().equals(y.keySet())) return false;
            for (var k : x.keySet()) if (!deepEquals(x.get(k), y.get(k))) return false;
            return true;
        }
        if (a.getClass().getSimpleName().endsWith("Config")) {
            if (a.getClass() != b.getClass()) return false;
            for (Field f : publicFields(a.getClass())) if (!deepEquals(f.get(a), f.get(b))) return false;
            return true;
        }
        return a.equals(b);
    }
}
