package org.targetbench.register;

/**
 * Why a frame registered the way it did, or why it did not. Sentences are rendered in {@link #sentence()} only.
 */
public enum RegistrationNote {
    /** Registered; the image decided the orientation (or the design has no symmetry). */
    OK(true),
    /** Registered; the design looks the same turned, and the previous frame decided the orientation. */
    ORIENTATION_BY_CONTINUITY(true),
    /** Registered; the design looks the same turned and nothing decided: the upright orientation was assumed. */
    ORIENTATION_ASSUMED(true),
    /** No designed layout was found in the frame. */
    NOT_FOUND(false),
    /** Found, but too few designed features matched. */
    TOO_FEW_FEATURES(false),
    /** Found, but the residual is above the limit. */
    RESIDUAL_ABOVE_LIMIT(false),
    /** Found, but no pose or mapping with the page facing the camera explains it. */
    NO_MODEL(false);

    private final boolean registered;

    RegistrationNote(boolean registered) { this.registered = registered; }

    /** Whether a frame with this note is registered (and scored). */
    public boolean registered() { return registered; }

    /** The csv status: {@code registered} or {@code not_found}. */
    public String status() { return registered ? "registered" : "not_found"; }

    /** Short machine-friendly name for files. */
    public String code() { return name().toLowerCase(java.util.Locale.ROOT); }

    /** One plain sentence. */
    public String sentence() {
        return switch (this) {
            case OK -> "registered";
            case ORIENTATION_BY_CONTINUITY -> "registered; the design is symmetric and the previous frame decided its orientation";
            case ORIENTATION_ASSUMED -> "registered; the design is symmetric and its orientation could not be resolved (upright assumed)";
            case NOT_FOUND -> "the target was not found";
            case TOO_FEW_FEATURES -> "too few designed features matched";
            case RESIDUAL_ABOVE_LIMIT -> "the residual is above the limit";
            case NO_MODEL -> "no pose or mapping of the page facing the camera explains the match";
        };
    }
}
