package org.targetbench.perturb;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/** Families of image degradation a servo cell meets. */
public enum PerturbKind {
    LIGHTING("lighting"),
    BLUR("blur"),
    NOISE("noise"),
    JPEG("jpeg"),
    VIEWPOINT("viewpoint");

    private final String cliName;

    PerturbKind(String cliName) { this.cliName = cliName; }

    public String cliName() { return cliName; }

    public static PerturbKind parse(String s) {
        String n = s.trim().toLowerCase(Locale.ROOT);
        for (PerturbKind k : values()) if (k.cliName.equals(n)) return k;
        throw new IllegalArgumentException("unknown kind \"" + s.trim() + "\"; choose from " + allNames());
    }

    public static String allNames() {
        return Arrays.stream(values()).map(PerturbKind::cliName).collect(Collectors.joining(", "));
    }
}
