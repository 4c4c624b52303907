package org.targetbench.source;

import java.nio.file.Files;
import java.nio.file.Path;

/** The one-line message for an input path that is not what it should be: missing, a folder for a file, and so on. */
public final class Missing {
    private Missing() {}

    /** For a path that should be a readable file; {@code what} says what it is ("file", "video", "servo set"). */
    public static SourceException file(Path p, String what) {
        if (Files.isSymbolicLink(p) && !Files.exists(p)) return new SourceException(what + " " + p + " is a dangling link (its target does not exist)");
        if (Files.isDirectory(p)) return new SourceException(what + " " + p + " is a folder, expected a file");
        if (Files.exists(p)) return new SourceException(what + " " + p + " is not a regular file");
        return new SourceException(what + " not found: " + p);
    }

    /** For a path that should be a folder. */
    public static SourceException folder(Path p, String what) {
        if (Files.exists(p) && !Files.isDirectory(p)) return new SourceException(what + " " + p + " is a file, expected a folder");
        return new SourceException(what + " not found: " + p);
    }
}
