package org.targetbench.servo;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * Which estimate L̂ of the interaction matrix the control law v = -λ L̂⁺ (s - s*) uses [1, eq. (5), from memory]. The
 * names are this tool's: the servo set is the reference, so {@code reference} is L at the set's own view (L*),
 * {@code current} is L at the current view and {@code averaged} is the mean of the two.
 *
 * <p>References: [1] F. Chaumette, S. Hutchinson, "Visual servo control, Part I: Basic approaches", IEEE RAM 13(4),
 * 2006. [2] E. Malis, "Improving vision-based control using efficient second-order minimization techniques", ICRA 2004.
 * [3] F. Chaumette, "Potential problems of stability and convergence in image-based and position-based visual
 * servoing", in The Confluence of Vision and Control, LNCIS 237, Springer 1998.
 */
public enum ControlLaw {
    /**
     * L̂ = L(s, Ẑ): the matrix at the current features and depth estimates. Image points move on nearly straight
     * lines, but a large rotation about the optical axis makes the camera retreat (towards infinity near 180°) [3].
     */
    CURRENT("current"),
    /**
     * L̂ = L(s*, Z*): constant, computed once at the reference. Cheap and needs no current depth; the image paths can
     * be poor and points may leave the image for large errors [1, 3].
     */
    DESIRED("reference"),
    /**
     * L̂ = ½ (L(s, Ẑ) + L(s*, Z*)): the mean of both, which behaves well for large rotations about the optical axis
     * [2]; [1] recommends it among the three.
     */
    MEAN("averaged");

    private final String cliName;

    ControlLaw(String cliName) { this.cliName = cliName; }

    public String cliName() { return cliName; }

    /** The command-line name, which is also what screens show. */
    @Override public String toString() { return cliName; }

    public static ControlLaw parse(String s) {
        String n = s.trim().toLowerCase(Locale.ROOT);
        for (ControlLaw l : values()) if (l.cliName.equals(n)) return l;
        throw new IllegalArgumentException("unknown control law \"" + s.trim() + "\"; choose from "
                + Arrays.stream(values()).map(ControlLaw::cliName).collect(Collectors.joining(", ")));
    }
}
