package org.drumloop.plant;

/**
 * Feed pumps, minimum-flow recirculation, feed line and feed control valve into the drum.
 *
 * <p>Every element is quadratic in volume flow (model reference §9): each running pump gives
 * {@code p1 = ps + rho g (s H0 - a Q^2)} (s = head fraction during run-up and run-down), the line
 * loses {@code Kl Q^2}, the valve {@code Rv(u) Q^2} with {@code Rv = 1e5 Pa (rho/rho0) / Kv(u)^2}
 * per (m3/h)^2 (ISA-75.01 liquid form, N1 = 1 with m3/h and bar), and the static lift
 * {@code rho g dz}. Each running pump's recirculation orifice returns
 * {@code Qr = sqrt((p1 - ps) / Kr)} to the hot well. A check valve stops reverse flow. With one
 * pump and no recirculation the header pressure has a closed form; in general {@link #solve}
 * finds it by a safeguarded Newton iteration on the header flow balance. Allocation-free.
 */
public final class FeedTrain {
    /** Water at 15 °C and 1 atm, the Kv reference density [kg/m3] (computed with IF97, check-values §7). */
    public static final double RHO0 = 999.101;
    private static final double M3H = 1.0 / 3600; // m3/s per m3/h

    private final double h0M;
    private final double aSPerM2; // pump slope a [m / (m3/s)^2]
    private final double suctionPa;
    private final double liftM;
    private final double klPaS2M6;
    private final double recircAtShutoffM3S;
    private final double kvsM3h;
    private final ValveCharacteristic characteristic;
    private final double rangeability;

    // results of the last solve
    private double headerPa;
    private double feedM3S;
    private double recircM3S;
    private final double[] pumpM3S = new double[2];

    public FeedTrain(double shutoffHeadM, double ratedHeadM, double ratedFlowM3S, double suctionPa,
                     double liftM, double lineLossPa, double lineLossFlowM3S, double recircAtShutoffM3S,
                     double kvsM3h, ValveCharacteristic characteristic, double rangeability) {
        this.h0M = shutoffHeadM;
        this.aSPerM2 = (shutoffHeadM - ratedHeadM) / (ratedFlowM3S * ratedFlowM3S);
        this.suctionPa = suctionPa;
        this.liftM = liftM;
        this.klPaS2M6 = lineLossPa / (lineLossFlowM3S * lineLossFlowM3S);
        this.recircAtShutoffM3S = recircAtShutoffM3S;
        this.kvsM3h = kvsM3h;
        this.characteristic = characteristic;
        this.rangeability = rangeability;
        this.headerPa = suctionPa;
    }

    public static FeedTrain of(PlantConfig c) {
        return new FeedTrain(c.value(PlantKey.FEED_PUMP_SHUTOFF_HEAD), c.value(PlantKey.FEED_PUMP_RATED_HEAD),
                c.value(PlantKey.FEED_PUMP_RATED_FLOW), c.value(PlantKey.FEED_PUMP_SUCTION_PRESSURE),
                c.value(PlantKey.FEED_STATIC_LIFT), c.value(PlantKey.FEED_LINE_LOSS),
                c.value(PlantKey.FEED_LINE_LOSS_FLOW), c.value(PlantKey.FEED_RECIRC_FLOW_AT_SHUTOFF),
                c.value(PlantKey.FEED_VALVE_KVS), ValveCharacteristic.of(c),
                c.value(PlantKey.FEED_VALVE_RANGEABILITY));
    }

    /** Valve flow coefficient at travel {@code x} [m3/h]. */
    public double kv(double x) {
        return kvsM3h * characteristic.relativeKv(x, rangeability);
    }

