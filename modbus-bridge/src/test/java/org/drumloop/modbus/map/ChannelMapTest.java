package org.drumloop.modbus.map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.stream.Collectors;

import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.EngUnit;
import org.drumloop.core.io.Signal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Reading and validating channel maps: the shipped examples, and every problem reported at once. */
class ChannelMapTest {
    private static final String HEADER = "signal,direction,table,unit,address,type,word_order,raw_lo,raw_hi,"
            + "eng_lo,eng_hi,eng_unit,clamp,fault_low,fault_high,stale_after_s,description";

    @TempDir
    Path dir;

    @ParameterizedTest
    @ValueSource(strings = {"aux-microamp.csv", "aux-4-20ma.csv", "aux-float32.csv", "aux-mixed.csv"})
    void theShippedExampleMapsAreCleanAndComplete(String name) throws Exception {
        // the maps live in the project's config/maps, one level above this module
        Path p = Path.of("..", "config", "maps", name);
        assertEquals(List.of(), ChannelMap.validate(p).stream().map(ConfigException::getMessage).collect(Collectors.toList()));
        ChannelMap m = ChannelMap.load(p);
        assertEquals(List.of(), m.requireSignals(EnumSet.allOf(Signal.class)));
        assertEquals(Signal.count(), m.channels().size());
    }

    @Test
    void aGoodRowParsesIntoAChannel() {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap m = ChannelMap.parse("t.csv", List.of("# comment", HEADER,
                "drum_pressure,to_controller,input_register,1,0x0A,float32,cdab,,,-1,20,barg,yes,,,0.5,\"drum, absolute\""),
                problems);
        assertEquals(List.of(), problems);
        Channel c = m.channel(Signal.DRUM_PRESSURE);
        assertNotNull(c);
        assertEquals(10, c.address());
        assertEquals(WordOrder.CDAB, c.order());
        assertEquals(EngUnit.BARG, c.engUnit());
        assertEquals(-1.0, c.rawLo(), 0.0, "float32 raw range defaults to the engineering range");
        assertEquals(0.5, c.staleAfterS(), 0.0);
        assertEquals("drum, absolute", c.description());
        assertEquals(3, c.line());
        assertTrue(c.clamp());
    }

    @Test
    void everyProblemIsReportedAtOnceWithFileLineAndKey() throws IOException {
        Path p = dir.resolve("bad.csv");
        Files.write(p, List.of(
                HEADER,                                                                                            // 1
                "level_dp_x,to_controller,input_register,1,0,int16,,0,27648,4,20,mA,,,,,",                       // 2 unknown signal
                "level_dp_a,from_controller,input_register,1,0,int16,,0,27648,4,20,mA,,,,,",                     // 3 direction
                "level_dp_b,to_controller,input_register,1,30001,int16,,0,27648,4,20,mA,,,,,",                   // 4 hint
                "level_dp_c,to_controller,input_register,1,3,float32,ABCD,,,20,4,mA,,,,,",                       // 5 reversed
                "steam_flow_dp,to_controller,input_register,1,65535,float32,ABCD,,,0,100,kPa,,,,,",              // 6 crosses 65535
                "feed_flow_dp,to_controller,input_register,1,4,int16,,100,100,0,100,kPa,,,,,",                  // 7 empty raw, overlaps line 5
                "drum_pressure,to_controller,input_register,1,10,int16,,0,1000,0,20,bars,,,,,",                 // 8 bad unit
                "feed_temp,to_controller,input_register,1,11,float32,,,,0,250,degC,,,,,",                        // 9 no word order
                "drum_pressure,to_controller,input_register,1,20,int16,,0,1000,0,20,barg,,,,,",                 // 10 duplicate
                "feed_valve_demand,from_controller,input_register,1,30,int16,,0,1000,0,100,%,,,,,",             // 11 not writable
                "feed_pressure,to_controller,input_register,1,40,int16,,0,70000,0,20,barg,,,,,",                // 12 raw too big
                "pump_a_run,from_controller,holding_register,1,50,bool,,,,,,,,,,,"));                            // 13 bool in register
        ChannelMapException e = assertThrows(ChannelMapException.class, () -> ChannelMap.load(p));
        List<String> msgs = e.problems().stream().map(ConfigException::getMessage).collect(Collectors.toList());
        String f = p.toString();
        assertContains(msgs, f + ":2: signal: unknown signal 'level_dp_x'");
        assertContains(msgs, f + ":3: direction: level_dp_a is to_controller");
        assertContains(msgs, f + ":4: address: '30001' looks like a 1-based 3xxxx reference");
        assertContains(msgs, "write the 0-based PDU offset 0");
        assertContains(msgs, f + ":5: eng_hi: reversed engineering range");
        assertContains(msgs, f + ":6: address: a 32-bit value at 65535 would run past address 65535");
        assertContains(msgs, f + ":7: raw_hi: empty raw range");
        assertContains(msgs, f + ":8: eng_unit: unknown unit 'bars'");
        assertContains(msgs, f + ":9: word_order: a 32-bit value needs ABCD, CDAB, BADC or DCBA");
        assertContains(msgs, f + ":10: signal: duplicate signal drum_pressure, first mapped on line 8");
        assertContains(msgs, f + ":11: table: feed_valve_demand is written by the controller");
        assertContains(msgs, f + ":12: raw_lo: raw range 0..70000 does not fit int16");
        assertContains(msgs, f + ":13: type: a register table holds a numeric type, not bool");
        // problems come in line order
        List<Integer> lines = e.problems().stream().map(ConfigException::line).collect(Collectors.toList());
        List<Integer> sorted = new ArrayList<>(lines);
        sorted.sort(null);
        assertEquals(sorted, lines);
    }

