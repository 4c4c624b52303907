package org.targetbench.servo;

import java.util.Locale;

/** Which depths the rehearsed controller believes, in L̂ (the simulation always moves the true points). */
public enum DepthMode {
    /** The true current depth of every point (as from a perfect depth sensor or pose estimate); L* uses the true Z*. */
    TRUE("true"),
    /** The reference depth Z* of each point, held constant (the usual approximation when no depth is measured). */
    CONSTANT("constant"),
    /** Z* times an error factor, in L̂ and in L*: a wrongly measured stand-off. */
    SCALED("scaled");

    private final String cliName;

    DepthMode(String cliName) { this.cliName = cliName; }

    public String cliName() { return cliName; }

    public static DepthMode parse(String s) {
        String n = s.trim().toLowerCase(Locale.ROOT);
        for (DepthMode m : values()) if (m.cliName.equals(n)) return m;
        throw new IllegalArgumentException("unknown depth mode \"" + s.trim() + "\"; choose from true, constant, scaled");
    }
}
