package org.targetbench.servo;

import org.targetbench.camera.InteractionMatrix;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.SingularValueDecomposition_F64;

import java.util.ArrayList;
import java.util.List;

/**
 * Known failure modes of a point set for image-based servoing, as typed findings with their numbers (rendered by
 * {@code pipeline.Reasons}): too few points, (nearly) collinear
 * points, (nearly) coincident points and a near-singular interaction matrix.
 *
 * <p>Background: three points give up to four camera poses with the same image (Fischler &amp; Bolles 1981, CACM
 * 24(6), from memory), so at least four are needed for a unique goal; collinear points leave L rank deficient and
 * configurations near such sets make L ill conditioned (Michel &amp; Rives 1993, INRIA report 1880; Chaumette 1998,
 * LNCIS 237, both from memory). The thresholds are rules of thumb (common practice, no source).
 */
public final class SetDiagnostics {
    /** Fewest points a set may have. */
    public static final int MIN_POINTS = 4;
    /** Ratio of the minor to the major spread of the points below which they count as collinear. */
    public static final double COLLINEAR_RATIO = 0.02;
    /** Pixel distance below which two points count as coincident for a tracker. */
    public static final double COINCIDENT_PX = 5.0;
    /** Scaled cond(L*) above which L* counts as near singular. */
    public static final double NEAR_SINGULAR_COND = 1000;
    /** Pixel distance below which two points are the same point (a duplicate), an error. */
    public static final double DUPLICATE_PX = 0.5;

    private SetDiagnostics() {}

    /** How bad a finding is: an ERROR set must not be used, a WARNING one deserves a look. */
    public enum Severity { ERROR, WARNING }

    /** What a finding is about. */
    public enum Kind {
        /** Fewer than {@link #MIN_POINTS} points ({@code count}). */
        TOO_FEW_POINTS,
        /** Fewer than {@link #MIN_POINTS} distinct points ({@code count}) once duplicates are set aside. */
        TOO_FEW_DISTINCT,
        /** Two points ({@code pointIds}) at one pixel ({@code uPx}, {@code vPx}). */
        DUPLICATE,
        /** The points ({@code pointIds}) lie on one line: minor/major spread {@code value} below {@code limit}. */
        COLLINEAR,
        /** Two points ({@code pointIds}) only {@code value} px apart. */
        COINCIDENT,
        /** cond(L*) {@code value} above {@code limit}. */
        NEAR_SINGULAR
    }

    /**
     * One finding with its numbers; {@code pipeline.Reasons} renders it as a sentence.
     *
     * @param count    a number of points (TOO_FEW_POINTS, TOO_FEW_DISTINCT), else 0
     * @param pointIds the points concerned (DUPLICATE, COLLINEAR, COINCIDENT), else empty
     * @param value    the measured figure (spread ratio, distance in px, condition number), else NaN
     * @param limit    the threshold it crossed, else NaN
     * @param uPx      column of a duplicated point, px, else NaN
     * @param vPx      row of a duplicated point, px, else NaN
     */
    public record Finding(Kind kind, Severity severity, int count, List<Integer> pointIds, double value, double limit, double uPx, double vPx) {
        public Finding {
            pointIds = List.copyOf(pointIds);
        }

        static Finding count(Kind kind, int count) {
            return new Finding(kind, Severity.ERROR, count, List.of(), Double.NaN, MIN_POINTS, Double.NaN, Double.NaN);
        }

        static Finding points(Kind kind, Severity severity, List<Integer> ids, double value, double limit) {
            return new Finding(kind, severity, 0, ids, value, limit, Double.NaN, Double.NaN);
        }
    }

    /** Checks a servo set's points. */
    public static List<Finding> check(List<ServoPoint> pts) {
        List<Finding> out = new ArrayList<>();
        int n = pts.size();
        if (n < MIN_POINTS) {
            out.add(Finding.count(Kind.TOO_FEW_POINTS, n));
            if (n < 2) return out;
        }
        // a duplicated point is reported as what it is, and the line test runs on the distinct points only
        List<ServoPoint> distinct = new ArrayList<>();
        for (ServoPoint p : pts) {
            ServoPoint same = null;
            for (ServoPoint q : distinct) if (Math.hypot(p.u() - q.u(), p.v() - q.v()) < DUPLICATE_PX) same = q;
            if (same == null) distinct.add(p);
            else out.add(new Finding(Kind.DUPLICATE, Severity.ERROR, 0, List.of(same.id(), p.id()), Double.NaN, DUPLICATE_PX, p.u(), p.v()));
        }
        if (distinct.size() < pts.size()) {
            if (distinct.size() < MIN_POINTS && n >= MIN_POINTS) out.add(Finding.count(Kind.TOO_FEW_DISTINCT, distinct.size()));
            if (distinct.size() < 3) return out;
            pts = distinct;
            n = pts.size();
        }
        double ratio = spreadRatio(pts);
        if (ratio < COLLINEAR_RATIO)
            out.add(Finding.points(Kind.COLLINEAR, Severity.ERROR, pts.stream().map(ServoPoint::id).toList(), ratio, COLLINEAR_RATIO));
        for (int i = 0; i < n; i++)
            for (int j = i + 1; j < n; j++) {
                double d = Math.hypot(pts.get(i).u() - pts.get(j).u(), pts.get(i).v() - pts.get(j).v());
                if (d < COINCIDENT_PX)
                    out.add(Finding.points(Kind.COINCIDENT, Severity.WARNING, List.of(pts.get(i).id(), pts.get(j).id()), d, COINCIDENT_PX));
            }
        if (n >= 3 && ratio >= COLLINEAR_RATIO) {
            InteractionMatrix.Conditioning c = ServoSet.conditioning(pts);
            if (!(c.condition() <= NEAR_SINGULAR_COND))
                out.add(Finding.points(Kind.NEAR_SINGULAR, Severity.WARNING, List.of(), c.condition(), NEAR_SINGULAR_COND));
        }
        return out;
    }

    /** True when any finding is an error. */
    public static boolean hasError(List<Finding> findings) {
        return findings.stream().anyMatch(f -> f.severity() == Severity.ERROR);
    }

    /**
     * Ratio of the smaller to the larger singular value of the centred pixel positions: 0 for points on a line, 1 for
     * an isotropic spread.
     */
    public static double spreadRatio(List<ServoPoint> pts) {
        int n = pts.size();
        double mu = 0, mv = 0;
        for (ServoPoint p : pts) {
            mu += p.u() / n;
            mv += p.v() / n;
        }
        DMatrixRMaj m = new DMatrixRMaj(n, 2);
        for (int i = 0; i < n; i++) {
            m.set(i, 0, pts.get(i).u() - mu);
            m.set(i, 1, pts.get(i).v() - mv);
        }
        SingularValueDecomposition_F64<DMatrixRMaj> svd = DecompositionFactory_DDRM.svd(n, 2, false, false, true);
        if (!svd.decompose(m)) return 0;
        double[] s = svd.getSingularValues();
        int k = svd.numberOfSingularValues();
        double max = 0, min = Double.POSITIVE_INFINITY;
        for (int i = 0; i < k; i++) {
            max = Math.max(max, s[i]);
            min = Math.min(min, s[i]);
        }
        if (k < 2) min = 0;
        return max == 0 ? 0 : min / max;
    }
}
