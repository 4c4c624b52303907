package org.targetbench.pipeline;

import org.targetbench.arm.ArmModel;
import org.targetbench.arm.DemoArm;
import org.targetbench.arm.DhConvention;
import org.targetbench.arm.DhRow;
import org.targetbench.arm.HandEye;
import org.targetbench.arm.Rigid;
import org.targetbench.source.ArmFiles;
import org.targetbench.source.HandEyeFile;
import org.targetbench.source.SourceException;

import java.util.ArrayList;
import java.util.List;

/** Builds the arm model and the hand-eye transform from what {@code source} read (or the demo's), for CLI and app. */
public final class ArmInputs {
    /** An arm and the joints of its reference view (radians; null when none was given). */
    public record Arm(ArmModel model, double[] referenceJointsRad) {}

    private ArmInputs() {}

    /** {@code demo} for the invented demo arm, else an arm.json or URDF file; {@code tip} names the URDF tip link. */
    public static Arm arm(String spec, String tip) throws SourceException {
        if (spec.trim().equalsIgnoreCase("demo")) return new Arm(DemoArm.model(), DemoArm.rad(DemoArm.REFERENCE_DEG));
        return arm(ArmFiles.read(spec, tip));
    }

    public static Arm arm(ArmFiles.Loaded loaded) throws SourceException {
        try {
            if (loaded instanceof ArmFiles.DhArm d) {
                List<DhRow> rows = new ArrayList<>();
                for (double[] r : d.rows()) rows.add(new DhRow(r[0], r[1], r[2], r[3]));
                double[] tool = d.toolXyz() == null ? null : Rigid.fromXyzRpy(d.toolXyz(), d.toolRpy());
                return new Arm(ArmModel.fromDh(d.name(), d.origin(), false, DhConvention.parse(d.convention()), rows, tool, d.lowerRad(), d.upperRad(),
                        d.maxSpeedRadS()), d.referenceJointsRad());
            }
            ArmFiles.UrdfArm u = (ArmFiles.UrdfArm) loaded;
            List<ArmModel.ChainJoint> chain = new ArrayList<>();
            for (ArmFiles.UrdfJoint j : u.chain())
                chain.add(new ArmModel.ChainJoint(j.name(), j.revolute(), j.xyz(), j.rpy(), j.axis(), j.lower(), j.upper(), j.velocity()));
            return new Arm(ArmModel.fromChain(u.name(), u.origin(), chain), null);
        } catch (IllegalArgumentException e) {
            throw new SourceException("arm " + (loaded instanceof ArmFiles.DhArm d ? d.origin() : ((ArmFiles.UrdfArm) loaded).origin()) + ": " + e.getMessage());
        }
    }

    /** {@code demo} for the demo mount, else a handeye.json. */
    public static HandEye handEye(String spec) throws SourceException {
        if (spec.trim().equalsIgnoreCase("demo")) return HandEye.demo();
        HandEyeFile.Data d = HandEyeFile.read(spec);
        List<HandEye.ViewResidual> views = new ArrayList<>();
        for (HandEyeFile.View v : d.views()) views.add(new HandEye.ViewResidual(v.view(), v.rotationDeg(), v.translationMm(), v.outlier(), v.flipped()));
        try {
            return new HandEye(d.rotation(), d.translationM(), views, d.method());
        } catch (IllegalArgumentException e) {
            throw new SourceException(spec + ": not a rigid transform: " + e.getMessage());
        }
    }
}
