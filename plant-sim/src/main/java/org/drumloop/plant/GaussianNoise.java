package org.drumloop.plant;

/**
 * Seeded standard-normal numbers without allocation: SplitMix64 for uniform bits and the
 * Marsaglia polar method for the normal deviates. Same seed, same sequence on every JVM.
 */
final class GaussianNoise {
    private long state;
    private double spare;
    private boolean hasSpare;

    GaussianNoise(long seed) {
        this.state = seed;
    }

    private long nextLong() {
        long z = (state += 0x9E3779B97F4A7C15L);
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /** Uniform in [0, 1). */
    double nextUniform() {
        return (nextLong() >>> 11) * 0x1.0p-53;
    }

    double nextGaussian() {
        if (hasSpare) {
            hasSpare = false;
            return spare;
        }
        double u;
        double v;
        double s;
        do {
            u = 2 * nextUniform() - 1;
            v = 2 * nextUniform() - 1;
            s = u * u + v * v;
        } while (s >= 1 || s == 0);
        double m = StrictMath.sqrt(-2 * StrictMath.log(s) / s);
        spare = v * m;
        hasSpare = true;
        return u * m;
    }
}
