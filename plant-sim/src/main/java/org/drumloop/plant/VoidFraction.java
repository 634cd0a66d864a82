package org.drumloop.plant;

/**
 * Volume-averaged void fraction in the risers for a linear steam-quality profile without slip
 * (Åström &amp; Bell 2000, drum-boiler model; restated in the project's model reference, §4.5).
 * With {@code eta = ar (rw - rs) / rs} and {@code L = ln(1 + eta)}:
 * {@code av = rw / (rw - rs) (1 - L / eta)}. Small {@code eta} uses the series to avoid
 * cancellation.
 */
public final class VoidFraction {
    /** Below this eta the series forms are used (cancellation guard). */
    static final double SERIES_ETA = 1e-4;

    private VoidFraction() { }

    /** Mean void fraction av for riser-outlet quality {@code ar}. */
    public static double av(double ar, double rw, double rs) {
        double eta = ar * (rw - rs) / rs;
        double oneMinusLOverEta;
        if (eta < SERIES_ETA) {
            oneMinusLOverEta = eta * (0.5 - eta * (1.0 / 3 - eta * 0.25));
        } else {
            oneMinusLOverEta = 1 - Math.log1p(eta) / eta;
        }
        return rw / (rw - rs) * oneMinusLOverEta;
    }

    /** Partial derivative d av / d ar. */
    public static double dAvDar(double ar, double rw, double rs) {
        double eta = ar * (rw - rs) / rs;
        if (eta < SERIES_ETA) {
            // L/eta - 1/(1+eta) = eta/2 - 2 eta^2/3 + 3 eta^3/4 - ...
            return rw / rs * (0.5 - eta * (2.0 / 3 - eta * 0.75));
        }
        double l = Math.log1p(eta);
        return rw / (rs * eta) * (l / eta - 1 / (1 + eta));
    }

    /** The common factor C of the density partials. */
    static double c(double ar, double rw, double rs) {
        double eta = ar * (rw - rs) / rs;
        if (eta < SERIES_ETA) {
            double r = rw / rs;
            return eta * ((1 - r) * 0.5 + eta * ((2 * r - 1) / 3 + eta * (1 - 3 * r) * 0.25));
        }
        double l = Math.log1p(eta);
        return 1 + rw / (rs * (1 + eta)) - (rs + rw) / (rs * eta) * l;
    }

    /** Partial derivative d av / d rw at constant ar and rs. */
    public static double dAvDrw(double ar, double rw, double rs) {
        double d = rw - rs;
        return -rs / (d * d) * c(ar, rw, rs);
    }

    /** Partial derivative d av / d rs at constant ar and rw. */
    public static double dAvDrs(double ar, double rw, double rs) {
        double d = rw - rs;
        return rw / (d * d) * c(ar, rw, rs);
    }
}
