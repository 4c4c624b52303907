package org.targetbench.select;

import org.targetbench.pipeline.Reasons;
import org.junit.jupiter.api.Test;
import org.targetbench.score.Robustness;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;

class ServoPointSelectorTest {
    private static final int W = 640, H = 480;
    private static final double F = 532, CX = 319.5, CY = 239.5, Z = 0.5;

    private static Candidate cand(int id, double u, double v, OptionalDouble rep, OptionalDouble loc) {
        return new Candidate(id, u, v, 1, (u - CX) / F, (v - CY) / F, Z, u / 10, v / 10, id, true, 10,
                rep.isPresent() ? (int) Math.round(10 * rep.getAsDouble()) : 0,
                new Robustness(rep, OptionalDouble.empty(), loc, OptionalDouble.empty()));
    }

    /** Greedy plus swaps may stop in a local optimum this close to the exhaustive one (objective units). */
    private static final double HEURISTIC_GAP = 0.01;

    /** A 7 x 5 grid over the middle of the image, all robust. */
    private static List<Candidate> grid() { return grid(7, 5); }

    private static List<Candidate> grid(int cols, int rows) {
        List<Candidate> out = new ArrayList<>();
        int id = 0;
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < cols; c++) out.add(cand(id++, 140 + 60 * c + 3 * r, 120 + 60 * r + 2 * c, OptionalDouble.of(1), OptionalDouble.of(0.1)));
        return out;
    }

    @Test
    void choosesTheWidestWellConditionedSetAndExplainsEveryCandidate() {
        List<Candidate> g = grid();
        Selection s = ServoPointSelector.select(g, W, H, new SelectConfig());
        assertEquals(Selection.Outcome.SELECTED, s.outcome(), Reasons.selection(s));
        Set<Integer> ids = new HashSet<>();
        for (Selection.Chosen c : s.chosen()) ids.add(c.candidate().id());
        // the four corners of the grid span the widest square: best conditioned and widest coverage
        assertEquals(Set.of(0, 6, 28, 34), ids, s.chosen().toString());
        assertEquals(g.size(), s.chosen().size() + s.rejected().size());
        for (Selection.Chosen c : s.chosen()) assertTrue(Reasons.chosen(c).contains("cond(L*)"), Reasons.chosen(c));
        for (Selection.Rejected r : s.rejected()) assertFalse(Reasons.rejected(r).isBlank());
        assertTrue(s.condition() > 1 && s.condition() < 1000, "cond " + s.condition());
    }

    @Test
    void greedyPlusSwapsMatchesExhaustiveSearch() {
        SelectConfig c = new SelectConfig();
        for (int k = 4; k <= 6; k++) {
            c.count = k;
            c.exhaustiveLimit = Long.MAX_VALUE;
            Selection ex = ServoPointSelector.select(grid(5, 4), W, H, c);
            c.exhaustiveLimit = 0;
            Selection gr = ServoPointSelector.select(grid(5, 4), W, H, c);
            assertEquals(Selection.SearchKind.EXHAUSTIVE, ex.search().kind());
            assertEquals(Selection.SearchKind.GREEDY_SWAP, gr.search().kind());
            assertTrue(gr.objective() >= ex.objective() - 1e-9, "exhaustive is optimal, k = " + k);
            assertTrue(gr.objective() <= ex.objective() + HEURISTIC_GAP, "k = " + k + ": greedy " + gr.objective() + " vs " + ex.objective());
        }
    }

    @Test
    void filtersGiveReasonsAndSkipWhatWasNotMeasured() {
        List<Candidate> g = new ArrayList<>(grid());
        g.add(cand(100, 330, 250, OptionalDouble.of(0.5), OptionalDouble.empty()));         // poor repeatability
        g.add(cand(101, 5, 240, OptionalDouble.of(1), OptionalDouble.empty()));             // at the border
        g.add(cand(102, 300, 200, OptionalDouble.of(1), OptionalDouble.of(0.9)));           // poor localisation
        g.add(cand(103, 145, 125, OptionalDouble.empty(), OptionalDouble.empty()));         // unmeasured, 7 px from a corner
        Selection s = ServoPointSelector.select(g, W, H, new SelectConfig());
        assertEquals(Selection.Outcome.SELECTED, s.outcome());
        assertTrue(reason(s, 100).startsWith("repeatability 0.50 < 0.70"), reason(s, 100));
        assertTrue(reason(s, 101).startsWith("too near the image border"), reason(s, 101));
        assertTrue(reason(s, 102).startsWith("localisation error 0.90 px"), reason(s, 102));
        String r103 = reason(s, 103);
        assertTrue(r103.contains("passes the filters"), r103);
    }

    @Test
    void refusesWhenNoAcceptableSetExists() {
        List<Candidate> line = new ArrayList<>();
        for (int i = 0; i < 8; i++) line.add(cand(i, 100 + 60 * i, 100 + 30 * i, OptionalDouble.of(1), OptionalDouble.empty()));
        Selection s = ServoPointSelector.select(line, W, H, new SelectConfig());
        assertEquals(Selection.Outcome.NO_ACCEPTABLE_SET, s.outcome());
        assertEquals(Selection.RefusalKind.ILL_CONDITIONED, s.refusal().orElseThrow().kind());
        assertTrue(Reasons.selection(s).contains("cond(L*)") && Reasons.selection(s).contains("collinear"), Reasons.selection(s));
        assertTrue(s.chosen().isEmpty());
        assertEquals(8, s.rejected().size());

        List<Candidate> weak = new ArrayList<>();
        for (Candidate c : grid()) weak.add(cand(c.id(), c.u(), c.v(), OptionalDouble.of(0.2), OptionalDouble.empty()));
        Selection w = ServoPointSelector.select(weak, W, H, new SelectConfig());
        assertEquals(Selection.Outcome.NO_ACCEPTABLE_SET, w.outcome());
        assertEquals(Selection.RefusalKind.TOO_FEW_PASS, w.refusal().orElseThrow().kind());
        assertEquals(java.util.Map.of(Selection.Why.LOW_REPEATABILITY, 35), w.refusal().orElseThrow().filtered());
        assertEquals("no acceptable servo set: only 0 of 35 candidates pass the filters (rejected: 35 repeatability); 4 are needed", Reasons.selection(w));

        SelectConfig far = new SelectConfig();
        far.minSeparationPx = 400;
        Selection f = ServoPointSelector.select(grid(), W, H, far);
        assertEquals(Selection.Outcome.NO_ACCEPTABLE_SET, f.outcome());
        assertEquals(Selection.RefusalKind.NOT_SEPARATED, f.refusal().orElseThrow().kind());
        assertTrue(Reasons.selection(f).contains("400 px apart"), Reasons.selection(f));
    }

    @Test
    void misuseNamesTheNumber() {
        SelectConfig c = new SelectConfig();
        c.count = 3;
        var e = assertThrows(IllegalArgumentException.class, c::checkValidity);
        assertTrue(e.getMessage().contains("got 3"), e.getMessage());
    }

    private static String reason(Selection s, int id) {
        return s.rejected().stream().filter(r -> r.candidate().id() == id).findFirst().map(Reasons::rejected).orElseThrow();
    }
}
