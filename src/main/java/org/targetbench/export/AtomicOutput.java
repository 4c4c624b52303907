package org.targetbench.export;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.StandardOpenOption;
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
 *
 * <p>The folder is also guarded:
 * <ul>
 * <li><b>One run at a time.</b> A lock file {@value #LOCK} in the folder, held with {@link FileChannel#tryLock()} for
 *     the whole run and naming the holder's process id: a second run into the same folder fails at once with one line
 *     naming that pid. The operating system releases the lock when a process dies, however it dies.</li>
 * <li><b>Stale staging folders.</b> Once the lock is held, any staging folder of this output left beside it is a
 *     leftover of a killed run (SIGKILL, power loss): it is removed and the removal reported through
 *     {@link #onNotice}.</li>
 * <li><b>User files are never overwritten silently.</b> {@value #MANIFEST} lists every file runs of this tool moved
 *     into the folder. {@link #open} refuses a folder holding any other file (in the CLI, whole output folders);
 *     {@link #openBeside} (output files placed among others, e.g. {@code pick --out results/set.json}) refuses only
 *     when a file it would replace is not in the manifest. Either way {@link #allowOverwrite} (the CLI's
 *     {@code --overwrite}) lifts the refusal. Reruns replace their own files and nothing else.</li>
 * </ul>
 */
public final class AtomicOutput implements AutoCloseable {
    /** Lock file held while a run writes into the folder. */
    public static final String LOCK = ".targetbench.lock";
    /** Files this tool has written into the folder, one relative path per line. */
    public static final String MANIFEST = ".targetbench-manifest";

    private static volatile boolean overwrite;
    private static volatile boolean wholeFolder;
    private static volatile java.util.function.Consumer<String> notices = m -> { };

    /** Lets runs replace files this tool did not write (the CLI's --overwrite). */
    public static void allowOverwrite(boolean allow) { overwrite = allow; }

    /** When on, {@link #open} refuses a folder holding any file this tool did not write (the CLI's policy). */
    public static void guardWholeFolders(boolean on) { wholeFolder = on; }

    /** Where one-line notices go (a stale staging folder removed). */
    public static void onNotice(java.util.function.Consumer<String> sink) { notices = sink; }

    private FileChannel lockChannel;
    private FileLock lock;
    private boolean createdLock;
    private java.util.Set<String> manifest = new java.util.TreeSet<>();
    private int committedFiles;
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
        return open(dir, wholeFolder);
    }

    /**
     * As {@link #open(Path)} for output files placed in a folder among other files: only a file this run would replace
     * is checked against the manifest.
     */
    public static AtomicOutput openBeside(Path dir) throws OutputException {
        return open(dir, false);
    }

    private static AtomicOutput open(Path dir, boolean guardFolder) throws OutputException {
        Path target = dir.toAbsolutePath().normalize();
        AtomicOutput o = null;
        try {
            if (Files.exists(target) && !Files.isDirectory(target))
                throw new OutputException("output path exists and is not a folder: " + dir);
            boolean created = !Files.exists(target);
            Files.createDirectories(target);
            if (!Files.isWritable(target)) throw new OutputException("output folder is not writable: " + dir);
            Path staging = target.resolveSibling(stagingPrefix(target) + UUID.randomUUID().toString().substring(0, 8));
            o = new AtomicOutput(target, staging, created);
            o.lock(dir);
            o.removeStaleStaging();
            o.manifest = readManifest(target);
            if (guardFolder && !overwrite) o.refuseForeignFiles(dir);
            Files.createDirectory(staging);
            return o;
        } catch (FileAlreadyExistsException e) {
            if (o != null) o.close();
            throw new OutputException("cannot create output folder " + dir + ": " + e.getFile() + " is in the way");
        } catch (IOException | SecurityException e) {
            if (o != null) o.close();
            String why = oneLine(e);
            // the file-system message often is just the folder's own path: say only what went wrong with it
            if (e instanceof java.nio.file.FileSystemException f && f.getFile() != null && Path.of(f.getFile()).toAbsolutePath().normalize().equals(target))
                why = why.substring(f.getFile().length()).strip();
            throw new OutputException("cannot write to output folder " + dir + ": " + why);
        } catch (OutputException | RuntimeException e) {
            if (o != null) o.close();
            throw e;
        }
    }

    private static String stagingPrefix(Path target) {
        return "." + target.getFileName() + ".partial-";
    }

    private void lock(Path shown) throws IOException, OutputException {
        Path f = target.resolve(LOCK);
        createdLock = !Files.exists(f, java.nio.file.LinkOption.NOFOLLOW_LINKS);
        lockChannel = FileChannel.open(f, StandardOpenOption.CREATE, StandardOpenOption.READ, StandardOpenOption.WRITE);
        try {
            lock = lockChannel.tryLock();
        } catch (OverlappingFileLockException e) {
            lock = null; // held by another run in this same process
        }
        if (lock == null) {
            String holder;
            try {
                holder = Files.readString(f).strip();
            } catch (IOException e) {
                holder = "";
            }
            lockChannel.close();
            lockChannel = null;
            createdLock = false;
            throw new OutputException("output folder " + shown + " is in use by another targetbench run"
                    + (holder.isEmpty() ? "" : " (pid " + holder + ")") + "; wait for it to finish or choose another --out");
        }
        lockChannel.truncate(0);
        lockChannel.write(ByteBuffer.wrap((ProcessHandle.current().pid() + "\n").getBytes(StandardCharsets.US_ASCII)), 0);
        lockChannel.force(false);
    }

    /** Removes staging folders of this output left by runs that were killed; safe because the lock is held. */
    private void removeStaleStaging() throws IOException {
        String prefix = stagingPrefix(target);
        try (Stream<Path> s = Files.list(target.getParent())) {
            for (Path p : s.filter(p -> p.getFileName().toString().startsWith(prefix) && Files.isDirectory(p)).toList()) {
                deleteTree(p);
                notices.accept("removed " + p + ", the partial output of an earlier run that was killed");
            }
        }
    }

    private static java.util.Set<String> readManifest(Path target) throws IOException {
        Path m = target.resolve(MANIFEST);
        java.util.Set<String> out = new java.util.TreeSet<>();
        if (Files.isRegularFile(m))
            for (String line : Files.readAllLines(m, StandardCharsets.UTF_8)) if (!line.isBlank()) out.add(line.strip());
        return out;
    }

    private static boolean ours(String relative) {
        return relative.equals(LOCK) || relative.equals(MANIFEST);
    }

    private String relative(Path p) {
        return target.relativize(p).toString().replace('\\', '/');
    }

    private void refuseForeignFiles(Path shown) throws IOException, OutputException {
        List<String> foreign;
        try (Stream<Path> s = Files.walk(target)) {
            foreign = s.filter(p -> !Files.isDirectory(p)).map(this::relative)
                    .filter(r -> !ours(r) && !manifest.contains(r)).sorted().toList();
        }
        if (!foreign.isEmpty())
            throw new OutputException("output folder " + shown + " holds " + foreign.size() + " file" + (foreign.size() == 1 ? "" : "s")
                    + " this tool did not write (" + foreign.get(0) + (foreign.size() > 1 ? ", ..." : "")
                    + "); choose an empty or new folder, or pass --overwrite to replace them");
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

    /**
     * Moves every staged file into the output folder, replacing files of the same name that runs of this tool wrote
     * (or any, with {@link #allowOverwrite}), and records them in the manifest.
     */
    public void commit() throws OutputException {
        if (root != this) throw new IllegalStateException("commit the output folder itself, not a view of " + prefix);
        try (Stream<Path> s = Files.walk(staging)) {
            List<Path> files = s.filter(Files::isRegularFile).toList();
            if (!overwrite)
                for (Path f : files) {
                    String rel = staging.relativize(f).toString().replace('\\', '/');
                    Path dest = target.resolve(rel);
                    if (Files.exists(dest, java.nio.file.LinkOption.NOFOLLOW_LINKS) && !manifest.contains(rel))
                        throw new OutputException("will not replace " + dest + ": this tool did not write it; choose another output or pass --overwrite");
                }
            java.util.Set<String> written = new java.util.TreeSet<>(manifest);
            for (Path f : files) {
                written.add(staging.relativize(f).toString().replace('\\', '/'));
                Path dest = target.resolve(staging.relativize(f).toString());
                Files.createDirectories(dest.getParent());
                try {
                    Files.move(f, dest, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(f, dest, StandardCopyOption.REPLACE_EXISTING);
                }
            }
            Path tmp = target.resolve(MANIFEST + ".tmp");
            Files.write(tmp, written, StandardCharsets.UTF_8);
            Files.move(tmp, target.resolve(MANIFEST), StandardCopyOption.REPLACE_EXISTING);
            manifest = written;
            committedFiles = files.size();
            committed = true;
        } catch (IOException e) {
            throw new OutputException("cannot move results into " + target + ": " + oneLine(e));
        } finally {
            deleteStaging();
        }
    }

    /** Files moved into the folder by {@link #commit()}. */
    public int committedFiles() { return committedFiles; }

    @Override
    public void close() {
        if (root != this) return;
        if (!committed) deleteStaging();
        try {
            if (lock != null) lock.release();
            if (lockChannel != null) lockChannel.close();
            // a lock file this run made goes with a run that wrote nothing; after a commit it stays (deleting it could
            // let two later runs lock two different files)
            if (createdLock && !committed) Files.deleteIfExists(target.resolve(LOCK));
        } catch (IOException ignored) {
            // released when the process ends in any case
        }
        lock = null;
        lockChannel = null;
        if (committed) return;
        if (createdTarget) {
            try {
                Files.deleteIfExists(target); // only succeeds while empty
            } catch (IOException ignored) {
                // not empty or not ours to remove: leave it
            }
        }
    }

    private void deleteStaging() {
        deleteTree(staging);
    }

    private static void deleteTree(Path staging) {
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
        if (e instanceof java.nio.file.FileSystemException f) {
            // these carry only the path as their message; say what went wrong with it
            String why = e instanceof java.nio.file.AccessDeniedException ? "permission denied"
                    : e instanceof java.nio.file.NoSuchFileException ? "does not exist"
                    : e instanceof java.nio.file.NotDirectoryException ? "is not a folder"
                    : e instanceof FileAlreadyExistsException ? "is in the way"
                    : f.getReason() != null ? f.getReason() : e.getClass().getSimpleName();
            return (f.getFile() != null ? f.getFile() + " " : "") + why;
        }
        String m = e.getMessage();
        if (m == null || m.isBlank()) m = e.getClass().getSimpleName();
        return m.replaceAll("\\s+", " ").trim();
    }
}
