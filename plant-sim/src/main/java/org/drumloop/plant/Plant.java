package org.drumloop.plant;

import org.drumloop.plant.water.Iapws97;
import org.drumloop.plant.water.SaturationState;
import org.drumloop.plant.water.SaturationTable;

/**
 * The simulated drum boiler: Åström–Bell drum, risers and downcomers ({@link DrumModel}); feed
 * pumps, recirculation, line and control valve ({@link FeedTrain}); consumer steam valve and safety
 * valve; burner with a plant-side pressure controller; transmitters with NE 43 outputs; faults.
 *
 * <p>{@link #step(double)} advances plant time with fixed-step RK4 split into sub-steps of at most
 * {@code max_substep}; inputs are held over each sub-step; nothing is allocated, no clock is read.
 * Same plant file, seed and inputs give bit-identical results.
 *
 * <p>This is a test bench model, not a safety system: interlock settings for a real boiler come
 * from the boiler maker, classification rules and local codes.
 */
public final class Plant {
    /** Pump indices. */
    public static final int PUMP_A = 0;
    public static final int PUMP_B = 1;
    /** Lowest drum pressure the model accepts: just above one standard atmosphere [Pa]. */
    public static final double MIN_PRESSURE_PA = 101_325 + 1_000;
    /** Highest drum pressure the model accepts (below where the saturation line enters IF97 region 3) [Pa]. */
    public static final double MAX_PRESSURE_PA = 16.0e6;

    private static final int BURNER_ON = 0;
    private static final int BURNER_OFF = 1;
    private static final int BURNER_PURGE = 2;
    private static final int BURNER_RAMP = 3;

    // global fault timer slots
    private static final int T_PUMP_A = 0;
    private static final int T_PUMP_B = 1;
    private static final int T_VALVE = 2;
    private static final int T_SURGE = 3;
    private static final int T_LEAK = 4;
    private static final int T_BURNER = 5;

    private static final double[] RK4_WEIGHTS = {1.0 / 6, 2.0 / 6, 2.0 / 6, 1.0 / 6};

    private final PlantConfig cfg;
    private final SaturationTable table = SaturationTable.standard();
    private final DrumModel model;
    private final DrumGeometry geometry;
    private final FeedTrain feed;
    private final Rk4 rk4 = new Rk4(4);
    private final double[] y = new double[4];
    private final double[] yDotScratch = new double[4];
    private final SaturationState satOut = new SaturationState();
    private final SaturationState satScratch = new SaturationState();
    private final Rk4.Ode ode = this::stage;

    // configuration, SI
    private final double maxSubstepS;
    private final double nwlHeightM;
    private final double riserTopHeightM;
    private final double vBelowMaxM3;
    private final double vBelowMinM3;
    private final double ratedSteamKgS;
    private final double nominalPressurePa;
    private final double steamValveRatedOpening;
    private final double csKgSPa;
    private final double svSetPa;
    private final double svReseatPa;
    private final double svCapacityKgS;
    private final double maxHeatW;
    private final double burnerTauS;
    private final double pcGainPerPa;
    private final double pcIntegralTimeS;
    private final double purgeTimeS;
    private final double firingRampTimeS;
    private final double valveStrokeTimeS;
    private final double valveDeadbandFrac;
    private final double pumpStartTimeS;
    private final double pumpStopTimeS;
    private final double tapLowM;
    private final double tapSpanM;
    private final double rhoRefLeg;
    private final double steamFlowK;
    private final double feedFlowK;

    // state
    private double timeS;
    private double stageWeightH;
    private int stageIndex;
    private double massInKg;
    private double energyInJ;
    private double vsd0M3;

    // actuators and inputs
    private double valveDemandFrac;
    private double valvePosFrac;
    private boolean valveMoving;
    private final boolean[] pumpCommand = new boolean[2];
    private final boolean[] pumpTripped = new boolean[2];
    private final boolean[] pumpOn = new boolean[2];
    private final double[] pumpHead = new double[2];
    private boolean fuelCutoff;
    private boolean burnerTrip;
    private int burnerState = BURNER_ON;
    private double purgeRemainingS;
    private double rampLimit = 1;
    private double pcIntegral;
    private double pressureSetpointPa;
    private double firingManual = Double.NaN;
    private double firingFrac;
    private double heatLagW;
    private double heatStepW;
    private double steamDemandFrac;
    private double steamOverrideKgS = Double.NaN;
    private double surgeFrac;
    private double feedTempK;
    private double feedOverrideKgS = Double.NaN;
    private double rhoFeed;
    private double hFeed;
    private double cachedFeedPa = Double.NaN;
    private double cachedFeedTempK = Double.NaN;
    private double feedFlowKgS;
    private double feedHeaderPa;
    private boolean svOpen;
    private double leakKgS;
    private boolean valveStuck;
    private final double[] faultRemainingS = new double[6];
    private double lastLagH = Double.NaN;
    private double lagFactor;

    // outputs
    private double levelM;
    private double heightM;
    private double steamFlowKgS;
    private double svFlowKgS;
    private double downcomerKgS;
    private boolean invalid;
    private boolean risersUncovered;
    private boolean flooded;
    private boolean pressureLow;
    private boolean pressureHigh;

    private final Transmitter[] tx = new Transmitter[TransmitterId.values().length];
    private PlantEventListener listener;

