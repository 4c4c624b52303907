package org.targetbench.track;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/** What the tracker does when tracks die. */
public enum RespawnPolicy {
    /** Never start new tracks after the first frame: measures how long an initial set survives. */
    OFF("off"),
    /** Start new tracks on every frame that has fewer than {@link KltConfig#maxTracks} alive, as a servo loop would. */
    TOP_UP("top-up");

    private final String cliName;

    RespawnPolicy(String cliName) { this.cliName = cliName; }

    public String cliName() { return cliName; }

    public static RespawnPolicy parse(String s) {
        String n = s.trim().toLowerCase(Locale.ROOT);
        for (RespawnPolicy p : values()) if (p.cliName.equals(n)) return p;
        throw new IllegalArgumentException("unknown respawn policy \"" + s.trim() + "\"; choose from "
                + Arrays.stream(values()).map(RespawnPolicy::cliName).collect(Collectors.joining(", ")));
    }
}
