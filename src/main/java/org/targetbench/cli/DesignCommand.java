package org.targetbench.cli;

import org.targetbench.export.AtomicOutput;
import org.targetbench.export.TargetSheetWriter;
import org.targetbench.target.PageSize;
import org.targetbench.target.PrintConfig;
import org.targetbench.target.PrintLayout;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.DesignRecipe;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;

@Command(name = "design", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Generates a target design and its printable sheet at exact scale.",
                "Writes target.json, target.pdf and target.svg (the sheet: the design at 1:1, its quiet zone outlined, cut marks, "
                        + "a 100 mm verification bar, the target id and printing guidance) and preview.png.",
                "Patterns and their options (defaults in brackets):",
                "  checkerboard  --rows [7] --cols [9] squares, --square-mm [15], --margin-mm [one square]",
                "  dots          --rows [6] --cols [8], --pitch-mm [20], --diameter-mm [10], --margin-mm [10]",
                "  xcorners      --count [14], --spacing-mm [28], --arm-mm [8], --width-mm [180], --height-mm [130], --margin-mm [10], --seed [1]",
                "  squares       --rows [12] --cols [16], --square-mm [5], --pitch-mm [10], --margin-mm [10]",
                "  markers       --rows [2] --cols [3], --arm-mm [25], --spacing-mm [60], --margin-mm [15]"})