    /** Valve resistance {@code dp = Rv Q^2} [Pa per (m3/s)^2]; infinite when shut. */
    public double valveResistance(double x, double rhoKgM3) {
        double kv = kv(x);
        if (kv <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        double kvSi = kv * M3H;
        return 1e5 * (rhoKgM3 / RHO0) / (kvSi * kvSi);
    }

    /**
     * Solves the feed train for the header (pump discharge) pressure and the flows.
     *
     * @param drumPa drum pressure [Pa]
     * @param valveFrac valve travel 0..1
     * @param headA head fraction of pump A (0 = stopped, 1 = full speed)
     * @param headB head fraction of pump B
     * @param rhoKgM3 feed-water density
     * @return volume flow into the drum [m3/s]
     */
    public double solve(double drumPa, double valveFrac, double headA, double headB, double rhoKgM3) {
        double rg = rhoKgM3 * DrumModel.G;
        double rv = valveResistance(valveFrac, rhoKgM3);
        double rLine = klPaS2M6 + rv;
        double pBack = drumPa + rg * liftM;
        double hMax = Math.max(headA, headB);
        int running = (headA > 0 ? 1 : 0) + (headB > 0 ? 1 : 0);
        pumpM3S[0] = 0;
        pumpM3S[1] = 0;
        if (running == 0) {
            headerPa = suctionPa;
            feedM3S = 0;
            recircM3S = 0;
            return 0;
        }
        double kr = recircAtShutoffM3S > 0 ? rg * h0M / (recircAtShutoffM3S * recircAtShutoffM3S) : 0;
        double lo = Math.min(suctionPa, pBack);
        double hi = Math.max(suctionPa, pBack) + rg * h0M * hMax;
        double p1 = Math.min(Math.max(headerPa, lo), hi);
        double rga = rg * aSPerM2;
        for (int it = 0; it < 100; it++) {
            // balance F(p1) = pumps - feed - recirculation, decreasing in p1
            double f = 0;
            double df = 0;
            double qa = pumpFlow(headA, p1, rg, rga);
            double qb = pumpFlow(headB, p1, rg, rga);
            f += qa + qb;
            if (qa > 0) {
                df -= 1 / (2 * rga * qa);
            }
            if (qb > 0) {
                df -= 1 / (2 * rga * qb);
            }
            double dpLine = p1 - pBack;
            double qf = (dpLine > 0 && rLine < Double.POSITIVE_INFINITY) ? Math.sqrt(dpLine / rLine) : 0;
            f -= qf;
            if (qf > 0) {
                df -= 1 / (2 * rLine * qf);
            }
            double qr = 0;
            if (kr > 0 && p1 > suctionPa) {
                qr = Math.sqrt((p1 - suctionPa) / kr);
                f -= running * qr;
                df -= running / (2 * kr * Math.max(qr, 1e-12));
            }
            pumpM3S[0] = qa;
            pumpM3S[1] = qb;
            feedM3S = qf;
            recircM3S = running * qr;
            if (f == 0) {
                break;
            }
            if (f > 0) {
                lo = p1;
            } else {
                hi = p1;
            }
            double next = df < 0 ? p1 - f / df : 0.5 * (lo + hi);
            if (!(next >= lo && next <= hi)) {
                next = 0.5 * (lo + hi);
            }
            if (Math.abs(next - p1) <= 1e-9 * Math.max(p1, 1e5) || hi - lo <= 1e-9 * Math.max(p1, 1e5)) {
                p1 = next;
                break;
            }
            p1 = next;
        }
        headerPa = p1;
        double dpLine = p1 - pBack;
        feedM3S = (dpLine > 0 && rLine < Double.POSITIVE_INFINITY) ? Math.sqrt(dpLine / rLine) : 0;
        return feedM3S;
    }

    private double pumpFlow(double head, double p1, double rg, double rga) {
        if (head <= 0) {
            return 0;
        }
        double x = rg * head * h0M - (p1 - suctionPa);
        return x > 0 ? Math.sqrt(x / rga) : 0;
    }

    /** Pump discharge (header) pressure of the last solve [Pa abs]. */
    public double headerPa() { return headerPa; }

    /** Feed flow into the drum of the last solve [m3/s]. */
    public double feedM3S() { return feedM3S; }

    /** Total recirculation flow of the last solve [m3/s]. */
    public double recircM3S() { return recircM3S; }

    /** Flow delivered by pump 0 (A) or 1 (B) in the last solve [m3/s]. */
    public double pumpM3S(int pump) { return pumpM3S[pump]; }

    /** Pump suction pressure [Pa abs]. */
    public double suctionPa() { return suctionPa; }
}