    public Plant(PlantConfig cfg, long seed) {
        this.cfg = cfg;
        this.model = DrumModel.of(cfg, table);
        this.geometry = DrumGeometry.of(cfg);
        this.feed = FeedTrain.of(cfg);
        this.maxSubstepS = cfg.value(PlantKey.MAX_SUBSTEP);
        this.nwlHeightM = cfg.nwlHeightM();
        this.riserTopHeightM = cfg.riserTopHeightM();
        double vd = cfg.value(PlantKey.DRUM_VOLUME);
        this.vBelowMaxM3 = Math.min(geometry.fullVolume(), vd) * 0.995;
        this.vBelowMinM3 = 0.005 * Math.min(geometry.fullVolume(), vd);
        this.ratedSteamKgS = cfg.ratedSteamFlowKgS();
        this.nominalPressurePa = cfg.nominalPressurePa();
        this.steamValveRatedOpening = cfg.value(PlantKey.STEAM_VALVE_RATED_OPENING);
        this.csKgSPa = ratedSteamKgS / (steamValveRatedOpening * nominalPressurePa);
        this.svSetPa = cfg.value(PlantKey.SAFETY_VALVE_SET_PRESSURE);
        this.svReseatPa = cfg.value(PlantKey.SAFETY_VALVE_RESEAT_PRESSURE);
        this.svCapacityKgS = cfg.value(PlantKey.SAFETY_VALVE_CAPACITY);
        this.maxHeatW = cfg.maxHeatW();
        this.burnerTauS = cfg.value(PlantKey.BURNER_TIME_CONSTANT);
        this.pcGainPerPa = cfg.value(PlantKey.PRESSURE_CONTROLLER_GAIN);
        this.pcIntegralTimeS = cfg.value(PlantKey.PRESSURE_CONTROLLER_INTEGRAL_TIME);
        this.purgeTimeS = cfg.value(PlantKey.PURGE_TIME);
        this.firingRampTimeS = cfg.value(PlantKey.FIRING_RAMP_TIME);
        this.valveStrokeTimeS = cfg.value(PlantKey.FEED_VALVE_STROKE_TIME);
        this.valveDeadbandFrac = cfg.value(PlantKey.FEED_VALVE_DEADBAND);
        this.pumpStartTimeS = cfg.value(PlantKey.FEED_PUMP_START_TIME);
        this.pumpStopTimeS = cfg.value(PlantKey.FEED_PUMP_STOP_TIME);
        this.tapLowM = cfg.value(PlantKey.LEVEL_TAP_LOW);
        this.tapSpanM = cfg.value(PlantKey.LEVEL_TAP_HIGH) - tapLowM;
        this.rhoRefLeg = Iapws97.liquidDensity(nominalPressurePa, cfg.value(PlantKey.LEVEL_REF_LEG_TEMPERATURE));
        double qs = cfg.value(PlantKey.STEAM_FLOW_TX_RANGE);
        this.steamFlowK = cfg.value(PlantKey.STEAM_FLOW_TX_DP_RANGE) * cfg.value(PlantKey.STEAM_FLOW_TX_DESIGN_DENSITY) / (qs * qs);
        double qf = cfg.value(PlantKey.FEED_FLOW_TX_RANGE);
        this.feedFlowK = cfg.value(PlantKey.FEED_FLOW_TX_DP_RANGE) * cfg.value(PlantKey.FEED_FLOW_TX_DESIGN_DENSITY) / (qf * qf);
        this.pressureSetpointPa = cfg.pressureSetpointPa();
        this.feedTempK = cfg.value(PlantKey.FEED_TEMPERATURE);

        // level transmitters: hot calibration at nominal pressure (common practice)
        table.lookup(nominalPressurePa, satScratch);
        double dpLow = LevelDp.dpPa(tapSpanM, cfg.levelRangeLowM() - tapLowM, rhoRefLeg, satScratch.rhoW, satScratch.rhoS);
        double dpHigh = LevelDp.dpPa(tapSpanM, cfg.levelRangeHighM() - tapLowM, rhoRefLeg, satScratch.rhoW, satScratch.rhoS);
        int i = 0;
        for (TransmitterId id : new TransmitterId[] {TransmitterId.LEVEL_A, TransmitterId.LEVEL_B, TransmitterId.LEVEL_C}) {
            tx[id.ordinal()] = new Transmitter(id, "Pa", dpLow, dpHigh, cfg.value(PlantKey.LEVEL_TX_TIME_CONSTANT),
                    cfg.value(PlantKey.LEVEL_TX_NOISE), cfg.value(PlantKey.LEVEL_TX_RESOLUTION), mix(seed, i++));
        }
        tx[TransmitterId.STEAM_FLOW.ordinal()] = new Transmitter(TransmitterId.STEAM_FLOW, "Pa", 0,
                cfg.value(PlantKey.STEAM_FLOW_TX_DP_RANGE), cfg.value(PlantKey.STEAM_FLOW_TX_TIME_CONSTANT),
                cfg.value(PlantKey.STEAM_FLOW_TX_NOISE), cfg.value(PlantKey.STEAM_FLOW_TX_RESOLUTION), mix(seed, i++));
        tx[TransmitterId.FEED_FLOW.ordinal()] = new Transmitter(TransmitterId.FEED_FLOW, "Pa", 0,
                cfg.value(PlantKey.FEED_FLOW_TX_DP_RANGE), cfg.value(PlantKey.FEED_FLOW_TX_TIME_CONSTANT),
                cfg.value(PlantKey.FEED_FLOW_TX_NOISE), cfg.value(PlantKey.FEED_FLOW_TX_RESOLUTION), mix(seed, i++));
        tx[TransmitterId.DRUM_PRESSURE.ordinal()] = new Transmitter(TransmitterId.DRUM_PRESSURE, "Pa",
                cfg.value(PlantKey.PRESSURE_TX_RANGE_LOW), cfg.value(PlantKey.PRESSURE_TX_RANGE_HIGH),
                cfg.value(PlantKey.PRESSURE_TX_TIME_CONSTANT), cfg.value(PlantKey.PRESSURE_TX_NOISE),
                cfg.value(PlantKey.PRESSURE_TX_RESOLUTION), mix(seed, i++));
        tx[TransmitterId.FEED_TEMP.ordinal()] = new Transmitter(TransmitterId.FEED_TEMP, "K",
                cfg.value(PlantKey.FEED_TEMP_TX_RANGE_LOW), cfg.value(PlantKey.FEED_TEMP_TX_RANGE_HIGH),
                cfg.value(PlantKey.FEED_TEMP_TX_TIME_CONSTANT), cfg.value(PlantKey.FEED_TEMP_TX_NOISE),
                cfg.value(PlantKey.FEED_TEMP_TX_RESOLUTION), mix(seed, i++));
        tx[TransmitterId.FEED_PRESSURE.ordinal()] = new Transmitter(TransmitterId.FEED_PRESSURE, "Pa",
                cfg.value(PlantKey.FEED_PRESSURE_TX_RANGE_LOW), cfg.value(PlantKey.FEED_PRESSURE_TX_RANGE_HIGH),
                cfg.value(PlantKey.FEED_PRESSURE_TX_TIME_CONSTANT), cfg.value(PlantKey.FEED_PRESSURE_TX_NOISE),
                cfg.value(PlantKey.FEED_PRESSURE_TX_RESOLUTION), mix(seed, i));

        // bubble volume without condensation, fixed by the file's steady state at nominal load
        double qsNom = cfg.nominalLoadFrac() * ratedSteamKgS * pressureSetpointPa / nominalPressurePa;
        balanceFeed(pressureSetpointPa, qsNom);
        table.lookup(pressureSetpointPa, satScratch);
        double hc = satScratch.hS - satScratch.hW;
        this.vsd0M3 = cfg.value(PlantKey.STEAM_UNDER_SURFACE_VOLUME)
                + model.tdS * (satScratch.hW - hFeed) * qsNom / (hc * satScratch.rhoS);
        initSteadyState(cfg.nominalLoadFrac());
    }

