package org.targetbench.arm;

/**
 * One joint's Denavit-Hartenberg parameters (see {@link DhConvention} for the order they act in).
 *
 * @param aM            link length a, metres
 * @param alphaRad      link twist α, radians
 * @param dM            link offset d, metres
 * @param thetaOffsetRad joint angle at joint reading zero, radians (θ = q + offset)
 */
public record DhRow(double aM, double alphaRad, double dM, double thetaOffsetRad) {
    public DhRow {
        for (double v : new double[]{aM, alphaRad, dM, thetaOffsetRad})
            if (!Double.isFinite(v)) throw new IllegalArgumentException("DH parameters must be finite, got a=" + aM + " alpha=" + alphaRad
                    + " d=" + dM + " offset=" + thetaOffsetRad);
    }
}
