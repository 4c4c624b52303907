package org.targetbench.export;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Comparator;
import java.util.List;
import java.util.UUID;
import java.util.stream.Stream;

/**
 * An output folder written all at once or not at all. Files are written into a hidden staging folder beside the
 * target; {@link #commit()} moves each one into place with an atomic rename, and {@link #close()} without a commit
 * deletes the staging folder. So a failed or interrupted run leaves no partial files in the output folder.
 */
public final class AtomicOutput implements AutoCloseable {
    private final Path target;
    private final Path staging;
    private final boolean createdTarget;
    /** Folder inside the output that {@link #file} resolves against ("" at the top); set on views made by {@link #sub}. */
    private final String prefix;
    private final AtomicOutput root;
    private boolean committed;

    private AtomicOutput(Path target, Path staging, boolean createdTarget) {
        this.target = target;
        this.staging = staging;
        this.createdTarget = createdTarget;
        this.prefix = "";
        this.root = this;
    }

    private AtomicOutput(AtomicOutput root, String prefix) {
        this.target = root.target.resolve(prefix);
        this.staging = root.staging;
        this.createdTarget = false;
        this.prefix = prefix;
        this.root = root;
    }

    /** A view of this output whose files land in folder {@code folder}; committing and closing stay with this one. */
    public AtomicOutput sub(String folder) {
        return new AtomicOutput(root, prefix.isEmpty() ? folder : prefix + "/" + folder);
    }

    /**
     * Checks that {@code dir} can be created and written, and opens a staging folder beside it.
     *
     * @throws OutputException with a one-line message when the folder cannot be written
     */
    public static AtomicOutput open(Path dir) throws OutputException {
        Path target = dir.toAbsolutePath().normalize();
        try {
            if (Files.exists(target) && !Files.isDirectory(target))
                throw new OutputException("output path exists and is not a folder: " + dir);
            boolean created = !Files.exists(target);
            Files.createDirectories(target);
            if (!Files.isWritable(target)) throw new OutputException("output folder is not writable: " + dir);
            Path staging = target.resolveSibling("." + target.getFileName() + ".partial-" + UUID.randomUUID().toString().substring(0, 8));
            Files.createDirectory(staging);
            return new AtomicOutput(target, staging, created);
        } catch (FileAlreadyExistsException e) {
            throw new OutputException("cannot create output folder " + dir + ": " + e.getFile() + " is in the way");
        } catch (IOException | SecurityException e) {
            throw new OutputException("cannot write output folder " + dir + ": " + oneLine(e));
        }
    }

    /** The folder the files end up in. */
    public Path target() { return target; }

    /** Where to write the file that will become {@code target/relative}; parent folders are created. */
    public Path file(String relative) {
        Path p = staging.resolve(prefix.isEmpty() ? relative : prefix + "/" + relative).normalize();
        if (!p.startsWith(staging)) throw new IllegalArgumentException("output file must stay inside the output folder: " + relative);
        try {
            Files.createDirectories(p.getParent());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return p;
    }

    /** The staged copy of folder {@code relative}, created if needed, for reading back what this run wrote. */
    public Path folder(String relative) {
        return file(relative + "/.keep").getParent();
    }

    /** Moves every staged file into the output folder, replacing files of the same name. */
    public void commit() throws OutputException {
        if (root != this) throw new IllegalStateException("commit the output folder itself, not a view of " + prefix);
        try (Stream<Path> s = Files.walk(staging)) {
            List<Path> files = s.filter(Files::isRegularFile).toList();
            for (Path f : files) {
                Path dest = target.resolve(staging.relativize(f).toString());
                Files.createDirectories(dest.getParent());
                try {
                    Files.move(f, dest, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(f, dest, StandardCopyOption.REPLACE_EXISTING);
                }
            }
            committed = true;
        } catch (IOException e) {
            throw new OutputException("cannot move results into " + target + ": " + oneLine(e));
        } finally {
            deleteStaging();
        }
    }

    @Override
    public void close() {
        if (root != this || committed) return;
        deleteStaging();
        if (createdTarget) {
            try {
                Files.deleteIfExists(target); // only succeeds while empty
            } catch (IOException ignored) {
                // not empty or not ours to remove: leave it
            }
        }
    }

    private void deleteStaging() {
        if (!Files.exists(staging)) return;
        try (Stream<Path> s = Files.walk(staging)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> {
                try {
                    Files.deleteIfExists(p);
                } catch (IOException ignored) {
                    // best effort: a leftover hidden staging folder is harmless
                }
            });
        } catch (IOException ignored) {
            // best effort
        }
    }

    static String oneLine(Throwable e) {
        String m = e.getMessage();
        if (m == null || m.isBlank()) m = e.getClass().getSimpleName();
        return m.replaceAll("\\s+", " ").trim();
    }
}
