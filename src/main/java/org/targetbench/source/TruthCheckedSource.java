package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Homography;

import java.util.Locale;
import java.util.Optional;

/**
 * A folder or video whose truth is checked against the footage as the frames arrive: every {@value #EVERY}th frame
 * with a truth homography must look like the reference frame moved by that homography, with a correlation
 * ({@link TruthConsistency}) of at least {@value #MIN_CORRELATION}; otherwise the run stops with one line (nothing is
 * written, outputs being committed only at the end). Measured on the clips in sample-video/: each clip's own truth
 * keeps the correlation at 0.98 or more (also through 17 px of motion blur and a 20 % gain drift); another clip's truth
 * falls below 0.45 within 20 frames. The threshold between the two is our choice (no source).
 */
public final class TruthCheckedSource extends ForwardingSource {
    /** Least correlation between a frame and the reference moved by its truth homography. */
    public static final double MIN_CORRELATION = 0.5;
    /** Frames between checks. */
    public static final int EVERY = 5;

    private GrayF32 reference;
    private int seen;

    private TruthCheckedSource(FrameSource source) { super(source); }

    /** {@code source}, checked when it carries truth. */
    public static FrameSource wrap(FrameSource source) {
        boolean truth = source instanceof ImageFolderSource f ? f.hasTruth() : source instanceof MjpegSource m ? m.hasTruth()
                : source instanceof FfmpegSource m4 && m4.hasTruth();
        return truth ? new TruthCheckedSource(source) : source;
    }

    @Override
    public Optional<SourceFrame> next() throws SourceException {
        Optional<SourceFrame> f = source.next();
        if (f.isEmpty()) return f;
        SourceFrame fr = f.get();
        if (fr.name().equals(source.referenceName())) reference = fr.image();
        Optional<Homography> h = fr.truth().fromReference();
        if (reference != null && h.isPresent() && !fr.name().equals(source.referenceName()) && seen++ % EVERY == 0) {
            double c = TruthConsistency.correlation(reference, fr.image(), h.get());
            if (c < MIN_CORRELATION)
                throw new SourceException(String.format(Locale.ROOT, "the truth of %s does not fit the footage: %s does not look like the reference "
                        + "frame moved by its truth homography (correlation %.2f, at least %.1f expected); is it the truth of other footage?",
                        source.description(), fr.name(), c, MIN_CORRELATION));
        }
        return f;
    }

}
