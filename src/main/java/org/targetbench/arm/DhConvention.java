package org.targetbench.arm;

import java.util.Locale;

/**
 * Which Denavit-Hartenberg form a parameter table follows.
 *
 * <p>References: [1] J. Denavit, R. S. Hartenberg, "A kinematic notation for lower-pair mechanisms based on matrices",
 * ASME J. Applied Mechanics 22, 1955 (standard form). [2] J. J. Craig, "Introduction to Robotics: Mechanics and
 * Control", 2nd ed., Addison-Wesley 1989 (modified form).
 */
public enum DhConvention {
    /** Link i: Rz(θi) Tz(di) Tx(ai) Rx(αi) [1]. */
    STANDARD("standard"),
    /** Link i: Rx(α(i-1)) Tx(a(i-1)) Rz(θi) Tz(di) [2]. */
    MODIFIED("modified");

    private final String label;

    DhConvention(String label) { this.label = label; }

    public String label() { return label; }

    public static DhConvention parse(String s) {
        String n = s.trim().toLowerCase(Locale.ROOT);
        for (DhConvention c : values()) if (c.label.equals(n)) return c;
        throw new IllegalArgumentException("unknown DH convention \"" + s.trim() + "\"; choose standard or modified");
    }
}
