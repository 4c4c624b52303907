package org.targetbench.app;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorType;
import org.targetbench.report.Overlay;
import org.targetbench.report.Palette;
import org.targetbench.source.ImageFiles;

import javax.swing.JComponent;
import java.awt.Color;
import java.awt.Dimension;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.event.MouseAdapter;
import java.awt.event.MouseEvent;
import java.awt.event.MouseWheelEvent;
import java.awt.geom.AffineTransform;
import java.awt.geom.Point2D;
import java.awt.image.BufferedImage;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;

/**
 * A frame with detections drawn over it: wheel to zoom about the cursor, drag to pan, double-click to fit. Points
 * are outlined rings in each detector's colour (readable on dark and light areas), true features white crosses,
 * with a legend. Optional extra markers (labelled points, for servo sets) and a click callback in image pixels.
 */
public final class FrameCanvas extends JComponent {
    private BufferedImage image;
    private Map<DetectorType, List<Detection>> points = Map.of();
    private List<ProjectedFeature> truth = List.of();
    private List<Marker> markers = List.of();
    private double zoom = 1, panX, panY;
    private boolean fitted;
    private Point2D dragStart;
    private Consumer<Point2D> clickListener;

    /** A marker in image pixels (pixel-centre convention): an outlined ring of {@code radius} screen pixels, with an optional label. */
    public record Marker(double x, double y, String label, Color colour, double radius, Shape shape, String tip) {
        public Marker(double x, double y, String label, Color colour, double radius) {
            this(x, y, label, colour, radius, Shape.RING, null);
        }
    }

    /** A polyline in image pixels (pixel-centre convention), such as the path of a track. */
    public record Trail(double[] x, double[] y, Color colour) {}

    private List<Trail> trails = List.of();

    /** Lines drawn under the markers (e.g. track trails). */
    public void setTrails(List<Trail> t) {
        trails = List.copyOf(t);
        repaint();
    }

    /**
     * How a marker is drawn: an outlined ring, a diagonal cross (for points that failed a filter), or one of the
     * outlined square, triangle, diamond and plus (the ends of tracks, one shape per way of ending, so colour is not
     * the only cue).
     */
    public enum Shape { RING, CROSS, SQUARE, TRIANGLE, DIAMOND, PLUS }

    /** Nearest marker with a tip within this many screen pixels shows its tip on hover. */
    static final double TIP_RADIUS_PX = 9;

    @Override
    public String getToolTipText(java.awt.event.MouseEvent e) {
        Marker best = null;
        double bestD = TIP_RADIUS_PX;
        for (Marker m : markers) {
            if (m.tip() == null) continue;
            double d = Math.hypot((m.x() + 0.5) * zoom + panX - e.getX(), (m.y() + 0.5) * zoom + panY - e.getY());
            if (d <= bestD) { bestD = d; best = m; }
        }
        return best == null ? null : best.tip();
    }

    public FrameCanvas(String name) {
        setName(name);
        setPreferredSize(new Dimension(660, 500));
        setOpaque(true);
        setFocusable(true);
        MouseAdapter mouse = new MouseAdapter() {
            @Override public void mousePressed(MouseEvent e) {
                dragStart = e.getPoint();
                requestFocusInWindow(); // so the window's keys (undo, frame stepping) reach it
            }
            @Override public void mouseDragged(MouseEvent e) {
                if (dragStart == null) return;
                panX += e.getX() - dragStart.getX();
                panY += e.getY() - dragStart.getY();
                dragStart = e.getPoint();
                fitted = false;
                repaint();
            }
            @Override public void mouseClicked(MouseEvent e) {
                if (e.getClickCount() == 2) {
                    fit();
                } else if (clickListener != null && image != null) {
                    clickListener.accept(toImage(e.getX(), e.getY()));
                }
            }
            @Override public void mouseWheelMoved(MouseWheelEvent e) {
                Point2D before = toImage(e.getX(), e.getY());
                zoom = Math.max(0.1, Math.min(32, zoom * Math.pow(1.15, -e.getPreciseWheelRotation())));
                panX = e.getX() - (before.getX() + 0.5) * zoom;
                panY = e.getY() - (before.getY() + 0.5) * zoom;
                fitted = false;
                repaint();
            }
        };
        addMouseListener(mouse);
        addMouseMotionListener(mouse);
        addMouseWheelListener(mouse);
    }

    public void setFrame(GrayF32 frame) {
        setImage(ImageFiles.toBuffered(frame));
    }

    /** Shows an image already converted for display (the zoom stays unless the size changed or the view was fitted). */
    public void setImage(BufferedImage frame) {
        boolean first = image == null || image.getWidth() != frame.getWidth() || image.getHeight() != frame.getHeight();
        image = frame;
        if (first || fitted) fit();
        repaint();
    }

    private String note = "";

    /** A line drawn in the top-left corner over the frame (empty for none), e.g. what frame is shown. */
    public void setNote(String text) {
        note = text == null ? "" : text;
        repaint();
    }

