package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.drumloop.bench.ConfigResolver;
import org.drumloop.modbus.map.ChannelMap;
import org.junit.jupiter.api.Test;

/**
 * The live page's loopback variant: the firmware's I/O crosses real Modbus TCP on 127.0.0.1
 * (bridge image server and rig client), scan by scan. An operator's manual output reaches the
 * plant's valve through the socket.
 */
class LoopbackLiveSessionTest {
    @Test
    void aManualOutputFromThePageReachesThePlantValveOverModbus() throws Exception {
        Path map = ConfigResolver.resolve("aux-4-20ma", "maps", ".csv", null);
        try (LoopbackLiveSession s = new LoopbackLiveSession(SimLiveSession.idleScenario("aux-boiler", "default", 0.7, 1),
                ChannelMap.load(map))) {
            assertTrue(s.info().ioDescription().startsWith("Modbus TCP loopback 127.0.0.1:" + s.port()));
            CommandParser p = new CommandParser(s.info());
            for (int k = 0; k < 50; k++) {
                s.scan();
            }
            s.apply(p.parse(Json.parseObject("{\"cmd\":\"mode\",\"mode\":\"manual\"}")));
            s.scan();
            s.apply(p.parse(Json.parseObject("{\"cmd\":\"manual_output\",\"percent\":40}")));
            // the valve actuator has a stroke time; 30 s is ample (aux-boiler.plant)
            for (int k = 0; k < 300; k++) {
                s.scan();
            }
            LiveSnapshot snap = new LiveSnapshot(s.info().interlocks().size());
            s.fill(snap);
            assertEquals("manual", snap.mode);
            assertEquals(0.40, snap.valveDemandFrac, 1e-12, "the firmware's output is the fraction typed");
            // through a 4-20 mA channel on a 16-bit register the demand is quantised; 0.5 % covers
            // the map's scaling resolution and the positioner's deadband (common practice)
            assertEquals(0.40, snap.valvePositionFrac, 0.005, "the plant's valve followed over Modbus");
            assertTrue(Math.abs(snap.levelIndicatedM) < 0.3, "level stayed on the gauge");
            assertTrue(s.scenarioLines().stream().anyMatch(l -> l.endsWith(" s output 40 %")));
        }
    }
}
