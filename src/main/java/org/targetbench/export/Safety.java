package org.targetbench.export;

/** The safety notice carried by the README, every export header, reports and the app. */
public final class Safety {
    private Safety() {}

    /** Short form, one paragraph. */
    public static final String NOTICE = "Reference sets and scores from this tool drive a real robot only after you have checked them. "
            + "Rehearse every set in simulation first; run the cell at reduced speed with an enabling device and the emergency stop "
            + "within reach; keep people out of the cell while it moves; follow local codes and licensed practice (e.g. ISO 10218). "
            + "Scores describe the bench conditions measured, not a guarantee of behaviour in your cell.";
}
