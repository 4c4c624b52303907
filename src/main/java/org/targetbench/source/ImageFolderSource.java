package org.targetbench.source;

import boofcv.struct.image.GrayF32;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;

/**
 * Frames from a folder of PNG/JPEG files sorted by file name, with optional ground truth from a {@code truth.json}
 * ({@link TruthFile}). Opening checks every header, so an empty folder, a non-image file with an image name or mixed
 * frame sizes fail before any work is done; a frame whose pixels cannot be decoded fails when it is reached.
 */
public final class ImageFolderSource implements FrameSource {
    private final String description;
    private final List<Path> files;
    private final int width;
    private final int height;
    private final TruthFile.Truth truth;
    private int nextIndex;

    private ImageFolderSource(String description, List<Path> files, int width, int height, TruthFile.Truth truth) {
        this.description = description;
        this.files = files;
        this.width = width;
        this.height = height;
        this.truth = truth;
    }

    /**
     * @param truthFile a truth file, or null to use {@code folder/truth.json} when it exists
     */
    public static ImageFolderSource open(Path folder, Path truthFile) throws SourceException {
        return open(folder, truthFile, folder.toString());
    }

    /** As {@link #open(Path, Path)}, shown to people as {@code description}. */
    public static ImageFolderSource open(Path folder, Path truthFile, String description) throws SourceException {
        if (!Files.isDirectory(folder)) throw Missing.folder(folder, "frame folder");
        List<Path> files;
        try (Stream<Path> s = Files.list(folder)) {
            files = s.filter(p -> ImageFiles.isImageName(p.getFileName().toString()) && !Files.isDirectory(p))
                    .sorted((a, b) -> a.getFileName().toString().compareTo(b.getFileName().toString())).toList();
        } catch (IOException e) {
            throw new SourceException("cannot list frame folder " + folder + ": " + ImageFiles.oneLine(e));
        }
        // an entry named like a frame that cannot be read (a dangling link, no permission) is an error, never skipped
        for (Path f : files) ImageFiles.checkReadable(f);
        if (files.isEmpty()) throw new SourceException("no PNG or JPEG frames in " + folder);
        int[] size0 = ImageFiles.readSize(files.get(0));
        for (Path f : files.subList(1, files.size())) {
            int[] s = ImageFiles.readSize(f);
            if (s[0] != size0[0] || s[1] != size0[1])
                throw new SourceException("mixed frame sizes in " + folder + ": " + files.get(0).getFileName() + " is " + size0[0] + "x" + size0[1]
                        + " but " + f.getFileName() + " is " + s[0] + "x" + s[1]);
        }
        LinkedHashSet<String> names = new LinkedHashSet<>();
        for (Path f : files) names.add(f.getFileName().toString());
        Path tf = truthFile != null ? truthFile : folder.resolve("truth.json");
        TruthFile.Truth truth;
        if (truthFile != null || Files.exists(tf)) {
            truth = TruthFile.read(tf, names);
            TruthFit.check(truth, tf, files.size(), false, size0[0], size0[1]);
        }
        else truth = new TruthFile.Truth(files.get(0).getFileName().toString(), java.util.Map.of());
        return new ImageFolderSource(description, files, size0[0], size0[1], truth);
    }

    @Override public String description() { return description; }
    @Override public int width() { return width; }
    @Override public int height() { return height; }
    @Override public int frameCount() { return files.size(); }
    @Override public String referenceName() { return truth.reference(); }

    /** True when the truth file gave anything beyond the reference frame. */
    public boolean hasTruth() { return !truth.frames().isEmpty(); }

    @Override
    public Optional<SourceFrame> next() throws SourceException {
        if (nextIndex >= files.size()) return Optional.empty();
        Path f = files.get(nextIndex);
        GrayF32 img = ImageFiles.read(f);
        if (img.width != width || img.height != height)
            throw new SourceException("frame " + f + " decodes to " + img.width + "x" + img.height + ", expected " + width + "x" + height);
        String name = f.getFileName().toString();
        return Optional.of(new SourceFrame(nextIndex++, name, img, truth.forFrame(name)));
    }

    @Override public void close() { nextIndex = files.size(); }
}
