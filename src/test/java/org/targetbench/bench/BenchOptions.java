package org.targetbench.bench;

import org.targetbench.detect.DetectorType;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Command-line options of the speed benchmark.
 *
 * @param runs      timed detector calls per measurement (per thread in the all-cores run); at least
 *                  {@value #MIN_RUNS} unless {@code quick}
 * @param warmup    untimed calls before each measurement, so the JIT has compiled the hot loops
 * @param detectors detectors to measure, in table order
 * @param quick     smoke run: fewer runs allowed, numbers are not a measurement
 */
record BenchOptions(int runs, int warmup, List<DetectorType> detectors, boolean quick) {
    static final int MIN_RUNS = 200;
    static final int DEFAULT_WARMUP = 50;
    static final int QUICK_RUNS = 20;
    static final int QUICK_WARMUP = 5;

    static final String USAGE = """
            usage: targetbench bench [--runs N] [--warmup N] [--detectors a,b,...] [--quick]
              --runs N         timed runs per measurement (default and minimum %d; --quick default %d)
              --warmup N       untimed warm-up runs before each measurement (default %d; --quick default %d)
              --detectors L    comma-separated subset of: %s (default all)
              --quick          smoke run with few runs; the numbers are not a measurement
            """.formatted(MIN_RUNS, QUICK_RUNS, DEFAULT_WARMUP, QUICK_WARMUP, DetectorType.allNames());

    /** Parses the arguments; throws IllegalArgumentException with a one-line message on bad input. */
    static BenchOptions parse(String[] args) {
        Integer runs = null, warmup = null;
        List<DetectorType> detectors = List.of(DetectorType.values());
        boolean quick = false;
        for (int i = 0; i < args.length; i++) {
            String a = args[i];
            switch (a) {
                case "--quick" -> quick = true;
                case "--runs" -> runs = positive(a, value(args, ++i, a));
                case "--warmup" -> warmup = nonNegative(a, value(args, ++i, a));
                case "--detectors" -> detectors = detectorList(value(args, ++i, a));
                case "-h", "--help" -> throw new HelpRequested();
                default -> throw new IllegalArgumentException("unknown option \"" + a + "\"");
            }
        }
        int r = runs != null ? runs : quick ? QUICK_RUNS : MIN_RUNS;
        int w = warmup != null ? warmup : quick ? QUICK_WARMUP : DEFAULT_WARMUP;
        if (!quick && r < MIN_RUNS)
            throw new IllegalArgumentException("--runs must be >= " + MIN_RUNS + " for a measurement (use --quick for a smoke run), got " + r);
        return new BenchOptions(r, w, detectors, quick);
    }

    /** Thrown for -h / --help so that the caller prints {@link #USAGE} and exits 0. */
    static final class HelpRequested extends RuntimeException {
        HelpRequested() { super(null, null, false, false); }
    }

    private static String value(String[] args, int i, String option) {
        if (i >= args.length) throw new IllegalArgumentException(option + " needs a value");
        return args[i];
    }

    private static int positive(String option, String s) {
        int v = integer(option, s);
        if (v < 1) throw new IllegalArgumentException(option + " must be >= 1, got " + v);
        return v;
    }

    private static int nonNegative(String option, String s) {
        int v = integer(option, s);
        if (v < 0) throw new IllegalArgumentException(option + " must be >= 0, got " + v);
        return v;
    }

    private static int integer(String option, String s) {
        try {
            return Integer.parseInt(s.trim());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(option + " needs a whole number, got \"" + s + "\"");
        }
    }

    private static List<DetectorType> detectorList(String s) {
        List<DetectorType> out = new ArrayList<>();
        for (String name : s.split(",")) {
            if (name.isBlank()) continue;
            DetectorType t = DetectorType.parse(name);
            if (!out.contains(t)) out.add(t);
        }
        if (out.isEmpty()) throw new IllegalArgumentException("--detectors needs at least one of " + DetectorType.allNames());
        // keep the table in the canonical order whatever order was typed
        out.sort(Enum::compareTo);
        return List.copyOf(out);
    }

    @Override public String toString() {
        return "runs=" + runs + " warmup=" + warmup + " detectors=" + Arrays.toString(detectors.toArray()) + (quick ? " quick" : "");
    }
}
