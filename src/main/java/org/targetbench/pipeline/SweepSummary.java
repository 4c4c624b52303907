package org.targetbench.pipeline;

import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * Curves and rankings from sweep rows.
 *
 * <p>Per parameter, a detector scores the mean over levels of its mean repeatability at each level (the area under
 * its curve, normalised). Over an operating envelope (the harshest value of each parameter the cell will meet), a
 * detector scores the <em>lowest</em>, over the parameters, of its mean repeatability at the levels from the neutral
 * value up to the envelope value: a cell is as good as its detector under its weakest condition. Without an envelope
 * the whole swept range counts. Ties break by detector order.
 */
public final class SweepSummary {
    private SweepSummary() {}

    /** Mean figures of one detector at one level of one parameter. */
    public record LevelPoint(int level, double value, OptionalDouble repeatability, double localisationPx, double count, double coverage,
                             double kltSurvival) {}

    /** A ranking line. */
    public record Rank(int rank, DetectorType detector, double score, Perturbation weakest) {}

    /** Relative slack when deciding whether a level lies inside the envelope. */
    static final double ENVELOPE_SLACK = 1e-9;

    public static List<LevelPoint> curve(SweepResult r, DetectorType d, Perturbation p) {
        double[] values = r.values().get(p);
        List<LevelPoint> out = new ArrayList<>();
        for (int l = 0; l < values.length; l++) {
            int level = l;
            List<SweepRow> cell = r.rows().stream().filter(x -> x.detector() == d && x.parameter() == p && x.level() == level).toList();
            if (cell.isEmpty()) continue;
            out.add(new LevelPoint(l, values[l], SweepRun.meanRepeatability(cell),
                    cell.stream().mapToDouble(SweepRow::localisationPx).filter(v -> !Double.isNaN(v)).average().orElse(Double.NaN),
                    cell.stream().mapToInt(SweepRow::count).average().orElse(0),
                    cell.stream().mapToDouble(SweepRow::coverage).average().orElse(0),
                    cell.stream().mapToDouble(SweepRow::kltSurvival).filter(v -> !Double.isNaN(v)).average().orElse(Double.NaN)));
        }
        return out;
    }

    /** Detectors ranked by mean repeatability over all levels of one parameter. */
    public static List<Rank> rankParameter(SweepResult r, Perturbation p) {
        List<Rank> out = new ArrayList<>();
        for (DetectorType d : r.detectorTypes()) out.add(new Rank(0, d, meanOver(curve(r, d, p), null, p), p));
        return number(out);
    }

    /**
     * Detectors ranked over an operating envelope.
     *
     * @param envelope harshest expected value per parameter; parameters not in it count over their whole swept range
     */
    public static List<Rank> rankEnvelope(SweepResult r, Map<Perturbation, Double> envelope) {
        List<Rank> out = new ArrayList<>();
        for (DetectorType d : r.detectorTypes()) {
            double worst = Double.POSITIVE_INFINITY;
            Perturbation weakest = null;
            for (Perturbation p : r.parameters()) {
                double s = meanOver(curve(r, d, p), envelope.get(p), p);
                if (!Double.isNaN(s) && s < worst) {
                    worst = s;
                    weakest = p;
                }
            }
            out.add(new Rank(0, d, worst == Double.POSITIVE_INFINITY ? Double.NaN : worst, weakest));
        }
        return number(out);
    }

    /** True when {@code value} lies between the parameter's neutral value and {@code limit}, inclusive. */
    public static boolean inEnvelope(Perturbation p, double value, double limit) {
        double lo = Math.min(p.neutral(), limit), hi = Math.max(p.neutral(), limit);
        double slack = ENVELOPE_SLACK * Math.max(1, Math.abs(hi - lo));
        return value >= lo - slack && value <= hi + slack;
    }

    private static double meanOver(List<LevelPoint> curve, Double limit, Perturbation p) {
        List<LevelPoint> in = limit == null ? curve : curve.stream().filter(x -> inEnvelope(p, x.value(), limit)).toList();
        if (in.isEmpty() && !curve.isEmpty()) // envelope tighter than the first level: use the mildest level
            in = List.of(curve.stream().min(Comparator.comparingDouble(x -> Math.abs(x.value() - p.neutral()))).orElseThrow());
        return in.stream().filter(x -> x.repeatability().isPresent()).mapToDouble(x -> x.repeatability().getAsDouble()).average().orElse(Double.NaN);
    }

    private static List<Rank> number(List<Rank> list) {
        List<Rank> sorted = new ArrayList<>(list);
        sorted.sort(Comparator.comparingDouble((Rank x) -> Double.isNaN(x.score()) ? -1 : x.score()).reversed());
        List<Rank> out = new ArrayList<>();
        for (int i = 0; i < sorted.size(); i++) {
            Rank x = sorted.get(i);
            out.add(new Rank(i + 1, x.detector(), x.score(), x.weakest()));
        }
        return out;
    }

    /** Envelope values keyed by parameter, validated. */
    public static Map<Perturbation, Double> envelope(Map<String, Double> byId) {
        Map<Perturbation, Double> out = new LinkedHashMap<>();
        for (var e : byId.entrySet()) {
            Perturbation p = Perturbation.parse(e.getKey());
            p.checkValue(e.getValue());
            out.put(p, e.getValue());
        }
        return out;
    }
}
