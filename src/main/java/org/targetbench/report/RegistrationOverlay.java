package org.targetbench.report;

import boofcv.struct.image.GrayF32;
import org.targetbench.register.Registration;
import org.targetbench.source.ImageFiles;

import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.util.Locale;

/** A frame with its registration drawn on it: the predicted designed features, and a line saying how it went. */
public final class RegistrationOverlay {
    private static final Color OK = new Color(40, 190, 70), FAILED = new Color(220, 50, 40);

    private RegistrationOverlay() {}

    public static BufferedImage draw(GrayF32 frame, Registration r) {
        BufferedImage img = new BufferedImage(frame.width, frame.height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.drawImage(ImageFiles.toBuffered(frame), 0, 0, null);
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            // Java2D puts pixel centres at +0.5
            for (Registration.PredictedFeature p : r.predicted()) Overlay.cross(g, p.u() + 0.5, p.v() + 0.5);
            String line = r.registered()
                    ? String.format(Locale.ROOT, "%s: %d features, RMS %.3f px", r.note().sentence(), r.featuresUsed(), r.rmsPx())
                    : "NOT REGISTERED: " + r.note().sentence() + " (not scored)";
            g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 12));
            int w = g.getFontMetrics().stringWidth(line);
            g.setColor(new Color(0, 0, 0, 170));
            g.fillRect(4, 4, w + 10, 20);
            g.setColor(r.registered() ? OK : FAILED);
            g.drawString(line, 9, 19);
        } finally {
            g.dispose();
        }
        return img;
    }
}
