package org.drumloop.bench.hil;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Map;

import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.io.Signal;
import org.drumloop.core.signal.AnalogCal;
import org.drumloop.modbus.map.Channel;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.map.DataType;
import org.drumloop.modbus.map.Scaling;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The shipped maps carry what the shipped tuning expects: engineering-value channels can
 * represent the whole calibrated range of their transmitter, and loop-current channels keep
 * headroom for NAMUR NE 43 failure currents (≤ 3.6 mA, ≥ 21.0 mA), which a converter that puts
 * 20 mA at full scale could not show (check values §3, common practice).
 */
class MapCalibrationTest {
    private static final Path TUNING = Path.of("..", "config", "tuning", "default.tuning");
    /** Float rounding of the range ends only. */
    private static final double REL_TOL = 1e-9;

    @ParameterizedTest
    @ValueSource(strings = {"aux-microamp.csv", "aux-4-20ma.csv", "aux-float32.csv", "aux-mixed.csv", "aux-holding.csv"})
    void everyAnalogueInputCarriesItsTransmitterRange(String name) throws Exception {
        FirmwareConfig fc = FirmwareConfig.load(TUNING);
        Map<Signal, AnalogCal> cal = Map.of(
                Signal.LEVEL_DP_A, fc.levelCal(), Signal.LEVEL_DP_B, fc.levelCal(), Signal.LEVEL_DP_C, fc.levelCal(),
                Signal.STEAM_FLOW_DP, fc.steamFlowCal(), Signal.FEED_FLOW_DP, fc.feedFlowCal(),
                Signal.DRUM_PRESSURE, fc.drumPressureCal(), Signal.FEED_TEMP, fc.feedTempCal(),
                Signal.FEED_PRESSURE, fc.feedPressureCal());
        ChannelMap map = ChannelMap.load(Path.of("..", "config", "maps", name));
        for (Map.Entry<Signal, AnalogCal> e : cal.entrySet()) {
            Channel c = map.channel(e.getKey());
            double lo;
            double hi;
            if (c.type() == DataType.FLOAT32 && !c.clamp()) {
                lo = Double.NEGATIVE_INFINITY;
                hi = Double.POSITIVE_INFINITY;
            } else {
                double a = Scaling.toEng(c.type().minRaw(), c.rawLo(), c.rawHi(), c.engLo(), c.engHi());
                double b = Scaling.toEng(c.type().maxRaw(), c.rawLo(), c.rawHi(), c.engLo(), c.engHi());
                lo = c.clamp() ? c.engLo() : Math.min(a, b);
                hi = c.clamp() ? c.engHi() : Math.max(a, b);
            }
            String where = name + " " + e.getKey().tag();
            if (c.isLoopCurrent()) {
                assertTrue(lo <= Channel.NE43_FAIL_LOW_MA && hi >= Channel.NE43_FAIL_HIGH_MA,
                        where + ": no headroom for NE 43 failure currents, reaches " + lo + ".." + hi + " mA");
            } else {
                double calLo = Math.min(e.getValue().lowSi(), e.getValue().highSi());
                double calHi = Math.max(e.getValue().lowSi(), e.getValue().highSi());
                double siLo = c.engUnit().toSi(lo);
                double siHi = c.engUnit().toSi(hi);
                double tol = REL_TOL * Math.max(Math.abs(calLo), Math.abs(calHi));
                assertTrue(siLo <= calLo + tol && siHi >= calHi - tol,
                        where + ": map reaches " + siLo + ".." + siHi + " SI, transmitter range " + calLo + ".." + calHi);
            }
        }
    }
}
