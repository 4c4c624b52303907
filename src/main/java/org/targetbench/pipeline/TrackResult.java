package org.targetbench.pipeline;

import org.targetbench.detect.DetectorType;
import org.targetbench.score.TrackingScore;
import org.targetbench.track.KltConfig;

import java.util.Optional;

/**
 * A finished (or stopped) tracking run.
 *
 * @param source          what was tracked
 * @param width           frame width, pixels
 * @param height          frame height, pixels
 * @param score           the run's figures
 * @param skippedFrames   frames the source skipped as undecodable
 * @param stop            why the run ended
 * @param endNote         what the source said when it ended on its own (a camera that went away), if anything
 * @param hasTruth        some frame carried truth (homography or true points)
 * @param wholeRunStatic  the user marked the recording as static
 * @param tracker         tracker settings
 * @param seeding         detector that chose the points
 * @param wallSeconds     wall time of the run
 * @param trackerMillisPerFrame mean time inside the tracker per frame in this run (JIT warm-up included)
 */
public record TrackResult(String source, int width, int height, TrackingScore score, int skippedFrames, Stop stop,
                          Optional<String> endNote, boolean hasTruth, boolean wholeRunStatic, KltConfig tracker,
                          DetectorType seeding, double wallSeconds, double trackerMillisPerFrame) {
    /** Why a run ended. */
    public enum Stop {
        /** The source had no more frames. */
        END_OF_SOURCE("end_of_source", "the source ended"),
        /** The frame limit was reached. */
        FRAME_LIMIT("frame_limit", "the frame limit was reached"),
        /** The user stopped it (Ctrl-C). */
        CANCELLED("user", "stopped by the user"),
        /** A live source ended on its own. */
        SOURCE_LOST("source_lost", "the source went away");

        private final String code, label;

        Stop(String code, String label) {
            this.code = code;
            this.label = label;
        }

        /** Name used in summary.json. */
        public String code() { return code; }

        /** Phrase shown to people. */
        public String label() { return label; }
    }
}
