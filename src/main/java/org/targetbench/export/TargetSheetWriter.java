package org.targetbench.export;

import org.targetbench.source.TargetFile;
import org.targetbench.target.PrintLayout;

import java.io.IOException;
import java.util.List;

/**
 * Writes one target design's files into an output folder: {@code target.json}, the printable {@code target.pdf} and
 * {@code target.svg}, and {@code preview.png}. Nothing is in place until the caller commits the output.
 */
public final class TargetSheetWriter {
    public static final String JSON = "target.json";
    public static final String PDF = "target.pdf";
    public static final String SVG = "target.svg";
    public static final String PNG = "preview.png";

    private TargetSheetWriter() {}

    /** Writes the four files under {@code prefix} (empty for the folder itself) and returns their relative names. */
    public static List<String> write(PrintLayout layout, AtomicOutput out, String prefix) throws OutputException {
        String p = prefix.isEmpty() ? "" : prefix + "/";
        try {
            TargetFile.write(layout.design(), out.file(p + JSON));
            TargetPdf.write(layout, out.file(p + PDF));
            TargetSvg.write(layout, out.file(p + SVG));
            TargetPreview.write(layout, out.file(p + PNG));
        } catch (IOException e) {
            throw new OutputException("cannot write the target files into " + out.target() + ": " + AtomicOutput.oneLine(e));
        }
        return List.of(p + JSON, p + PDF, p + SVG, p + PNG);
    }
}
