package org.targetbench.detect;

/** Shi-Tomasi (minimum eigenvalue) corner detector settings (Shi &amp; Tomasi 1994). */
public final class ShiTomasiConfig extends CornerConfig {
    @Override public DetectorType type() { return DetectorType.SHI_TOMASI; }

    @Override public ShiTomasiConfig copy() { return copyCornerTo(new ShiTomasiConfig()); }
}
