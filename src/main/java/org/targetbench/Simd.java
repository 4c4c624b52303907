package org.targetbench;

/**
 * Whether the kernels may use the Java Vector API (the incubator module {@code jdk.incubator.vector} on Java 17).
 * <p>
 * The launcher, the tests and CI start the JVM with {@code --add-modules jdk.incubator.vector}; anywhere else (the jar
 * run by hand, an IDE) the module is absent and every kernel takes its scalar path. Each vector kernel has a scalar twin
 * with identical output, checked by an equality test, so the switch changes speed only, never a number.
 * {@code -Dtargetbench.simd=false} forces the scalar paths (for comparison and for the equality tests' second run).
 * <p>
 * Vector classes must be touched only behind {@link #ENABLED}: loading one without the module fails with
 * {@link NoClassDefFoundError}.
 * <p>
 * All vector code uses one shape, 256 bits (8 floats, 32 bytes): on Java 17, vectors of two shapes in one JVM (say 256
 * and the 512 of {@code SPECIES_PREFERRED} on an AVX-512 machine) stop the compiler from keeping them in registers and
 * every vector is allocated, measured here at 14-34 MB per frame and half the speed in the tracker. Machines whose
 * widest vectors are narrower than 256 bits take the scalar paths ({@link #ENABLED} is false there), since the API
 * would emulate the wider shape in plain Java.
 */
public final class Simd {
    private Simd() {}

    /** True when the vector module is in the boot layer and not switched off by {@code -Dtargetbench.simd=false}. */
    public static final boolean ENABLED = ModuleLayer.boot().findModule("jdk.incubator.vector").isPresent()
            && !"false".equalsIgnoreCase(System.getProperty("targetbench.simd", "true"))
            && Width.wideEnough();

    /** Touches the vector module, so loaded only once the module is known to be there. */
    private static final class Width {
        static boolean wideEnough() {
            return jdk.incubator.vector.VectorShape.preferredShape().vectorBitSize() >= 256;
        }
    }
}
