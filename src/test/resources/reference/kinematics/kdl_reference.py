#!/usr/bin/python3
"""Reference forward kinematics from Orocos KDL (Debian python3-pykdl) for TargetBench's arm tests.

Run with the system interpreter: /usr/bin/python3 kdl_reference.py > kdl-poses.csv
Arms: the PUMA 560 in standard DH (parameters of Corke, IEEE RAM 1996, after Armstrong, Khatib & Burdick 1986)
TargetBench's invented demo arm (standard DH, see org.targetbench.arm.DemoArm), and a PUMA-like table in the
modified DH form (Craig 1989) to check that form.
Each row: arm, six joint angles (rad), tool position (m) and rotation matrix (row major) from KDL's ChainFkSolverPos_recursive.
"""
import math
import PyKDL as kdl

PUMA = [  # a, alpha, d  (standard DH, metres / radians)
    (0.0, math.pi / 2, 0.0),
    (0.4318, 0.0, 0.0),
    (0.0203, -math.pi / 2, 0.15005),
    (0.0, math.pi / 2, 0.4318),
    (0.0, -math.pi / 2, 0.0),
    (0.0, 0.0, 0.0),
]
DEMO = [  # a, alpha, d, theta offset  (standard DH, invented demo arm)
    (0.075, -math.pi / 2, 0.400, 0.0),
    (0.365, 0.0, 0.0, -math.pi / 2),
    (0.035, -math.pi / 2, 0.0, 0.0),
    (0.0, math.pi / 2, 0.385, 0.0),
    (0.0, -math.pi / 2, 0.0, 0.0),
    (0.0, 0.0, 0.080, 0.0),
]


def chain(params):
    c = kdl.Chain()
    for p in params:
        a, alpha, d = p[0], p[1], p[2]
        off = p[3] if len(p) > 3 else 0.0
        # joint about z, then the DH frame Rz(theta) Tz(d) Tx(a) Rx(alpha) with the joint offset in theta
        c.addSegment(kdl.Segment(kdl.Joint(kdl.Joint.RotZ), kdl.Frame.DH(a, alpha, d, off)))
    return c


CRAIG = [  # alpha(i-1), a(i-1), d(i): modified DH (Craig 1989) form of a PUMA-like arm, values as in PUMA above
    (0.0, 0.0, 0.0),
    (-math.pi / 2, 0.0, 0.0),
    (0.0, 0.4318, 0.15005),
    (-math.pi / 2, 0.0203, 0.4318),
    (math.pi / 2, 0.0, 0.0),
    (-math.pi / 2, 0.0, 0.0),
]


def craig_chain(params):
    # T = prod Rx(alpha(i-1)) Tx(a(i-1)) Rz(q_i) Tz(d_i); KDL applies a segment's joint before its tip frame, so the
    # fixed part before joint 1 is a jointless segment and segment i carries Tz(d_i) then the next link's Rx Tx.
    c = kdl.Chain()
    c.addSegment(kdl.Segment(kdl.Joint(kdl.Joint.Fixed), kdl.Frame.DH_Craig1989(params[0][1], params[0][0], 0.0, 0.0)))
    for i, p in enumerate(params):
        tip = kdl.Frame(kdl.Vector(0, 0, p[2]))
        if i + 1 < len(params):
            nxt = params[i + 1]
            tip = tip * kdl.Frame.DH_Craig1989(nxt[1], nxt[0], 0.0, 0.0)
        c.addSegment(kdl.Segment(kdl.Joint(kdl.Joint.RotZ), tip))
    return c


QS = [
    [0, 0, 0, 0, 0, 0],
    [0.1, -0.2, 0.3, -0.4, 0.5, -0.6],
    [1.0, 0.5, -0.7, 0.2, 1.1, 2.0],
    [-1.3, 0.9, 0.4, -2.1, -0.8, 0.3],
    [0.7, -1.2, 1.5, 1.0, 0.25, -1.7],
    [2.5, 0.3, -0.3, 0.6, -1.4, 0.9],
    [-0.4, 1.6, -1.1, -0.9, 2.2, -2.8],
]

print("arm,q1,q2,q3,q4,q5,q6,x,y,z,r00,r01,r02,r10,r11,r12,r20,r21,r22")
for name, c in (("puma560", chain(PUMA)), ("demo", chain(DEMO)), ("puma-like-modified", craig_chain(CRAIG))):
    fk = kdl.ChainFkSolverPos_recursive(c)
    for q in QS:
        qa = kdl.JntArray(6)
        for i in range(6):
            qa[i] = q[i]
        f = kdl.Frame()
        fk.JntToCart(qa, f)
        vals = [f.p[0], f.p[1], f.p[2]] + [f.M[i, j] for i in range(3) for j in range(3)]
        print(",".join([name] + ["%.6f" % v for v in q] + ["%.12f" % v for v in vals]))