    private static long mix(long seed, int i) {
        return seed * 0x9E3779B97F4A7C15L + (i + 1) * 0xD1B54A32D192ED03L;
    }

    public PlantConfig config() { return cfg; }

    /** The drum model (read-only use: parameters and last outputs). */
    public DrumModel drumModel() { return model; }

    /** The feed train (read-only use: last solve). */
    public FeedTrain feedTrain() { return feed; }

    /** The drum geometry used for the level. */
    public DrumGeometry geometry() { return geometry; }

    // ------------------------------------------------------------------ steady state

    /**
     * Balanced start: feed = steam, level at NWL, pressure at the setpoint, duty pump A running,
     * B stopped, feed valve at the balancing position, burner on in auto, no faults, time 0.
     */
    public void initSteadyState(double steamDemandFrac) {
        clearAll();
        timeS = 0;
        massInKg = 0;
        energyInJ = 0;
        invalid = false;
        risersUncovered = false;
        flooded = false;
        pressureLow = false;
        pressureHigh = false;
        steamOverrideKgS = Double.NaN;
        feedOverrideKgS = Double.NaN;
        firingManual = Double.NaN;
        heatStepW = 0;
        fuelCutoff = false;
        svOpen = false;
        this.steamDemandFrac = Math.max(0, steamDemandFrac);
        double p0 = pressureSetpointPa;
        double qs0 = steamValveOpening() * csKgSPa * p0;
        double u = balanceFeed(p0, qs0);
        valveDemandFrac = u;
        valvePosFrac = u;
        valveMoving = false;
        pumpCommand[PUMP_A] = true;
        pumpCommand[PUMP_B] = false;
        pumpOn[PUMP_A] = true;
        pumpOn[PUMP_B] = false;
        pumpHead[PUMP_A] = 1;
        pumpHead[PUMP_B] = 0;
        double ar = model.qualityForSteamFlow(p0, qs0, hFeed);
        table.lookup(p0, satScratch);
        double hc = satScratch.hS - satScratch.hW;
        double vsdSs = Math.max(0, vsd0M3 - model.tdS * (satScratch.hW - hFeed) * qs0 / (hc * satScratch.rhoS));
        model.steadyStateFromQuality(p0, ar, hFeed, vsdSs, geometry.volumeBelow(nwlHeightM), y);
        model.vsd0M3 = vsd0M3;
        heatLagW = model.heatW;
        firingFrac = Math.min(1, heatLagW / maxHeatW);
        pcIntegral = firingFrac;
        burnerState = BURNER_ON;
        rampLimit = 1;
        purgeRemainingS = 0;
        feedFlowKgS = qs0;
        heightM = nwlHeightM;
        setInputsForSubstep(0);
        evaluateOutputs();
        for (Transmitter t : tx) {
            t.reset(trueValue(t.id()));
        }
    }

