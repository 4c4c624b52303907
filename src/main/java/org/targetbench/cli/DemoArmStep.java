package org.targetbench.cli;

import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.export.AtomicOutput;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.ServoSet;

import java.io.PrintWriter;
import java.nio.file.Path;

/** The demo's last step: the servo set rehearsed on the invented demo arm, with one period of image latency and the gain sweep. */
final class DemoArmStep {
    /** Starts on the arm in the demo: few, so the gain sweep stays quick. */
    static final int STARTS = 12;
    static final int LATENCY_FRAMES = 1;

    private DemoArmStep() {}

    /** Runs and writes {@code arm/} into the demo's output. */
    static ArmRehearsalResult run(ServoSet set, String setName, AtomicOutput out) throws Exception {
        RehearsalConfig rc = new RehearsalConfig();
        rc.starts = STARTS;
        rc.tracedRuns = 8;
        ArmSteps.Prepared p = ArmSteps.prepare(set, setName, rc, new ArmSteps.Options("demo", null, null, null, null, LATENCY_FRAMES, null, null, true));
        return ArmSteps.run(p, out, "arm/");
    }

    static void print(ArmRehearsalResult r, Path target, PrintWriter w) {
        w.println();
        ArmSteps.print(r, w);
        w.println("Arm:         " + target.resolve("arm/arm-rehearsal.html") + " (joint, manipulability and limit-margin charts, three-view drawing)");
        w.println("Try:         targetbench rehearse --set " + target.resolve("servo-set.json") + " --arm " + target.resolve("arm/arm.json")
                + " --hand-eye " + target.resolve("arm/handeye.json") + " --latency-frames 2 --gain-sweep --out results/arm-what-if");
    }
}