final class DesignCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--pattern", required = true, paramLabel = "NAME", description = "checkerboard, dots, xcorners, squares or markers.")
    String pattern;
    @Option(names = "--id", paramLabel = "ID", description = "Target id printed on the sheet (default: from the pattern and sizes).")
    String id;
    @Option(names = "--rows", paramLabel = "N", description = "Rows of squares, dots or markers.") Integer rows;
    @Option(names = "--cols", paramLabel = "N", description = "Columns of squares, dots or markers.") Integer cols;
    @Option(names = "--square-mm", paramLabel = "MM", description = "Square side, mm.") Double squareMm;
    @Option(names = "--pitch-mm", paramLabel = "MM", description = "Centre-to-centre spacing of dots or squares, mm.") Double pitchMm;
    @Option(names = "--diameter-mm", paramLabel = "MM", description = "Dot diameter, mm.") Double diameterMm;
    @Option(names = "--count", paramLabel = "N", description = "Number of x-corners in a random field.") Integer count;
    @Option(names = "--spacing-mm", paramLabel = "MM", description = "Smallest x-corner spacing (xcorners) or marker spacing (markers), mm.") Double spacingMm;
    @Option(names = "--arm-mm", paramLabel = "MM", description = "Side of the two squares forming each x-corner, mm.") Double armMm;
    @Option(names = "--width-mm", paramLabel = "MM", description = "Width of a random x-corner field, mm.") Double widthMm;
    @Option(names = "--height-mm", paramLabel = "MM", description = "Height of a random x-corner field, mm.") Double heightMm;
    @Option(names = "--margin-mm", paramLabel = "MM", description = "Quiet zone (white border) around the pattern, mm.") Double marginMm;
    @Option(names = "--seed", paramLabel = "N", description = "Seed of a random x-corner field.") Long seed;
    @Option(names = "--page", paramLabel = "SIZE", defaultValue = "A4",
            description = "A4, Letter, A3, Tabloid, A2, A1, A0 or WIDTHxHEIGHT in mm (default: ${DEFAULT-VALUE}); turned to landscape when only that fits.")
    String page;
    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    private static final Map<String, Set<String>> APPLIES = Map.of(
            "checkerboard", Set.of("--rows", "--cols", "--square-mm", "--margin-mm"),
            "dots", Set.of("--rows", "--cols", "--pitch-mm", "--diameter-mm", "--margin-mm"),
            "xcorners", Set.of("--count", "--spacing-mm", "--arm-mm", "--width-mm", "--height-mm", "--margin-mm", "--seed"),
            "squares", Set.of("--rows", "--cols", "--square-mm", "--pitch-mm", "--margin-mm"),
            "markers", Set.of("--rows", "--cols", "--arm-mm", "--spacing-mm", "--margin-mm"));

    @Override
    public Integer call() throws Exception {
        String p = pattern.toLowerCase(Locale.ROOT);
        if (!APPLIES.containsKey(p))
            throw new UserError("unknown pattern \"" + pattern + "\"; use checkerboard, dots, xcorners, squares or markers");
        checkOptions(p);
        PageSize sheet;
        try {
            sheet = PageSize.parse(page);
        } catch (IllegalArgumentException e) {
            throw new UserError("--page: " + e.getMessage());
        }
        TargetDesign design;
        try {
            design = generate(p);
        } catch (IllegalArgumentException e) {
            throw new UserError("--pattern " + p + ": " + e.getMessage());
        }
        PrintConfig pc = new PrintConfig();
        PrintLayout layout = PrintLayout.of(design, sheet, pc).orElseThrow(() -> new UserError(PrintLayout.doesNotFit(design, sheet, pc)));
        try (AtomicOutput output = AtomicOutput.open(out)) {
            TargetSheetWriter.write(layout, output, "");
            output.commit();
            PrintWriter w = spec.commandLine().getOut();
            w.printf(Locale.ROOT, "Design %s: %s, %s x %s mm, %d features, quiet zone %s mm.%n", design.id(), design.name(),
                    num(design.widthMm()), num(design.heightMm()), design.features().size(), num(design.quietZoneMm()));
            w.printf(Locale.ROOT, "Sheet: %s%s. Written to %s: %s, %s, %s, %s%n", layout.page().describe(), layout.turned() ? ", landscape" : "",
                    output.target(), TargetSheetWriter.JSON, TargetSheetWriter.PDF, TargetSheetWriter.SVG, TargetSheetWriter.PNG);
            w.println("Print the PDF at 100 % (actual size, no 'fit to page') on matte stock, mount it flat and rigid, "
                    + "and measure the 100 mm bar before use.");
            w.flush();
        }
        return 0;
    }

    /** Refuses options that do not apply to the pattern, and non-positive sizes and counts, naming the option. */
    private void checkOptions(String p) {
        Map<String, Number> given = new LinkedHashMap<>();
        given.put("--rows", rows); given.put("--cols", cols); given.put("--square-mm", squareMm); given.put("--pitch-mm", pitchMm);
        given.put("--diameter-mm", diameterMm); given.put("--count", count); given.put("--spacing-mm", spacingMm);
        given.put("--arm-mm", armMm); given.put("--width-mm", widthMm); given.put("--height-mm", heightMm);
        given.put("--margin-mm", marginMm); given.put("--seed", seed);
        for (var e : given.entrySet()) {
            if (e.getValue() == null) continue;
            if (!APPLIES.get(p).contains(e.getKey()))
                throw new UserError(e.getKey() + " does not apply to --pattern " + p + "; it takes " + String.join(", ", APPLIES.get(p).stream().sorted().toList()));
            if (e.getKey().equals("--seed")) continue;
            double v = e.getValue().doubleValue();
            boolean margin = e.getKey().equals("--margin-mm");
            if (!Double.isFinite(v) || (margin ? v < 0 : v <= 0))
                throw new UserError(e.getKey() + " must be " + (margin ? ">= 0" : "> 0") + ", got " + e.getValue());
        }
    }

    private TargetDesign generate(String p) {
        DesignRecipe r = new DesignRecipe();
        r.pattern = p; r.id = id; r.rows = rows; r.cols = cols; r.count = count; r.squareMm = squareMm; r.pitchMm = pitchMm;
        r.diameterMm = diameterMm; r.spacingMm = spacingMm; r.armMm = armMm; r.widthMm = widthMm; r.heightMm = heightMm;
        r.marginMm = marginMm; r.seed = seed;
        return r.build();
    }

    static String num(double v) {
        return DesignRecipe.num(v);
    }
}