    /** Finds the valve travel that feeds {@code qfKgS} against drum pressure {@code pPa}; sets rho and hf. */
    private double balanceFeed(double pPa, double qfKgS) {
        double header = pPa;
        double u = 1;
        for (int outer = 0; outer < 4; outer++) {
            updateFeedProperties(header);
            double lo = 0;
            double hi = 1;
            double minFlow = feed.solve(pPa, 1e-12, 1, 0, rhoFeed) * rhoFeed;
            if (feed.solve(pPa, 1, 1, 0, rhoFeed) * rhoFeed < qfKgS) {
                u = 1;
            } else if (qfKgS <= 0 || qfKgS < 0.5 * minFlow) {
                // below half the valve's smallest controllable flow: closer to shut than open
                u = 0;
            } else if (qfKgS <= minFlow) {
                u = 1e-12;
            } else {
                for (int i = 0; i < 60; i++) {
                    double mid = 0.5 * (lo + hi);
                    if (feed.solve(pPa, mid, 1, 0, rhoFeed) * rhoFeed < qfKgS) {
                        lo = mid;
                    } else {
                        hi = mid;
                    }
                }
                u = 0.5 * (lo + hi);
            }
            feed.solve(pPa, u, 1, 0, rhoFeed);
            header = feed.headerPa();
        }
        // properties stay those of the last bisection, so the running plant sees the same balance
        feedHeaderPa = header;
        return u;
    }

    private void updateFeedProperties(double headerPa) {
        if (headerPa != cachedFeedPa || feedTempK != cachedFeedTempK) {
            rhoFeed = Iapws97.liquidDensity(headerPa, feedTempK);
            hFeed = Iapws97.enthalpy1(headerPa, feedTempK);
            cachedFeedPa = headerPa;
            cachedFeedTempK = feedTempK;
        }
    }

    // ------------------------------------------------------------------ stepping

    /** Advances plant time by {@code dtS}; allocation-free. */
    public void step(double dtS) {
        if (!(dtS > 0)) {
            return;
        }
        tickFaultTimers(dtS);
        int n = (int) Math.ceil(dtS / maxSubstepS - 1e-9);
        if (n < 1) {
            n = 1;
        }
        double h = dtS / n;
        for (int i = 0; i < n; i++) {
            substep(h);
        }
        evaluateOutputs();
        for (Transmitter t : tx) {
            t.update(trueValue(t.id()), dtS);
        }
    }

    private void substep(double h) {
        updatePumps(h);
        updateValve(h);
        updateBurner(h);
        setInputsForSubstep(h);
        stageWeightH = h;
        stageIndex = 0;
        massInKg += h * (model.qfKgS - model.qLeakKgS);
        energyInJ += h * (model.heatW + model.qfKgS * model.hfJKg);
        rk4.step(ode, timeS, y, h);
        timeS += h;
        guardState();
    }

    /** One RK4 stage: the drum model plus the outflow bookkeeping weighted like the RK4 sum. */
    private void stage(double tS, double[] yy, double[] yDot) {
        model.computeDerivatives(tS, yy, yDot);
        double w = RK4_WEIGHTS[stageIndex & 3] * stageWeightH;
        stageIndex++;
        massInKg -= w * model.qsOut;
        energyInJ -= w * (model.qsOut * model.hsOut + model.qLeakKgS * model.hwOut);
    }

    private void setInputsForSubstep(double h) {
        double p = y[1];
        // steam side: consumer valve (choked, qs = Cs u p) or prescribed flow, plus safety valve
        if (Double.isNaN(steamOverrideKgS)) {
            model.qsFixedKgS = 0;
            model.qsPerPa = csKgSPa * steamValveOpening();
        } else {
            model.qsFixedKgS = steamOverrideKgS;
            model.qsPerPa = 0;
        }
        if (!svOpen && p >= svSetPa) {
            svOpen = true;
            event("safety_valve_lift", "Safety valve lifted at its set pressure.");
        } else if (svOpen && p <= svReseatPa) {
            svOpen = false;
            event("safety_valve_reseat", "Safety valve reseated.");
        }
        if (svOpen) {
            model.qsPerPa += svCapacityKgS / svSetPa;
        }
        // feed
        if (Double.isNaN(feedOverrideKgS)) {
            if (feedTempK != cachedFeedTempK) {
                updateFeedProperties(feedHeaderPa);
            }
            double q = feed.solve(p, valvePosFrac, pumpHead[PUMP_A], pumpHead[PUMP_B], rhoFeed);
            feedHeaderPa = feed.headerPa();
            if (Math.abs(feedHeaderPa - cachedFeedPa) > 1e4) {
                updateFeedProperties(feedHeaderPa);
            }
            feedFlowKgS = q * rhoFeed;
        } else {
            feedHeaderPa = p;
            if (Math.abs(feedHeaderPa - cachedFeedPa) > 1e4 || feedTempK != cachedFeedTempK) {
                updateFeedProperties(feedHeaderPa);
            }
            feedFlowKgS = Math.max(0, feedOverrideKgS);
        }
        model.qfKgS = feedFlowKgS;
        model.hfJKg = hFeed;
        model.qLeakKgS = leakKgS;
        // heat: first-order lag of the firing rate
        if (h > 0) {
            if (h != lastLagH) {
                lastLagH = h;
                lagFactor = 1 - Math.exp(-h / burnerTauS);
            }
            heatLagW += (maxHeatW * firingFrac - heatLagW) * lagFactor;
        }
        model.heatW = heatLagW + heatStepW;
    }

