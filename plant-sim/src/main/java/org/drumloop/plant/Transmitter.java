package org.drumloop.plant;

/**
 * A field transmitter: first-order lag, seeded Gaussian noise, quantisation and a 4–20 mA output
 * with NAMUR NE 43 behaviour (linear 4–20 mA over the calibrated range, measurement clipped to
 * 3.8–20.5 mA, failure signalled at 3.5 mA (fail low) or 21.5 mA (fail high)).
 *
 * <p>{@link #value()} is the measurement in SI (Pa for differential-pressure transmitters, Pa
 * absolute, K). The calibrated range maps {@link #lowerRangeValue()} to 4 mA and
 * {@link #upperRangeValue()} to 20 mA; a reverse-acting transmitter has {@code urv < lrv}.
 */
public final class Transmitter {
    /** NE 43 measurement band and the failure currents used here [mA]. */
    public static final double MA_MIN = 3.8;
    public static final double MA_MAX = 20.5;
    public static final double MA_FAIL_LOW = 3.5;
    public static final double MA_FAIL_HIGH = 21.5;

    private final TransmitterId id;
    private final String unit;
    private final double lrv;
    private final double urv;
    private final double tauS;
    private final double sigma;
    private final double resolution;
    private final GaussianNoise noise;

    private double lagged;
    private double lastDtS = Double.NaN;
    private double lagFactor;
    private double value;
    private double ma;

    // faults
    boolean stuck;
    double biasSi;
    double driftRate;
    double driftSi;
    /** 0 none, -1 fail low, +1 fail high. */
    int failMode;
    double burstSigma;
    double burstRemainingS;
    /** Remaining time of each timed transmitter fault, indexed by Fault.Kind ordinal (NaN = none). */
    final double[] remainingS = new double[Fault.Kind.values().length];

    Transmitter(TransmitterId id, String unit, double lrv, double urv, double tauS, double sigma,
                double resolution, long seed) {
        this.id = id;
        this.unit = unit;
        this.lrv = lrv;
        this.urv = urv;
        this.tauS = tauS;
        this.sigma = sigma;
        this.resolution = resolution;
        this.noise = new GaussianNoise(seed);
        java.util.Arrays.fill(remainingS, Double.NaN);
    }

    public TransmitterId id() { return id; }

    public String tag() { return id.tag(); }

    /** SI unit of {@link #value()}: "Pa" or "K". */
    public String unit() { return unit; }

    /** Measurement in SI. When failed, the value the failure current stands for. */
    public double value() { return value; }

    /** Loop current [mA]. */
    public double currentMa() { return ma; }

    /** True while a fail-low or fail-high fault drives the NE 43 failure current. */
    public boolean failed() { return failMode != 0; }

    /** Value at 4 mA (SI). */
    public double lowerRangeValue() { return lrv; }

    /** Value at 20 mA (SI). */
    public double upperRangeValue() { return urv; }

    /** Current for a measured value (before the NE 43 clip). */
    public double rawCurrentMa(double v) {
        return 4 + 16 * (v - lrv) / (urv - lrv);
    }

    /** Value for a current (inverse of the 4–20 mA scaling). */
    public double valueAtMa(double mA) {
        return lrv + (mA - 4) / 16 * (urv - lrv);
    }

    /** Sets the lag to the true value, as after a long time at steady state. */
    void reset(double trueValue) {
        lagged = trueValue;
        driftSi = 0;
        update(trueValue, 0);
    }

    /** One sample: {@code trueValue} is the process quantity in SI, {@code dtS} the time since the last. */
    void update(double trueValue, double dtS) {
        double g = noise.nextGaussian();
        if (dtS > 0) {
            if (tauS > 0) {
                if (dtS != lastDtS) {
                    lastDtS = dtS;
                    lagFactor = 1 - Math.exp(-dtS / tauS);
                }
                lagged += (trueValue - lagged) * lagFactor;
            } else {
                lagged = trueValue;
            }
            driftSi += driftRate * dtS;
            if (burstRemainingS > 0) {
                burstRemainingS -= dtS;
                if (burstRemainingS <= 0) {
                    burstSigma = 0;
                }
            }
        } else if (tauS <= 0) {
            lagged = trueValue;
        }
        if (stuck) {
            return;
        }
        double s = sigma + burstSigma;
        double v = lagged + biasSi + driftSi + s * g;
        if (resolution > 0) {
            v = Math.rint(v / resolution) * resolution;
        }
        if (failMode < 0) {
            ma = MA_FAIL_LOW;
            value = valueAtMa(ma);
        } else if (failMode > 0) {
            ma = MA_FAIL_HIGH;
            value = valueAtMa(ma);
        } else {
            value = v;
            ma = Math.min(Math.max(rawCurrentMa(v), MA_MIN), MA_MAX);
        }
    }

    void clearFaults() {
        stuck = false;
        biasSi = 0;
        driftRate = 0;
        driftSi = 0;
        failMode = 0;
        burstSigma = 0;
        burstRemainingS = 0;
        java.util.Arrays.fill(remainingS, Double.NaN);
    }
}
