package org.drumloop.core.signal;

import org.drumloop.core.io.Quality;

/**
 * Selection of one control value from three redundant transmitters (median select, common practice
 * for drum level; that ANSI/ISA-77.42.01 recommends it is from memory, unverified).
 *
 * <p>Usable inputs are GOOD or UNCERTAIN. Three usable: the median, quality GOOD unless the median input
 * itself is UNCERTAIN. Two usable: their mean, quality UNCERTAIN (the vote has lost its tie-breaker).
 * One usable: that input, UNCERTAIN. None: the previous result held, BAD. The deviation is the spread
 * (max - min) among usable inputs, for the transmitter deviation alarm; with fewer than two usable
 * inputs it is 0 with quality BAD. Allocation-free; results in fields.
 */
public final class MedianSelect {
    private double valueM;
    private Quality quality = Quality.BAD;
    private double deviationM;
    private Quality deviationQuality = Quality.BAD;
    private int usable;

    /** Select from three inputs. */
    public void select(double a, Quality qa, double b, Quality qb, double c, Quality qc) {
        boolean ua = qa != Quality.BAD;
        boolean ub = qb != Quality.BAD;
        boolean uc = qc != Quality.BAD;
        usable = (ua ? 1 : 0) + (ub ? 1 : 0) + (uc ? 1 : 0);
        if (usable == 3) {
            double mx = Math.max(a, Math.max(b, c));
            double mn = Math.min(a, Math.min(b, c));
            // median by comparison (exact, and it tells whose quality the result carries)
            double med;
            Quality qm;
            if ((a >= b && a <= c) || (a <= b && a >= c)) {
                med = a;
                qm = qa;
            } else if ((b >= a && b <= c) || (b <= a && b >= c)) {
                med = b;
                qm = qb;
            } else {
                med = c;
                qm = qc;
            }
            valueM = med;
            quality = qm;
            deviationM = mx - mn;
            deviationQuality = Ne43.worst(qa, Ne43.worst(qb, qc));
        } else if (usable == 2) {
            double x = ua ? a : b;
            double y = uc ? c : b;
            valueM = 0.5 * (x + y);
            quality = Quality.UNCERTAIN;
            deviationM = Math.abs(x - y);
            deviationQuality = Quality.UNCERTAIN;
        } else if (usable == 1) {
            valueM = ua ? a : (ub ? b : c);
            quality = Quality.UNCERTAIN;
            deviationM = 0.0;
            deviationQuality = Quality.BAD;
        } else {
            quality = Quality.BAD;
            deviationM = 0.0;
            deviationQuality = Quality.BAD;
        }
    }

    public double valueM() { return valueM; }

    public Quality quality() { return quality; }

    public double deviationM() { return deviationM; }

    public Quality deviationQuality() { return deviationQuality; }

    /** Number of usable inputs in the last selection. */
    public int usable() { return usable; }
}
