package org.drumloop.plant;

/**
 * Inherent flow characteristic of a control valve: relative flow coefficient f = C/Cmax against
 * relative travel x (ISA-75.11.01 forms). Linear: f = x. Equal-percentage: f = R^(x - 1) with
 * rangeability R, and tight shut-off at x = 0.
 */
public enum ValveCharacteristic {
    LINEAR, EQUAL_PERCENTAGE;

    /** Relative flow coefficient at relative travel {@code x} (clamped to 0..1). */
    public double relativeKv(double x, double rangeability) {
        if (x <= 0) {
            return 0;
        }
        double u = Math.min(x, 1);
        return this == LINEAR ? u : Math.pow(rangeability, u - 1);
    }

    public static ValveCharacteristic of(PlantConfig c) {
        return "linear".equals(c.choice(PlantKey.FEED_VALVE_CHARACTERISTIC)) ? LINEAR : EQUAL_PERCENTAGE;
    }
}