    private double steamValveOpening() {
        return Math.min(1, Math.max(0, (steamDemandFrac + surgeFrac) * steamValveRatedOpening));
    }

    private void updatePumps(double h) {
        for (int j = 0; j < 2; j++) {
            boolean on = pumpCommand[j] && !pumpTripped[j];
            if (on != pumpOn[j]) {
                pumpOn[j] = on;
                if (on) {
                    event(j == 0 ? "feed_pump_a_start" : "feed_pump_b_start", "Feed pump started.");
                } else if (!pumpTripped[j]) {
                    event(j == 0 ? "feed_pump_a_stop" : "feed_pump_b_stop", "Feed pump stopped.");
                }
            }
            if (on) {
                pumpHead[j] = Math.min(1, pumpHead[j] + h / pumpStartTimeS);
            } else {
                pumpHead[j] = Math.max(0, pumpHead[j] - h / pumpStopTimeS);
            }
        }
    }

    private void updateValve(double h) {
        if (valveStuck) {
            return;
        }
        double err = valveDemandFrac - valvePosFrac;
        if (!valveMoving && Math.abs(err) > valveDeadbandFrac) {
            valveMoving = true;
        }
        if (valveMoving) {
            double maxMove = valveStrokeTimeS > 0 ? h / valveStrokeTimeS : 1;
            if (Math.abs(err) <= maxMove) {
                valvePosFrac = valveDemandFrac;
                valveMoving = valveDeadbandFrac > 0 ? false : valveMoving;
            } else {
                valvePosFrac += Math.copySign(maxMove, err);
            }
        }
    }

    private void updateBurner(double h) {
        boolean available = !fuelCutoff && !burnerTrip;
        if (!available) {
            if (burnerState != BURNER_OFF) {
                burnerState = BURNER_OFF;
                event(burnerTrip ? "burner_trip" : "fuel_cutoff",
                        burnerTrip ? "Burner tripped: fuel cut." : "Fuel cut off by the low-low level input.");
            }
            rampLimit = 0;
        } else if (burnerState == BURNER_OFF) {
            burnerState = BURNER_PURGE;
            purgeRemainingS = purgeTimeS;
        }
        if (burnerState == BURNER_PURGE) {
            purgeRemainingS -= h;
            if (purgeRemainingS <= 0) {
                burnerState = BURNER_RAMP;
                rampLimit = 0;
                event("burner_restart", "Burner relit after purge; firing ramps up.");
            }
        } else if (burnerState == BURNER_RAMP) {
            rampLimit = firingRampTimeS > 0 ? Math.min(1, rampLimit + h / firingRampTimeS) : 1;
            if (rampLimit >= 1) {
                burnerState = BURNER_ON;
            }
        }
        double limit = (burnerState == BURNER_ON || burnerState == BURNER_RAMP) ? rampLimit : 0;
        double e = pressureSetpointPa - y[1];
        double out;
        if (!Double.isNaN(firingManual)) {
            out = Math.min(1, Math.max(0, firingManual));
            pcIntegral = out - pcGainPerPa * e;
        } else {
            double next = pcIntegral + pcGainPerPa * h / pcIntegralTimeS * e;
            double unsat = pcGainPerPa * e + next;
            // conditional integration: do not wind further into a limit
            if (!((unsat > limit && e > 0) || (unsat < 0 && e < 0))) {
                pcIntegral = next;
            }
            out = Math.min(1, Math.max(0, pcGainPerPa * e + pcIntegral));
        }
        firingFrac = Math.min(out, limit);
    }

    /** Keeps the state inside the model's valid range; raises events and marks the plant invalid. */
    private void guardState() {
        if (y[2] < DrumModel.MIN_QUALITY) {
            y[2] = DrumModel.MIN_QUALITY;
        } else if (y[2] > 0.999) {
            y[2] = 0.999;
        }
        if (y[3] < 0) {
            y[3] = 0;
        }
        if (!(y[1] >= MIN_PRESSURE_PA)) {
            y[1] = MIN_PRESSURE_PA;
            invalid = true;
            if (!pressureLow) {
                pressureLow = true;
                event("pressure_low", "Drum pressure at or below atmospheric: outside the model, state clamped.");
            }
        } else if (y[1] > MAX_PRESSURE_PA) {
            y[1] = MAX_PRESSURE_PA;
            invalid = true;
            if (!pressureHigh) {
                pressureHigh = true;
                event("pressure_high", "Drum pressure above the model's range: state clamped.");
            }
        }
        if (Double.isNaN(y[0]) || Double.isNaN(y[2]) || Double.isNaN(y[3])) {
            // cannot happen with the guards above; keep the plant steppable if it ever does
            invalid = true;
            y[0] = model.vdcM3 + model.vrM3;
            y[2] = 0.01;
            y[3] = 0;
        }
        // level limits: water plus bubbles below the surface must stay inside the drum
        double av = model.avOut; // from the last RK4 stage: close enough for a range guard
        double vBelow = y[0] - model.vdcM3 - (1 - av) * model.vrM3 + y[3];
        if (vBelow < vBelowMinM3) {
            y[0] += vBelowMinM3 - vBelow;
            invalid = true;
        } else if (vBelow > vBelowMaxM3) {
            double excess = vBelow - vBelowMaxM3;
            double fromBubbles = Math.min(excess, y[3]);
            y[3] -= fromBubbles;
            y[0] -= excess - fromBubbles;
            invalid = true;
        }
    }

