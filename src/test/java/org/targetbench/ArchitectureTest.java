package org.targetbench;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Layering rule: the algorithm packages touch no screens, windows, files or devices; only source, export, report,
 * cli and app do. Checked on the source text of every class in those packages.
 */
class ArchitectureTest {
    /** Imports an algorithm package may not use: Swing, AWT (windows and images), image I/O and file I/O. */
    private static final Pattern FORBIDDEN = Pattern.compile(
            "^import\\s+(static\\s+)?(javax\\.swing|java\\.awt|javax\\.imageio|java\\.io\\.File|java\\.io\\.(Buffered)?(Reader|Writer|InputStream|OutputStream)|java\\.io\\.FileInputStream|java\\.nio\\.file|java\\.nio\\.channels|com\\.github\\.sarxos|org\\.jcodec|org\\.apache\\.pdfbox)",
            Pattern.MULTILINE);
    /** Fully qualified uses that would dodge the import check. */
    private static final Pattern FORBIDDEN_INLINE = Pattern.compile("\\b(javax\\.swing|java\\.awt|javax\\.imageio|java\\.nio\\.file)\\.");
    private static final Path MAIN = Path.of("src/main/java/org/targetbench");

    @ParameterizedTest
    @ValueSource(strings = {"target", "camera", "perturb", "detect", "track", "register", "score", "select", "servo", "pipeline"})
    void algorithmPackagesTouchNoScreensOrFiles(String pkg) throws IOException {
        Path dir = MAIN.resolve(pkg);
        if (!Files.isDirectory(dir)) return; // a package not written yet has nothing to break
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

    @ParameterizedTest
    @ValueSource(strings = {"target", "camera", "detect", "track", "score", "source", "export"})
    void packagesExistWithClasses(String pkg) throws IOException {
        try (Stream<Path> s = Files.list(MAIN.resolve(pkg))) {
            assertTrue(s.anyMatch(p -> p.toString().endsWith(".java")));
        }
    }
}
