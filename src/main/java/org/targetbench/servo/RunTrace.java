package org.targetbench.servo;

/**
 * Time series of one rehearsed run, kept for charts (every n-th step). Camera positions are in the reference camera
 * frame (x right, y down, z along the optical axis towards the target), millimetres, so the goal is (0, 0, 0) and a
 * negative z is a retreat.
 */
public record RunTrace(int index, RunOutcome outcome, double[] timeS, double[] errorPx, double[] cameraXMm, double[] cameraYMm,
                       double[] cameraZMm) {
    public RunTrace {
        int n = timeS.length;
        if (errorPx.length != n || cameraXMm.length != n || cameraYMm.length != n || cameraZMm.length != n)
            throw new IllegalArgumentException("trace arrays must have one length, got " + n + ", " + errorPx.length + ", "
                    + cameraXMm.length + ", " + cameraYMm.length + ", " + cameraZMm.length);
        timeS = timeS.clone();
        errorPx = errorPx.clone();
        cameraXMm = cameraXMm.clone();
        cameraYMm = cameraYMm.clone();
        cameraZMm = cameraZMm.clone();
    }

    @Override public double[] timeS() { return timeS.clone(); }
    @Override public double[] errorPx() { return errorPx.clone(); }
    @Override public double[] cameraXMm() { return cameraXMm.clone(); }
    @Override public double[] cameraYMm() { return cameraYMm.clone(); }
    @Override public double[] cameraZMm() { return cameraZMm.clone(); }
}
