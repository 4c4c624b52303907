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
 */
public final class Simd {
    private Simd() {}

    /** True when the vector module is in the boot layer and not switched off by {@code -Dtargetbench.simd=false}. */
    public static final boolean ENABLED = ModuleLayer.boot().findModule("jdk.incubator.vector").isPresent()
            && !"false".equalsIgnoreCase(System.getProperty("targetbench.simd", "true"));
}
