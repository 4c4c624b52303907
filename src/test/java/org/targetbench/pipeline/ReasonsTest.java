package org.targetbench.pipeline;

import org.junit.jupiter.api.Test;
import org.targetbench.servo.ControlLaw;
import org.targetbench.servo.RehearsalWarning;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.SetDiagnostics;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;

/** Typed findings and warnings render to the sentences the console, the files and the app show. */
class ReasonsTest {
    private static ServoPoint p(int id, double u, double v) {
        return new ServoPoint(id, u, v, 0, 0, 0.5, u, v, -1, org.targetbench.score.Robustness.none(), "");
    }

    @Test
    void setFindingsCarryTheirNumbersAndRenderOnce() {
        // two points 0.2 px apart (a duplicate) and two 3 px apart (coincident), on a wide square
        List<ServoPoint> pts = List.of(p(1, 100, 100), p(2, 100.2, 100), p(3, 400, 100), p(4, 400, 400), p(5, 100, 400), p(6, 103, 400));
        List<SetDiagnostics.Finding> f = SetDiagnostics.check(pts);
        SetDiagnostics.Finding dup = f.stream().filter(x -> x.kind() == SetDiagnostics.Kind.DUPLICATE).findFirst().orElseThrow();
        assertEquals(List.of(1, 2), dup.pointIds());
        assertEquals("points 1 and 2 are the same point (100.20, 100.00) px: a duplicated point adds no information and makes L lose rank",
                Reasons.finding(dup));
        SetDiagnostics.Finding near = f.stream().filter(x -> x.kind() == SetDiagnostics.Kind.COINCIDENT).findFirst().orElseThrow();
        assertEquals(List.of(5, 6), near.pointIds());
        assertEquals(3, near.value(), 1e-12);
        assertEquals("points 5 and 6 are only 3.0 px apart: a tracker can confuse them and L is close to losing rank", Reasons.finding(near));

        List<SetDiagnostics.Finding> three = SetDiagnostics.check(pts.subList(2, 5));
        assertEquals(3, three.get(0).count());
        assertEquals("only 3 points: at least 4 are needed (three points fit up to four camera poses, so the servo may settle at the wrong one)",
                Reasons.finding(three.get(0)));
        List<SetDiagnostics.Finding> line = SetDiagnostics.check(List.of(p(1, 0, 0), p(2, 100, 0), p(3, 200, 0), p(4, 300, 0)));
        assertEquals("points 1, 2, 3, 4 lie on one line (minor/major spread 0.0000 < 0.02): the interaction matrix loses rank and the servo "
                + "cannot control every motion", Reasons.finding(line.get(0)));
    }

    @Test
    void everyRehearsalWarningRenders() {
        Set<RehearsalWarning.Kind> seen = EnumSet.noneOf(RehearsalWarning.Kind.class);
        List<String> texts = new ArrayList<>();
        for (RehearsalWarning.Kind k : RehearsalWarning.Kind.values()) {
            Optional<SetDiagnostics.Finding> f = k == RehearsalWarning.Kind.SET
                    ? Optional.of(SetDiagnostics.check(List.of(p(1, 0, 0))).get(0)) : Optional.empty();
            String s = Reasons.warning(new RehearsalWarning(k, 3, 10, 20.0, ControlLaw.CURRENT, f));
            assertFalse(s.isBlank(), k.name());
            texts.add(s);
            seen.add(k);
        }
        assertEquals(EnumSet.allOf(RehearsalWarning.Kind.class), seen);
        assertEquals("3 of 10 runs had not converged after 20.0 s (too low a gain, noise or a local minimum)",
                texts.get(RehearsalWarning.Kind.TIMED_OUT.ordinal()));
        assertEquals("the camera retreated to 20.00 times the reference distance from the target (the current-L law under rotation about the "
                + "optical axis; the mean law avoids most of it)", texts.get(RehearsalWarning.Kind.FAR_RETREAT.ordinal()));
    }
}
