package org.targetbench.source;

/** Lets tests in other packages damage a frame of an MJPEG file the way {@link VideoDecodingTest} does. */
public final class VideoDecodingTestAccess {
    private VideoDecodingTestAccess() {}

    public static byte[] breakJpeg(byte[] file, int k) { return VideoDecodingTest.breakJpeg(file, k); }
}
