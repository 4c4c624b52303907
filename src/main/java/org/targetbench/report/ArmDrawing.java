package org.targetbench.report;

import org.targetbench.arm.ArmModel;
import org.targetbench.arm.Rigid;
import org.targetbench.camera.CameraModel;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;

/**
 * A simple three-view line drawing of the arm (top, side and front, orthographic, in the base frame) at a few poses,
 * each with the camera's viewing frustum and the target plate. Lines join the joint frames' origins, then the flange
 * and the camera. Java2D coordinates are pixel corners; nothing here depends on the pixel-centre convention.
 */
public final class ArmDrawing {
    public static final int PANEL = 420, MARGIN = 30;
    /** Frustum drawn to this depth, metres. */
    static final double FRUSTUM_M = 0.15;

    /** One pose to draw. */
    public record Pose(String label, double[] jointsRad, Color colour) {}

    private ArmDrawing() {}

    /** Draws the three views side by side. */
    public static BufferedImage draw(ArmModel arm, double[] handEye, CameraModel camera, double[] baseToTarget, double targetWMm, double targetHMm,
                                     List<Pose> poses) {
        List<List<double[]>> chains = new ArrayList<>();
        List<double[][]> frusta = new ArrayList<>();
        double[] lo = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
        double[] hi = {Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (Pose p : poses) {
            double[][] frames = new double[ArmModel.JOINTS + 1][16];
            double[] flange = arm.frames(p.jointsRad(), frames);
            List<double[]> pts = new ArrayList<>();
            pts.add(new double[]{0, 0, 0});
            for (double[] f : frames) pts.add(new double[]{f[3], f[7], f[11]});
            double[] cam = Rigid.mul(flange, handEye);
            pts.add(new double[]{cam[3], cam[7], cam[11]});
            chains.add(pts);
            frusta.add(frustum(cam, camera));
        }
        double[][] plate = new double[5][];
        double[][] corners = {{0, 0}, {targetWMm, 0}, {targetWMm, targetHMm}, {0, targetHMm}, {0, 0}};
        for (int i = 0; i < 5; i++) plate[i] = apply(baseToTarget, corners[i][0] / 1000, corners[i][1] / 1000, 0);
        for (List<double[]> c : chains) for (double[] p : c) grow(lo, hi, p);
        for (double[][] f : frusta) for (double[] p : f) grow(lo, hi, p);
        for (double[] p : plate) grow(lo, hi, p);
        double span = Math.max(hi[0] - lo[0], Math.max(hi[1] - lo[1], hi[2] - lo[2])) * 1.1 + 1e-3;
        BufferedImage img = new BufferedImage(3 * PANEL, PANEL + 40, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, img.getWidth(), img.getHeight());
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        String[] titles = {"top (x right, y up)", "side (x right, z up)", "front (y right, z up)"};
        int[][] axes = {{0, 1}, {0, 2}, {1, 2}};
        for (int v = 0; v < 3; v++) {
            int ox = v * PANEL;
            g.setColor(Color.GRAY);
            g.drawRect(ox + 4, 4, PANEL - 8, PANEL - 8);
            g.setColor(Color.BLACK);
            g.drawString(titles[v], ox + 12, 22);
            int a = axes[v][0], b = axes[v][1];
            double ca = 0.5 * (lo[a] + hi[a]), cb = 0.5 * (lo[b] + hi[b]);
            double scale = (PANEL - 2 * MARGIN) / span;
            java.util.function.Function<double[], int[]> map = p -> new int[]{
                    (int) Math.round(ox + PANEL / 2.0 + (p[a] - ca) * scale), (int) Math.round(PANEL / 2.0 - (p[b] - cb) * scale)};
            g.setColor(new Color(120, 120, 120));
            g.setStroke(new BasicStroke(1.5f));
            polyline(g, map, plate);
            for (int i = 0; i < poses.size(); i++) {
                g.setColor(poses.get(i).colour());
                g.setStroke(new BasicStroke(2.5f));
                polyline(g, map, chains.get(i).toArray(new double[0][]));
                for (double[] p : chains.get(i)) {
                    int[] q = map.apply(p);
                    g.fillOval(q[0] - 3, q[1] - 3, 6, 6);
                }
                g.setStroke(new BasicStroke(1f));
                double[][] f = frusta.get(i);
                for (int k = 1; k <= 4; k++) polyline(g, map, new double[][]{f[0], f[k]});
                polyline(g, map, new double[][]{f[1], f[2], f[3], f[4], f[1]});
            }
        }
        int x = 12;
        for (Pose p : poses) {
            g.setColor(p.colour());
            g.fillRect(x, PANEL + 14, 14, 14);
            g.setColor(Color.BLACK);
            g.drawString(p.label(), x + 20, PANEL + 26);
            x += 20 + g.getFontMetrics().stringWidth(p.label()) + 24;
        }
        g.setColor(new Color(120, 120, 120));
        g.drawString("grey: target plate; thin lines: camera view", x, PANEL + 26);
        g.dispose();
        return img;
    }

    /** Camera centre and the four image corners' rays at {@link #FRUSTUM_M}, in the base frame. */
    static double[][] frustum(double[] cam, CameraModel c) {
        double[][] out = new double[5][];
        out[0] = new double[]{cam[3], cam[7], cam[11]};
        double[][] px = {{0, 0}, {c.width() - 1, 0}, {c.width() - 1, c.height() - 1}, {0, c.height() - 1}};
        for (int i = 0; i < 4; i++) {
            double xn = (px[i][0] - c.cx()) / c.fx(), yn = (px[i][1] - c.cy()) / c.fy();
            out[i + 1] = apply(cam, xn * FRUSTUM_M, yn * FRUSTUM_M, FRUSTUM_M);
        }
        return out;
    }

    static double[] apply(double[] m, double x, double y, double z) {
        return new double[]{m[0] * x + m[1] * y + m[2] * z + m[3], m[4] * x + m[5] * y + m[6] * z + m[7], m[8] * x + m[9] * y + m[10] * z + m[11]};
    }

    private static void grow(double[] lo, double[] hi, double[] p) {
        for (int i = 0; i < 3; i++) {
            lo[i] = Math.min(lo[i], p[i]);
            hi[i] = Math.max(hi[i], p[i]);
        }
    }

    private static void polyline(Graphics2D g, java.util.function.Function<double[], int[]> map, double[][] pts) {
        for (int i = 1; i < pts.length; i++) {
            int[] a = map.apply(pts[i - 1]), b = map.apply(pts[i]);
            g.drawLine(a[0], a[1], b[0], b[1]);
        }
    }
}