    /** Draws a marker shape of half-size {@code r} at ({@code mx}, {@code my}) in component pixels, with a dark outline (also for legends). */
    static void drawShape(Graphics2D g, Shape shape, double mx, double my, double r, Color colour) {
        if (shape == Shape.RING) {
            Overlay.ring(g, mx, my, colour, r);
            return;
        }
        java.awt.geom.Path2D.Double p = new java.awt.geom.Path2D.Double();
        switch (shape) {
            case CROSS -> {
                p.moveTo(mx - r, my - r); p.lineTo(mx + r, my + r);
                p.moveTo(mx - r, my + r); p.lineTo(mx + r, my - r);
            }
            case PLUS -> {
                p.moveTo(mx - r, my); p.lineTo(mx + r, my);
                p.moveTo(mx, my - r); p.lineTo(mx, my + r);
            }
            case SQUARE -> p.append(new java.awt.geom.Rectangle2D.Double(mx - r, my - r, 2 * r, 2 * r), false);
            case TRIANGLE -> {
                p.moveTo(mx, my - r); p.lineTo(mx + r, my + r); p.lineTo(mx - r, my + r); p.closePath();
            }
            default -> { // DIAMOND
                p.moveTo(mx, my - r); p.lineTo(mx + r, my); p.lineTo(mx, my + r); p.lineTo(mx - r, my); p.closePath();
            }
        }
        g.setColor(Color.BLACK);
        g.setStroke(new java.awt.BasicStroke(3f));
        g.draw(p);
        g.setColor(colour);
        g.setStroke(new java.awt.BasicStroke(1.5f));
        g.draw(p);
    }

    public void setOverlay(Map<DetectorType, List<Detection>> points, List<ProjectedFeature> truth) {
        this.points = new LinkedHashMap<>(points);
        this.truth = List.copyOf(truth);
        repaint();
    }

    public void setMarkers(List<Marker> markers) {
        javax.swing.ToolTipManager.sharedInstance().registerComponent(this);
        this.markers = List.copyOf(markers);
        repaint();
    }

    /** The markers drawn now. */
    List<Marker> markers() { return markers; }

    /** Called with the image pixel (pixel-centre convention) of a single click. */
    public void onClick(Consumer<Point2D> listener) { clickListener = listener; }


    /** Fits the frame to the component. */
    public void fit() {
        fitted = true;
        if (image == null || getWidth() == 0) return;
        zoom = Math.min(getWidth() / (double) image.getWidth(), getHeight() / (double) image.getHeight());
        panX = (getWidth() - image.getWidth() * zoom) / 2;
        panY = (getHeight() - image.getHeight() * zoom) / 2;
        repaint();
    }

    /** Component point showing an image pixel (pixel-centre convention). */
    java.awt.Point toScreen(double x, double y) {
        return new java.awt.Point((int) Math.round((x + 0.5) * zoom + panX), (int) Math.round((y + 0.5) * zoom + panY));
    }

    /** Image pixel under a component point, pixel-centre convention. */
    Point2D toImage(double x, double y) {
        return new Point2D.Double((x - panX) / zoom - 0.5, (y - panY) / zoom - 0.5);
    }

    @Override
    public void setBounds(int x, int y, int w, int h) {
        super.setBounds(x, y, w, h);
        if (fitted) fit();
    }

    @Override
    protected void paintComponent(Graphics g0) {
        Graphics2D g = (Graphics2D) g0.create();
        try {
            g.setColor(getBackground() != null ? getBackground().darker() : Color.DARK_GRAY);
            g.fillRect(0, 0, getWidth(), getHeight());
            if (image == null) {
                g.setColor(Color.GRAY);
                g.drawString("No frame loaded", 20, 30);
                return;
            }
            AffineTransform saved = g.getTransform();
            g.translate(panX, panY);
            g.setRenderingHint(RenderingHints.KEY_INTERPOLATION,
                    zoom >= 2 ? RenderingHints.VALUE_INTERPOLATION_NEAREST_NEIGHBOR : RenderingHints.VALUE_INTERPOLATION_BILINEAR);
            g.drawImage(image, 0, 0, (int) Math.round(image.getWidth() * zoom), (int) Math.round(image.getHeight() * zoom), null);
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            for (ProjectedFeature f : truth) Overlay.cross(g, (f.u() + 0.5) * zoom, (f.v() + 0.5) * zoom);
            for (var e : points.entrySet())
                for (Detection d : e.getValue()) Overlay.ring(g, (d.x() + 0.5) * zoom, (d.y() + 0.5) * zoom, Palette.of(e.getKey()));
            if (!trails.isEmpty()) {
                g.setStroke(new java.awt.BasicStroke(1.3f));
                for (Trail t : trails) {
                    if (t.x().length < 2) continue;
                    java.awt.geom.Path2D.Double path = new java.awt.geom.Path2D.Double();
                    path.moveTo((t.x()[0] + 0.5) * zoom, (t.y()[0] + 0.5) * zoom);
                    for (int i = 1; i < t.x().length; i++) path.lineTo((t.x()[i] + 0.5) * zoom, (t.y()[i] + 0.5) * zoom);
                    g.setColor(t.colour());
                    g.draw(path);
                }
            }
            for (Marker m : markers) {
                double mx = (m.x() + 0.5) * zoom, my = (m.y() + 0.5) * zoom;
                drawShape(g, m.shape(), mx, my, m.radius(), m.colour());
                if (m.label().isEmpty()) continue;
                g.setColor(Color.BLACK);
                g.drawString(m.label(), (float) mx + 10, (float) my - 9);
                g.setColor(Color.WHITE);
                g.drawString(m.label(), (float) mx + 9, (float) my - 10);
            }
            g.setTransform(saved);
            if (!points.isEmpty() || !truth.isEmpty()) Overlay.legend(g, points, !truth.isEmpty());
            if (!note.isEmpty()) {
                g.setColor(new Color(0, 0, 0, 170));
                java.awt.FontMetrics fm = g.getFontMetrics();
                g.fillRect(4, getHeight() - fm.getHeight() - 10, fm.stringWidth(note) + 12, fm.getHeight() + 6);
                g.setColor(Color.WHITE);
                g.drawString(note, 10, getHeight() - 7 - fm.getDescent());
            }
        } finally {
            g.dispose();
        }
    }
}
