package org.targetbench;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Layering rules, checked on the source text of every main class:
 * <ol>
 *   <li>Direction: a package imports only packages on or below its own level in {@link #FLOW}, the documented data
 *       flow (DEVELOPERS.md). Every listed package must exist with classes, and every package must be listed.</li>
 *   <li>The algorithm packages touch no screens, windows, files or devices; only source, formats, export, report, cli
 *       and app do.</li>
 * </ol>
 */
class ArchitectureTest {
    /**
     * The package flow, lowest level first; packages in one inner list share a level and may import each other. The
     * root package ({@code org.targetbench}, the version) sits below all of them. New packages go in here at their place
     * in the flow (frame-to-design registration after detect/track, arm kinematics after servo).
     */
    static final List<List<String>> FLOW = List.of(
            List.of("target"),
            List.of("camera"),
            List.of("source"),
            List.of("perturb"),
            List.of("detect", "track"),
            List.of("register"),
            List.of("score"),
            List.of("select"),
            List.of("servo"),
            List.of("arm"),
            List.of("pipeline"),
            List.of("formats", "export", "report"),
            List.of("cli", "app"));

    /** Imports of our own packages, by import statement or by a fully qualified name in code. */
    private static final Pattern OWN = Pattern.compile("\\borg\\.targetbench\\.([a-z][a-z0-9]*)\\.");
    /** Imports an algorithm package may not use: Swing, AWT (windows and images), image I/O and file I/O. */
    private static final Pattern FORBIDDEN = Pattern.compile(
            "^import\\s+(static\\s+)?(javax\\.swing|java\\.awt|javax\\.imageio|java\\.io\\.File|java\\.io\\.(Buffered)?(Reader|Writer|InputStream|OutputStream)|java\\.io\\.FileInputStream|java\\.nio\\.file|java\\.nio\\.channels|com\\.github\\.sarxos|org\\.jcodec|org\\.bytedeco|org\\.apache\\.pdfbox)",
            Pattern.MULTILINE);
    /** Fully qualified uses that would dodge the import check. */
    private static final Pattern FORBIDDEN_INLINE = Pattern.compile("\\b(javax\\.swing|java\\.awt|javax\\.imageio|java\\.nio\\.file)\\.");
    private static final Path MAIN = Path.of("src/main/java/org/targetbench");

    @ParameterizedTest
    @ValueSource(strings = {"target", "camera", "perturb", "detect", "track", "register", "score", "select", "servo", "arm", "pipeline"})
    void algorithmPackagesTouchNoScreensOrFiles(String pkg) throws IOException {
        Path dir = MAIN.resolve(pkg);
        assertTrue(Files.isDirectory(dir), "package " + pkg + " is missing");
        List<String> offences = new ArrayList<>();
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path f : s.filter(p -> p.toString().endsWith(".java")).toList()) {
                String text = Files.readString(f);
                var m = FORBIDDEN.matcher(text);
                while (m.find()) offences.add(f.getFileName() + ": " + m.group().trim());
                var m2 = FORBIDDEN_INLINE.matcher(text.replaceAll("(?m)^import .*$", "").replaceAll("(?s)/\\*.*?\\*/", "").replaceAll("//[^\\n]*", ""));
                while (m2.find()) offences.add(f.getFileName() + ": inline " + m2.group());
            }
        }
        assertEquals(List.of(), offences, "package " + pkg + " must not touch screens or files");
    }

    @Test
    void everyPackageImportsOnlyItsLevelOrBelow() throws IOException {
        assertEquals(List.of(), directionOffences(FLOW, readMain()));
    }

    @Test
    void aWrongImportIsCaught() {
        Map<String, Map<String, String>> classes = new LinkedHashMap<>();
        classes.put("low", Map.of("A.java", "package org.targetbench.low;\nimport org.targetbench.high.B;\nclass A {}"));
        classes.put("high", Map.of("B.java", "package org.targetbench.high;\nimport org.targetbench.low.A;\nclass B {}"));
        List<List<String>> flow = List.of(List.of("low"), List.of("high"));
        assertEquals(List.of("low/A.java imports high (level 1 above its own 0)"), directionOffences(flow, classes));
        // the same wrong use written as a fully qualified name in code, with a comment mentioning another that is fine
        classes.put("low", Map.of("A.java", "package org.targetbench.low;\n// see org.targetbench.high.C\nclass A { Object b = new org.targetbench.high.B(); }"));
        assertEquals(List.of("low/A.java imports high (level 1 above its own 0)"), directionOffences(flow, classes));
        // peers on one level may use each other
        assertEquals(List.of(), directionOffences(List.of(List.of("low", "high")), classes));
    }

    @Test
    void aMissingOrUnlistedPackageIsCaught() {
        Map<String, Map<String, String>> classes = new LinkedHashMap<>();
        classes.put("low", Map.of("A.java", "package org.targetbench.low;\nclass A {}"));
        classes.put("extra", Map.of("E.java", "package org.targetbench.extra;\nclass E {}"));
        assertEquals(List.of("package extra is not in the flow", "package high is listed but has no classes"),
                directionOffences(List.of(List.of("low"), List.of("high")), classes));
    }

    /**
     * Offences against the direction rule, one line each, sorted.
     *
     * @param classes package name to (file name to source text)
     */
    static List<String> directionOffences(List<List<String>> flow, Map<String, Map<String, String>> classes) {
        Map<String, Integer> level = new LinkedHashMap<>();
        for (int i = 0; i < flow.size(); i++) for (String p : flow.get(i)) level.put(p, i);
        Set<String> out = new TreeSet<>();
        for (String p : level.keySet())
            if (classes.getOrDefault(p, Map.of()).isEmpty()) out.add("package " + p + " is listed but has no classes");
        for (var e : classes.entrySet()) {
            String pkg = e.getKey();
            if (!level.containsKey(pkg)) {
                out.add("package " + pkg + " is not in the flow");
                continue;
            }
            for (var c : e.getValue().entrySet()) {
                Matcher m = OWN.matcher(withoutComments(c.getValue()));
                while (m.find()) {
                    String used = m.group(1);
                    Integer l = level.get(used);
                    if (used.equals(pkg) || !level.containsKey(used) && !classes.containsKey(used)) continue; // a class in the root package
                    if (l == null) out.add(pkg + "/" + c.getKey() + " imports " + used + ", which is not in the flow");
                    else if (l > level.get(pkg))
                        out.add(pkg + "/" + c.getKey() + " imports " + used + " (level " + l + " above its own " + level.get(pkg) + ")");
                }
            }
        }
        return new ArrayList<>(out);
    }

    private static String withoutComments(String text) {
        return text.replaceAll("(?s)/\\*.*?\\*/", "").replaceAll("//[^\\n]*", "").replaceAll("(?m)^package .*$", "");
    }

    /** Every main package's classes: package name to (file name to text). */
    private static Map<String, Map<String, String>> readMain() throws IOException {
        Map<String, Map<String, String>> classes = new LinkedHashMap<>();
        try (Stream<Path> dirs = Files.list(MAIN)) {
            for (Path d : dirs.filter(Files::isDirectory).sorted().toList()) {
                Map<String, String> files = new LinkedHashMap<>();
                try (Stream<Path> s = Files.walk(d)) {
                    for (Path f : s.filter(p -> p.toString().endsWith(".java")).sorted().toList())
                        files.put(d.relativize(f).toString(), Files.readString(f));
                }
                classes.put(d.getFileName().toString(), files);
            }
        }
        return classes;
    }
}
