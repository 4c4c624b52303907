package org.targetbench.report;

import org.targetbench.export.AtomicOutput;
import org.targetbench.export.ServoSetFiles;
import org.targetbench.export.ServoWriters;
import org.targetbench.select.Selection;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.ServoSet;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The one export of a servo set, used by the workbench's Export view and by the command line ({@code pick},
 * {@code demo}): {@code STEM.json} with its {@code rehearsal} key (the settings and headline figures of the rehearsal
 * run on exactly this set, or "not rehearsed"), {@code STEM.csv}, {@code STEM-selection.csv} written from the same set
 * (so the two never disagree) and, with a rehearsal, the files its report links to under the rehearsal prefix
 * (rehearsal.csv, rehearsal-summary.json, the charts and rehearsal.html).
 */
public final class ServoSetExport {
    private ServoSetExport() {}

    /**
     * Writes the set's files into {@code out}; returns their names relative to it: STEM.json, STEM.csv, then
     * STEM-selection.csv (always), then the rehearsal's files.
     *
     * @param selection        the choice behind the set (its candidates and reasons), empty for a set read from a file
     * @param rehearsal        the rehearsal run on exactly this set, or empty ("not rehearsed")
     * @param elapsedS         how long that rehearsal took, seconds (0 when unknown)
     * @param rehearsalPrefix  where the rehearsal's files go inside {@code out}, e.g. "rehearsal/"
     */
    public static List<String> write(ServoSet set, Optional<Selection> selection, Optional<RehearsalResult> rehearsal, double elapsedS,
                                     AtomicOutput out, String stem, String rehearsalPrefix) throws IOException {
        List<String> written = ServoSetFiles.write(set, rehearsal, elapsedS, out, stem, rehearsalPrefix);
        List<String> files = new ArrayList<>(written.subList(0, 2)); // the set's JSON and CSV first, then its selection
        // always written, from the state the set comes from (the choice with its hand edits, or the set alone when it
        // was read from a file), so an older selection file in the folder can never contradict the set
        if (selection.isPresent()) ServoWriters.writeSelection(selection.get(), set, out.file(stem + "-selection.csv"));
        else ServoWriters.writeSelection(set, out.file(stem + "-selection.csv"));
        files.add(stem + "-selection.csv");
        files.addAll(written.subList(2, written.size()));
        if (rehearsal.isPresent())
            for (String f : RehearsalReport.write(rehearsal.get(), set, stem + ".json", out, rehearsalPrefix))
                if (!files.contains(rehearsalPrefix + f)) files.add(rehearsalPrefix + f);
        return files;
    }
}
