package org.targetbench.cli;

import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.DetectorSummary;

import java.io.PrintWriter;
import java.util.Locale;

/** The ranked detector table printed by {@code compare} and {@code demo}. */
final class ConsoleTable {
    private ConsoleTable() {}

    static void print(CompareResult r, PrintWriter out) {
        out.printf(Locale.ROOT, "%d frames of %dx%d from %s; reference %s; epsilon %.2f px; %d frames with a homography, %d with true points%n",
                r.frameCount(), r.width(), r.height(), r.sourceDescription(), r.referenceName(), r.epsilon(),
                r.framesWithHomography(), r.framesWithPoints());
        out.println();
        out.printf(Locale.ROOT, "%-4s %-12s %8s %8s %7s %8s %9s %7s %8s%n",
                "rank", "detector", "repeat.", "worst", "frames", "pts/frm", "loc RMS", "found", "cover");
        int rank = 1;
        for (DetectorSummary s : r.ranked()) {
            out.printf(Locale.ROOT, "%-4d %-12s %8s %8s %7d %8.1f %9s %7s %8s%n",
                    rank++, s.detector().label(),
                    s.meanRepeatability().isPresent() ? String.format(Locale.ROOT, "%.3f", s.meanRepeatability().getAsDouble()) : "-",
                    s.minRepeatability().isPresent() ? String.format(Locale.ROOT, "%.3f", s.minRepeatability().getAsDouble()) : "-",
                    s.framesScored(), s.meanCount(),
                    Double.isNaN(s.localisation().rmsPx()) ? "-" : String.format(Locale.ROOT, "%.3f px", s.localisation().rmsPx()),
                    Double.isNaN(s.localisation().foundFraction()) ? "-" : String.format(Locale.ROOT, "%.0f%%", 100 * s.localisation().foundFraction()),
                    String.format(Locale.ROOT, "%.0f%%", 100 * s.meanOccupancy()));
        }
        out.println();
        out.println("repeat. = mean repeatability over frames with a homography (Schmid et al. 2000); worst = lowest frame;");
        out.println("loc RMS / found = distance to true features within 3 px and the share found; cover = 4x4 cells holding a point.");
        out.println("Scores describe these frames only; they are not a guarantee for your cell.");
        if (r.framesWithHomography() == 0)
            out.println("No frame has a homography to the reference, so repeatability is undefined; give --truth or a truth.json.");
        out.flush();
    }
}
