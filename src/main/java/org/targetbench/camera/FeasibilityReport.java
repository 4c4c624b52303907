package org.targetbench.camera;

import java.util.List;

/**
 * The outcome of a feasibility check: one line per question, each pass, warn or fail with the threshold used and its
 * basis.
 *
 * @param targetId  the design checked
 * @param standoffM stand-off of the square-on view, metres
 * @param tiltDeg   largest tilt of the target tried, degrees
 * @param checks    the lines, in a fixed order
 */
public record FeasibilityReport(String targetId, double standoffM, double tiltDeg, List<Check> checks) {
    public FeasibilityReport {
        checks = List.copyOf(checks);
    }

    public enum Status { PASS, WARN, FAIL }

    /**
     * One line of the report.
     *
     * @param name      what is checked ("smallest feature", ...)
     * @param status    pass, warn or fail
     * @param value     the measured value, in {@code unit}
     * @param unit      "px" or "%" or "" for yes/no checks (1 = yes)
     * @param measured  the measurement as people read it
     * @param threshold the threshold as people read it
     * @param basis     where the threshold comes from ("derived: ...", "common practice, no source", ...)
     */
    public record Check(String name, Status status, double value, String unit, String measured, String threshold, String basis) {}

    /** The worst status of all lines. */
    public Status overall() {
        Status worst = Status.PASS;
        for (Check c : checks) if (c.status().ordinal() > worst.ordinal()) worst = c.status();
        return worst;
    }

    public long count(Status s) {
        return checks.stream().filter(c -> c.status() == s).count();
    }
}
