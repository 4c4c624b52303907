package org.targetbench.detect;

/** Harris corner detector settings (Harris &amp; Stephens 1988). */
public final class HarrisConfig extends CornerConfig {
    /** Harris sensitivity k in det(M) - k trace(M)²; 0.04 is the customary value (Harris &amp; Stephens 1988). */
    public double kappa = 0.04;

    @Override public DetectorType type() { return DetectorType.HARRIS; }

    @Override public HarrisConfig copy() {
        HarrisConfig c = copyCornerTo(new HarrisConfig());
        c.kappa = kappa;
        return c;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (!(kappa > 0 && kappa < 0.25)) throw new IllegalArgumentException("harris: kappa must be within (0, 0.25), got " + kappa);
    }
}
