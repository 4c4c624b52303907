package org.targetbench.target;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A planar fiducial target: a white page of {@code widthMm} x {@code heightMm} with filled shapes painted on it in
 * order, and the designed feature points a detector should find.
 *
 * <p>Design frame: origin at the top-left corner of the page, x to the right, y down the page, z into the page
 * (so a camera looking at the printed side with an identity rotation sees the page upright). All lengths are
 * millimetres.
 *
 * <p>The quiet zone is the plain white border around the pattern that detectors need to see a clean edge; it is part
 * of the page size.
 *
 * <p>Reflectance lookups are accelerated by a uniform grid over the page so that rendering thousands of sub-samples
 * per pixel stays cheap.
 */
public final class TargetDesign {
    /** Grid cell size of the lookup accelerator, millimetres. */
    private static final double CELL_MM = 4.0;
    /** Reflectance of the bare page, 0 = black, 1 = white. */
    public static final double PAGE_GREY = 1.0;

    private final String id;
    private final String name;
    private final double widthMm;
    private final double heightMm;
    private final double quietZoneMm;
    private final List<Shape> drawing;
    private final List<TargetFeature> features;
    private final String pattern;
    private final Map<String, Object> parameters;

    private final int gridCols;
    private final int gridRows;
    private final int[][] cellShapes;

    public TargetDesign(String id, String name, double widthMm, double heightMm, double quietZoneMm,
                        List<Shape> drawing, List<TargetFeature> features,
                        String pattern, Map<String, Object> parameters) {
        if (id == null || id.isBlank()) throw new IllegalArgumentException("target id must not be blank");
        if (!(widthMm > 0) || !(heightMm > 0) || !Double.isFinite(widthMm) || !Double.isFinite(heightMm))
            throw new IllegalArgumentException("target size must be positive and finite, got " + widthMm + " x " + heightMm + " mm");
        if (!(quietZoneMm >= 0) || 2 * quietZoneMm >= Math.min(widthMm, heightMm))
            throw new IllegalArgumentException("quiet zone must be >= 0 and leave room for the pattern, got " + quietZoneMm + " mm on a " + widthMm + " x " + heightMm + " mm page");
        for (int i = 0; i < features.size(); i++) {
            TargetFeature f = features.get(i);
            if (f.id() != i) throw new IllegalArgumentException("feature ids must be 0..n-1 in order, feature " + i + " has id " + f.id());
            if (f.xMm() < 0 || f.xMm() > widthMm || f.yMm() < 0 || f.yMm() > heightMm)
                throw new IllegalArgumentException("feature " + i + " at (" + f.xMm() + ", " + f.yMm() + ") mm lies off the " + widthMm + " x " + heightMm + " mm page");
        }
        this.id = id;
        this.name = name == null ? id : name;
        this.widthMm = widthMm;
        this.heightMm = heightMm;
        this.quietZoneMm = quietZoneMm;
        this.drawing = List.copyOf(drawing);
        this.features = List.copyOf(features);
        this.pattern = pattern == null ? "custom" : pattern;
        this.parameters = Collections.unmodifiableMap(new LinkedHashMap<>(parameters == null ? Map.of() : parameters));

        gridCols = Math.max(1, (int) Math.ceil(widthMm / CELL_MM));
        gridRows = Math.max(1, (int) Math.ceil(heightMm / CELL_MM));
        List<List<Integer>> cells = new ArrayList<>(gridCols * gridRows);
        for (int i = 0; i < gridCols * gridRows; i++) cells.add(new ArrayList<>());
        for (int s = 0; s < this.drawing.size(); s++) {
            double[] b = this.drawing.get(s).bounds();
            int c0 = clamp((int) Math.floor(b[0] / CELL_MM), gridCols), c1 = clamp((int) Math.floor(b[2] / CELL_MM), gridCols);
            int r0 = clamp((int) Math.floor(b[1] / CELL_MM), gridRows), r1 = clamp((int) Math.floor(b[3] / CELL_MM), gridRows);
            for (int r = r0; r <= r1; r++)
                for (int c = c0; c <= c1; c++) cells.get(r * gridCols + c).add(s);
        }
        cellShapes = new int[cells.size()][];
        for (int i = 0; i < cells.size(); i++) cellShapes[i] = cells.get(i).stream().mapToInt(Integer::intValue).toArray();
    }

    private static int clamp(int v, int n) { return Math.max(0, Math.min(n - 1, v)); }

    /**
     * Reflectance at design point (x, y) mm: 0 = black ink, 1 = white page, or NaN off the page.
     * The topmost (last painted) shape containing the point wins.
     */
    public double reflectance(double x, double y) {
        if (!(x >= 0 && x < widthMm && y >= 0 && y < heightMm)) return Double.NaN;
        int c = clamp((int) (x / CELL_MM), gridCols), r = clamp((int) (y / CELL_MM), gridRows);
        int[] shapes = cellShapes[r * gridCols + c];
        for (int k = shapes.length - 1; k >= 0; k--) {
            Shape s = drawing.get(shapes[k]);
            if (s.contains(x, y)) return s.grey();
        }
        return PAGE_GREY;
    }

    public String id() { return id; }
    public String name() { return name; }
    public double widthMm() { return widthMm; }
    public double heightMm() { return heightMm; }
    public double quietZoneMm() { return quietZoneMm; }
    public List<Shape> drawing() { return drawing; }
    public List<TargetFeature> features() { return features; }
    /** Name of the generator that made the design ("checkerboard", "dots", "xcorners" or "custom"). */
    public String pattern() { return pattern; }
    /** Generator parameters, for provenance; keys and units are those of {@link TargetGenerators}. */
    public Map<String, Object> parameters() { return parameters; }

    @Override public boolean equals(Object o) {
        return o instanceof TargetDesign d && id.equals(d.id) && name.equals(d.name) && widthMm == d.widthMm
                && heightMm == d.heightMm && quietZoneMm == d.quietZoneMm && drawing.equals(d.drawing)
                && features.equals(d.features) && pattern.equals(d.pattern);
    }
    @Override public int hashCode() { return id.hashCode() * 31 + features.hashCode(); }
    @Override public String toString() {
        return "TargetDesign[" + id + ", " + widthMm + " x " + heightMm + " mm, " + features.size() + " features]";
    }
}
