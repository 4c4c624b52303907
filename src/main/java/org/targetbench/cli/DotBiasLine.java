package org.targetbench.cli;

import org.targetbench.pipeline.DotBiasTable;

import java.util.Locale;

/** The one console line about the perspective bias of dots in a run. */
final class DotBiasLine {
    private DotBiasLine() {}

    static String of(java.util.List<DotBiasTable.Row> rows, String file) {
        return String.format(Locale.ROOT, "Dot-centre bias (imaged dot centre against the projected centre the truth uses): worst %.3f px over "
                + "%d views; per view in %s. Correctable when the pose is known (see README).", DotBiasTable.worst(rows), rows.size(), file);
    }
}
