package org.targetbench.camera;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/** The reusable workspace gives exactly the figures of a fresh matrix and decomposition, for every set size in turn. */
class InteractionMatrixWorkspaceTest {
    @Test
    void reusedWorkspaceMatchesFreshDecompositionExactly() {
        SplittableRandom rng = new SplittableRandom(7);
        InteractionMatrix.Workspace ws = new InteractionMatrix.Workspace();
        for (int trial = 0; trial < 200; trial++) {
            int n = 2 + rng.nextInt(6);
            double[] x = new double[n], y = new double[n], z = new double[n];
            double zs = 0;
            for (int i = 0; i < n; i++) {
                x[i] = rng.nextDouble(-0.5, 0.5);
                y[i] = rng.nextDouble(-0.4, 0.4);
                z[i] = rng.nextDouble(0.2, 0.6);
                zs += z[i];
            }
            var fresh = InteractionMatrix.conditioning(InteractionMatrix.stacked(x, y, z), zs / n);
            assertEquals(fresh, ws.conditioning(x, y, z, n, zs / n), "set " + trial + " of " + n + " points");
        }
    }
}
