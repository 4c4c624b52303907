package org.targetbench.servo;

import org.targetbench.score.Stats;

import java.util.Arrays;
import java.util.List;

/**
 * The result of a rehearsal: every run, the kept traces, a summary and the warnings.
 *
 * @param poseMethod         how the reference pose used for the simulated target was obtained
 * @param warnings           known failure modes met, typed ({@code pipeline.Reasons} renders them)
 * @param referenceDistanceM distance of the reference camera from the target plane, metres
 */
public record RehearsalResult(RehearsalConfig config, String poseMethod, List<RunResult> runs, List<RunTrace> traces,
                              Summary summary, List<RehearsalWarning> warnings, double referenceDistanceM) {
    public RehearsalResult {
        config = config.copy();
        runs = List.copyOf(runs);
        traces = List.copyOf(traces);
        warnings = List.copyOf(warnings);
    }

    /** A copy of the settings used. */
    @Override public RehearsalConfig config() { return config.copy(); }

    /**
     * Figures over all runs.
     *
     * @param convergenceRate    converged / runs
     * @param medianTimeS        median time to converge over converged runs, seconds (NaN when none converged)
     * @param p95TimeS           95th percentile of the same
     * @param medianFinalErrorPx median final image error over all runs, pixels (NaN for runs that ended at the start)
     * @param p95FinalErrorPx    95th percentile of the same
     * @param maxRetreatMm       largest retreat along the reference optical axis over all runs, millimetres
     * @param maxDepthRatio      largest distance from the target plane over the reference distance
     * @param minPlaneDistanceM  smallest distance of the camera from the target plane, metres
     * @param redrawnStarts      drawn start poses discarded because a point was out of view (a large number means the
     *                           envelope is wider than the field of view allows)
     */
    public record Summary(int runs, int converged, double convergenceRate, double medianTimeS, double p95TimeS,
                          double medianFinalErrorPx, double p95FinalErrorPx, double maxRetreatMm, double maxDepthRatio,
                          double minPlaneDistanceM, int lostFieldOfView, int trackLost, int timeouts, int retreated, int singular,
                          int redrawnStarts) {
        static Summary of(List<RunResult> runs) {
            double[] times = runs.stream().filter(r -> r.outcome() == RunOutcome.CONVERGED).mapToDouble(RunResult::timeS).sorted().toArray();
            double[] finals = runs.stream().mapToDouble(RunResult::finalErrorPx).filter(Double::isFinite).sorted().toArray();
            int[] count = new int[RunOutcome.values().length];
            for (RunResult r : runs) count[r.outcome().ordinal()]++;
            int n = runs.size();
            return new Summary(n, count[RunOutcome.CONVERGED.ordinal()], n == 0 ? Double.NaN : count[RunOutcome.CONVERGED.ordinal()] / (double) n,
                    Stats.percentile(times, 50), Stats.percentile(times, 95), Stats.percentile(finals, 50), Stats.percentile(finals, 95),
                    runs.stream().mapToDouble(RunResult::maxRetreatMm).max().orElse(Double.NaN),
                    runs.stream().mapToDouble(RunResult::maxDepthRatio).max().orElse(Double.NaN),
                    runs.stream().mapToDouble(RunResult::minPlaneDistanceM).min().orElse(Double.NaN),
                    count[RunOutcome.LEFT_FIELD_OF_VIEW.ordinal()], count[RunOutcome.TRACK_LOST.ordinal()],
                    count[RunOutcome.TIMEOUT.ordinal()], count[RunOutcome.RETREATED.ordinal()], count[RunOutcome.SINGULAR.ordinal()],
                    runs.stream().mapToInt(RunResult::redrawnStarts).sum());
        }

        @Override public String toString() {
            return "Summary" + Arrays.asList(runs, converged, medianTimeS, p95TimeS, medianFinalErrorPx, maxRetreatMm, minPlaneDistanceM, lostFieldOfView);
        }
    }
}
