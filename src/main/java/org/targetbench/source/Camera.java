package org.targetbench.source;

import java.awt.image.BufferedImage;

/** A live camera as {@link WebcamSource} uses it: a fixed image size and one image at a time. */
public interface Camera extends AutoCloseable {
    /** Name shown to people. */
    String name();

    int width();

    int height();

    /**
     * The next image, blocking until the camera delivers one.
     *
     * @return the image, or null when the camera has stopped delivering (closed, unplugged)
     * @throws Exception when the driver fails; the source treats it like null
     */
    BufferedImage grab() throws Exception;

    @Override
    void close();
}