    private void evaluateOutputs() {
        model.computeDerivatives(timeS, y, yDotScratch);
        satOut.set(model.sat);
        double vBelow = model.vwdOut + Math.max(y[3], 0);
        heightM = geometry.heightOf(vBelow, heightM);
        levelM = heightM - nwlHeightM;
        downcomerKgS = model.qdcOut;
        double p = y[1];
        svFlowKgS = svOpen ? svCapacityKgS / svSetPa * p : 0;
        steamFlowKgS = Double.isNaN(steamOverrideKgS) ? csKgSPa * steamValveOpening() * p : steamOverrideKgS;
        if (heightM <= riserTopHeightM) {
            invalid = true;
            if (!risersUncovered) {
                risersUncovered = true;
                event("risers_uncovered", "Drum level below the riser tops: risers uncovered, model outside its valid range.");
            }
        } else if (heightM > riserTopHeightM + 0.02 * geometry.heightM()) {
            risersUncovered = false;
        }
        if (vBelow >= vBelowMaxM3 * 0.999) {
            invalid = true;
            if (!flooded) {
                flooded = true;
                event("drum_flooded", "Drum flooded: water at the top of the drum, model outside its valid range.");
            }
        } else if (vBelow < 0.95 * vBelowMaxM3) {
            flooded = false;
        }
    }

    private double trueValue(TransmitterId id) {
        switch (id) {
            case LEVEL_A:
            case LEVEL_B:
            case LEVEL_C:
                return LevelDp.dpPa(tapSpanM, levelM - tapLowM, rhoRefLeg, satOut.rhoW, satOut.rhoS);
            case STEAM_FLOW:
                return steamFlowK * steamFlowKgS * steamFlowKgS / satOut.rhoS;
            case FEED_FLOW:
                return feedFlowK * feedFlowKgS * feedFlowKgS / rhoFeed;
            case DRUM_PRESSURE:
                return y[1];
            case FEED_TEMP:
                return feedTempK;
            case FEED_PRESSURE:
                return feedHeaderPa;
            default:
                return 0;
        }
    }

    private void event(String tag, String message) {
        if (listener != null) {
            listener.onEvent(timeS, tag, message);
        }
    }

    public double timeS() { return timeS; }

    // ------------------------------------------------------------------ actuators

    /** Feed valve demand from the controller, 0..1 (clamped). */
    public void setFeedValveDemand(double frac) {
        if (!Double.isNaN(frac)) {
            valveDemandFrac = Math.min(1, Math.max(0, frac));
        }
    }

    /** Run command for pump 0 (A) or 1 (B). After a trip is cleared the pump needs a new run command. */
    public void setPumpRunCommand(int pump, boolean run) {
        pumpCommand[pump] = run;
    }

    /** Fuel cut-off (for example from the controller's low-low level trip). */
    public void setFuelCutoff(boolean cut) {
        fuelCutoff = cut;
    }

    // ------------------------------------------------------------------ scenario inputs

    /** Consumer steam valve: fraction of rated steam flow at nominal pressure. */
    public void setSteamDemand(double frac) {
        steamDemandFrac = Math.max(0, frac);
    }

    public double steamDemand() { return steamDemandFrac; }

    /** Prescribed steam flow [kg/s] instead of the valve law (open-loop tests); NaN = valve law. */
    public void setSteamFlowOverrideKgS(double qsOrNaN) {
        steamOverrideKgS = qsOrNaN;
    }

    public void setFeedTemperatureK(double tK) {
        feedTempK = tK;
    }

    public void setPressureSetpointPa(double pPa) {
        pressureSetpointPa = pPa;
    }

    public double pressureSetpointPa() { return pressureSetpointPa; }

    /** Manual firing rate 0..1 of maximum heat, or NaN for the pressure controller in auto. */
    public void setFiringManual(double fracOrNaN) {
        firingManual = fracOrNaN;
    }

    /** Extra heat to the risers on top of the firing, without the burner lag [W]. */
    public void setHeatStepW(double extraW) {
        heatStepW = extraW;
    }

    /** Prescribed feed flow [kg/s] instead of the pump/valve solution (open-loop tests); NaN = hydraulics. */
    public void setFeedFlowOverrideKgS(double qfOrNaN) {
        feedOverrideKgS = qfOrNaN;
    }

    // ------------------------------------------------------------------ faults