    @Test
    void overlappingRegistersNameBothLines() {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap.parse("m.csv", List.of(HEADER,
                "level_dp_a,to_controller,input_register,1,0,float32,ABCD,,,0,1000,mmH2O,,,,,",
                "level_dp_b,to_controller,input_register,1,1,int16,,0,27648,4,20,mA,,,,,",
                "level_dp_c,to_controller,input_register,2,1,int16,,0,27648,4,20,mA,,,,,"), problems);
        assertEquals(1, problems.size(), problems.toString());
        assertEquals("m.csv:3: address: input_register 1..1 of unit 1 overlaps level_dp_a (line 2)", problems.get(0).getMessage());
    }

    @Test
    void aMissingSignalTheModeNeedsIsAProblem() {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap m = ChannelMap.parse("m.csv", List.of(HEADER,
                "level_dp_a,to_controller,input_register,1,0,int16,,0,27648,4,20,mA,,,,,"), problems);
        List<ConfigException> missing = m.requireSignals(EnumSet.of(Signal.LEVEL_DP_A, Signal.FEED_VALVE_DEMAND));
        assertEquals(1, missing.size());
        assertEquals("m.csv: feed_valve_demand: this mode needs the signal but the map has no row for it", missing.get(0).getMessage());
    }

    @Test
    void aMissingColumnAndAnUnknownColumnAreReported() {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap.parse("m.csv", List.of("signal,direction,table,unit,typ"), problems);
        List<String> msgs = problems.stream().map(ConfigException::getMessage).collect(Collectors.toList());
        assertContains(msgs, "m.csv:1: typ: unknown column");
        assertContains(msgs, "m.csv:1: address: required column missing");
        assertContains(msgs, "m.csv:1: type: required column missing");
    }

    @Test
    void loopCurrentChannelsGetNamurThresholdsByDefault() {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap m = ChannelMap.parse("m.csv", List.of(HEADER,
                "level_dp_a,to_controller,input_register,1,0,int16,,0,27648,4,20,mA,,,,,"), problems);
        Channel c = m.channel(Signal.LEVEL_DP_A);
        // source: NAMUR NE 43 failure limits, <= 3.6 mA and >= 21.0 mA
        assertEquals(3.6, c.faultLow(), 0.0);
        assertEquals(21.0, c.faultHigh(), 0.0);
        assertEquals(ChannelMap.DEFAULT_STALE_AFTER_S, c.staleAfterS(), 0.0);
    }

    private static void assertContains(List<String> msgs, String fragment) {
        assertTrue(msgs.stream().anyMatch(m -> m.contains(fragment)), "no problem contains \"" + fragment + "\" in " + msgs);
    }
}
