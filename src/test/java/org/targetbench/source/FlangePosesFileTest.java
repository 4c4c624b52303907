package org.targetbench.source;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.*;

/** The flange-pose CSV: rotation vectors and quaternions describe the same pose. */
class FlangePosesFileTest {
    @Test
    void rotationVectorAndQuaternionAgree(@TempDir Path tmp) throws Exception {
        // derived: a rotation by angle a about unit axis n is the vector a n and the quaternion (cos a/2, sin a/2 n)
        double a = 1.2, nx = 0.6, ny = 0, nz = 0.8;
        Path rv = tmp.resolve("rv.csv"), q = tmp.resolve("q.csv");
        Files.writeString(rv, "frame,x_m,y_m,z_m,rx,ry,rz\nv0,0.5,0.1,0.4," + a * nx + "," + a * ny + "," + a * nz + "\n");
        Files.writeString(q, "frame,x_m,y_m,z_m,qw,qx,qy,qz\nv0,0.5,0.1,0.4," + Math.cos(a / 2) + "," + Math.sin(a / 2) * nx + ","
                + Math.sin(a / 2) * ny + "," + Math.sin(a / 2) * nz + "\n");
        assertArrayEquals(FlangePosesFile.read(rv).get("v0"), FlangePosesFile.read(q).get("v0"), 1e-12);
        Path bad = tmp.resolve("bad.csv");
        Files.writeString(bad, "frame,x,y,z\n");
        assertTrue(assertThrows(SourceException.class, () -> FlangePosesFile.read(bad)).getMessage().contains("header must be"));
    }
}