    public void inject(Fault f) {
        double rem = (Double.isFinite(f.durationS()) && f.durationS() > 0) ? f.durationS() : Double.NaN;
        switch (f.kind()) {
            case STUCK, DRIFT, BIAS, FAIL_LOW, FAIL_HIGH, NOISE_BURST -> {
                Transmitter t = transmitterByTag(f.target());
                applyTxFault(t, f.kind(), f.magnitude(), true);
                t.remainingS[f.kind().ordinal()] = rem;
            }
            case PUMP_TRIP -> {
                int j = pumpIndex(f.target());
                if (!pumpTripped[j]) {
                    pumpTripped[j] = true;
                    event(j == 0 ? "feed_pump_a_trip" : "feed_pump_b_trip", "Feed pump tripped.");
                }
                faultRemainingS[j == 0 ? T_PUMP_A : T_PUMP_B] = rem;
            }
            case VALVE_STUCK -> {
                requireTarget(f.target(), "feed_valve");
                valveStuck = true;
                faultRemainingS[T_VALVE] = rem;
            }
            case STEAM_SURGE -> {
                requireTarget(f.target(), "steam");
                surgeFrac = f.magnitude();
                faultRemainingS[T_SURGE] = rem;
            }
            case TUBE_LEAK -> {
                requireTarget(f.target(), "drum");
                leakKgS = Math.max(0, f.magnitude());
                faultRemainingS[T_LEAK] = rem;
            }
            case BURNER_TRIP -> {
                requireTarget(f.target(), "burner");
                burnerTrip = true;
                faultRemainingS[T_BURNER] = rem;
            }
            default -> throw new IllegalArgumentException("unknown fault " + f.kind());
        }
    }

    /** Clears one fault kind on one target, or on every target when {@code target} is null. */
    public void clear(Fault.Kind kind, String target) {
        switch (kind) {
            case STUCK, DRIFT, BIAS, FAIL_LOW, FAIL_HIGH, NOISE_BURST -> {
                for (Transmitter t : tx) {
                    if (target == null || t.tag().equals(target)) {
                        applyTxFault(t, kind, 0, false);
                        t.remainingS[kind.ordinal()] = Double.NaN;
                    }
                }
            }
            case PUMP_TRIP -> {
                for (int j = 0; j < 2; j++) {
                    if (target == null || target.equals(j == 0 ? "feed_pump_a" : "feed_pump_b")) {
                        if (pumpTripped[j]) {
                            pumpTripped[j] = false;
                            pumpCommand[j] = false;
                        }
                        faultRemainingS[j == 0 ? T_PUMP_A : T_PUMP_B] = Double.NaN;
                    }
                }
            }
            case VALVE_STUCK -> {
                valveStuck = false;
                faultRemainingS[T_VALVE] = Double.NaN;
            }
            case STEAM_SURGE -> {
                surgeFrac = 0;
                faultRemainingS[T_SURGE] = Double.NaN;
            }
            case TUBE_LEAK -> {
                leakKgS = 0;
                faultRemainingS[T_LEAK] = Double.NaN;
            }
            case BURNER_TRIP -> {
                burnerTrip = false;
                faultRemainingS[T_BURNER] = Double.NaN;
            }
            default -> throw new IllegalArgumentException("unknown fault " + kind);
        }
    }

    public void clearAll() {
        for (Fault.Kind k : Fault.Kind.values()) {
            clear(k, null);
        }
        for (Transmitter t : tx) {
            if (t != null) {
                t.clearFaults();
            }
        }
    }

    private void tickFaultTimers(double dtS) {
        for (int s = 0; s < faultRemainingS.length; s++) {
            double r = faultRemainingS[s];
            if (r == r) { // not NaN
                r -= dtS;
                faultRemainingS[s] = r;
                if (r <= 0) {
                    switch (s) {
                        case T_PUMP_A -> clear(Fault.Kind.PUMP_TRIP, "feed_pump_a");
                        case T_PUMP_B -> clear(Fault.Kind.PUMP_TRIP, "feed_pump_b");
                        case T_VALVE -> clear(Fault.Kind.VALVE_STUCK, "feed_valve");
                        case T_SURGE -> clear(Fault.Kind.STEAM_SURGE, "steam");
                        case T_LEAK -> clear(Fault.Kind.TUBE_LEAK, "drum");
                        default -> clear(Fault.Kind.BURNER_TRIP, "burner");
                    }
                }
            }
        }
        Fault.Kind[] kinds = TX_KINDS;
        for (Transmitter t : tx) {
            for (Fault.Kind k : kinds) {
                double r = t.remainingS[k.ordinal()];
                if (r == r) {
                    r -= dtS;
                    t.remainingS[k.ordinal()] = r;
                    if (r <= 0) {
                        applyTxFault(t, k, 0, false);
                        t.remainingS[k.ordinal()] = Double.NaN;
                    }
                }
            }
        }
    }

    private static final Fault.Kind[] TX_KINDS = {Fault.Kind.STUCK, Fault.Kind.DRIFT, Fault.Kind.BIAS,
        Fault.Kind.FAIL_LOW, Fault.Kind.FAIL_HIGH, Fault.Kind.NOISE_BURST};

    private static void applyTxFault(Transmitter t, Fault.Kind kind, double magnitude, boolean on) {
        switch (kind) {
            case STUCK -> t.stuck = on;
            case DRIFT -> {
                t.driftRate = on ? magnitude : 0;
                if (!on) {
                    t.driftSi = 0;
                }
            }
            case BIAS -> t.biasSi = on ? magnitude : 0;
            case FAIL_LOW -> t.failMode = on ? -1 : (t.failMode < 0 ? 0 : t.failMode);
            case FAIL_HIGH -> t.failMode = on ? 1 : (t.failMode > 0 ? 0 : t.failMode);
            case NOISE_BURST -> {
                t.burstSigma = on ? Math.abs(magnitude) : 0;
                t.burstRemainingS = 0;
            }
            default -> { }
        }
    }

