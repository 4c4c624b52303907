package org.targetbench.perturb;

/** Lets tests in other packages read the blur a motion source applies. */
public final class MotionSourceAccess {
    private MotionSourceAccess() {}

    public static double[] blurVector(MotionSource s, double t) { return s.blurVector(t); }
}