    private Transmitter transmitterByTag(String tag) {
        TransmitterId id = TransmitterId.byTag(tag);
        if (id == null) {
            throw new IllegalArgumentException("no transmitter '" + tag + "'");
        }
        return tx[id.ordinal()];
    }

    private static int pumpIndex(String target) {
        if ("feed_pump_a".equals(target)) {
            return PUMP_A;
        }
        if ("feed_pump_b".equals(target)) {
            return PUMP_B;
        }
        throw new IllegalArgumentException("no pump '" + target + "' (feed_pump_a or feed_pump_b)");
    }

    private static void requireTarget(String target, String expected) {
        if (!expected.equals(target)) {
            throw new IllegalArgumentException("fault target '" + target + "' should be '" + expected + "'");
        }
    }

    // ------------------------------------------------------------------ truth, SI

    /** Drum level relative to NWL [m]. */
    public double levelM() { return levelM; }

    /** Drum pressure, absolute [Pa]. */
    public double drumPressurePa() { return y[1]; }

    /** Steam flow to the consumer [kg/s] (safety valve excluded). */
    public double steamFlowKgS() { return steamFlowKgS; }

    /** Feed flow into the drum [kg/s]. */
    public double feedFlowKgS() { return feedFlowKgS; }

    /** Heat to the risers [W]. */
    public double heatW() { return heatLagW + heatStepW; }

    /** Firing rate after the burner logic, 0..1 of maximum heat. */
    public double firingFrac() { return firingFrac; }

    public double feedValvePositionFrac() { return valvePosFrac; }

    public double feedValveDemandFrac() { return valveDemandFrac; }

    /** True while the pump's motor runs (commanded and not tripped). */
    public boolean pumpRunning(int pump) { return pumpOn[pump]; }

    /** Head fraction of the pump (run-up and run-down ramps), 0..1. */
    public double pumpHeadFrac(int pump) { return pumpHead[pump]; }

    public boolean pumpTripped(int pump) { return pumpTripped[pump]; }

    /** True while the burner fires (on or ramping up after a restart). */
    public boolean burnerOn() { return burnerState == BURNER_ON || burnerState == BURNER_RAMP; }

    public double feedTempK() { return feedTempK; }

    /** Feed pump discharge (header) pressure, absolute [Pa]. */
    public double feedPressurePa() { return feedHeaderPa; }

    /** Feed enthalpy (IF97 region 1 at discharge pressure and feed temperature) [J/kg]. */
    public double feedEnthalpyJKg() { return hFeed; }

    /** Total minimum-flow recirculation back to the hot well [kg/s]. */
    public double recirculationFlowKgS() { return Double.isNaN(feedOverrideKgS) ? feed.recircM3S() * rhoFeed : 0; }

    public double safetyValveFlowKgS() { return svFlowKgS; }

    public boolean safetyValveOpen() { return svOpen; }

    public double tubeLeakKgS() { return leakKgS; }

    /** Water and steam in drum, risers and downcomers [kg]. */
    public double totalMassKg() { return model.totalMassKg(y, satScratch); }

    /** Stored energy of water, steam and metal [J] (arbitrary zero). */
    public double totalEnergyJ() { return model.totalEnergyJ(y, satScratch); }

    /** Integral of (feed - steam - safety valve - leak) since the steady state [kg]. */
    public double netMassInKg() { return massInKg; }

    /** Integral of (heat + feed enthalpy flow - outflow enthalpy flows) since the steady state [J]. */
    public double netEnergyInJ() { return energyInJ; }

    public double downcomerFlowKgS() { return downcomerKgS; }

    /** Steam mass fraction at the riser outlet. */
    public double riserQuality() { return y[2]; }

    /** Mean void fraction in the risers. */
    public double riserVoidFraction() { return model.avOut; }

    /** Steam volume below the drum surface [m3]. */
    public double steamUnderSurfaceM3() { return y[3]; }

    /** Total water volume in drum, risers and downcomers [m3]. */
    public double waterVolumeM3() { return y[0]; }

    /** Saturation temperature at drum pressure [K]. */
    public double saturationTempK() { return satOut.tsK; }

    /** Saturated water and steam densities at drum pressure [kg/m3]. */
    public double waterDensity() { return satOut.rhoW; }

    public double steamDensity() { return satOut.rhoS; }

    /** Reference-leg water density used by the level transmitters [kg/m3]. */
    public double referenceLegDensity() { return rhoRefLeg; }

    /** Vertical distance between the level taps [m]. */
    public double levelTapSpanM() { return tapSpanM; }

    /** Lower level tap relative to NWL [m]. */
    public double levelTapLowM() { return tapLowM; }

    /** True once the state left the model's valid range (latched until the next steady state). */
    public boolean invalid() { return invalid; }

    /** Copy of the model state [Vwt, p, ar, Vsd] into {@code out} (length 4). */
    public void state(double[] out) { System.arraycopy(y, 0, out, 0, 4); }

    // ------------------------------------------------------------------ transmitters and events

    public Transmitter transmitter(TransmitterId id) { return tx[id.ordinal()]; }

    public void setEventListener(PlantEventListener l) { listener = l; }
}
