package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.server.ImageServer;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Modbus RTU over a real serial line pair: socat joins two pseudo-terminals, our RTU server
 * (jSerialComm, own CRC and framing) sits on one end and the rig client (j2mod RTU master on
 * jSerialComm) on the other. 19200 baud, even parity, 1 stop bit: the serial guide's default
 * character format. Values are the map's scaling (check values §3).
 */
class RtuOverSerialPairTest {
    private static final double WAIT_S = 15.0;
    private static final double EXACT_TOL = 1e-9;

    @TempDir
    Path dir;

    @Test
    void inputsAndOutputsCrossTheSerialLine() throws Exception {
        try (SerialPair pair = new SerialPair(dir);
             ImageServer server = ImageServer.rtu(TestMaps.small(2.0), pair.a());
             RigClient client = RigClient.rtu(TestMaps.small(2.0), pair.b(), new RigClient.Options(0.05, 0.5, 2, 0.05, 0.5))) {
            ProcessImage in = new ProcessImage();
            in.setCurrentMa(Signal.LEVEL_DP_A, 16.0, Quality.GOOD, 0);
            in.setCurrentMa(Signal.LEVEL_DP_B, 3.5, Quality.GOOD, 0);
            in.set(Signal.DRUM_PRESSURE, 8e5 + 101_325.0, Quality.GOOD, 0);
            in.set(Signal.FEED_TEMP, 90.0 + 273.15, Quality.GOOD, 0);
            in.setBool(Signal.BURNER_ON, true, Quality.GOOD, 0);
            server.publishInputs(in, 0.0);
            client.start();
            assertTrue(TestMaps.await(() -> client.isFresh(Signal.FEED_TEMP) && client.isFresh(Signal.BURNER_ON), WAIT_S),
                    "no poll answered: " + client.statistics().snapshot());
            ProcessImage got = new ProcessImage();
            client.readInputs(got, 1.0);
            assertEquals(16.0, got.currentMa(Signal.LEVEL_DP_A), EXACT_TOL);
            // 3.5 mA is below NE 43's 3.6 mA failure limit: BAD at the transport (NAMUR NE 43)
            assertEquals(3.5, got.currentMa(Signal.LEVEL_DP_B), 16.0 / 27648, "one count of 0..27648 = 4..20 mA");
            assertEquals(Quality.BAD, got.quality(Signal.LEVEL_DP_B));
            assertEquals(901_325.0, got.value(Signal.DRUM_PRESSURE), 1e-6);
            assertEquals(363.15, got.value(Signal.FEED_TEMP), EXACT_TOL);
            assertTrue(got.bool(Signal.BURNER_ON));

            ProcessImage out = new ProcessImage();
            out.set(Signal.FEED_VALVE_DEMAND, 0.62, Quality.GOOD, 1.0);
            out.set(Signal.LEVEL_INDICATED, -0.025, Quality.GOOD, 1.0);
            out.setBool(Signal.PUMP_A_RUN, true, Quality.GOOD, 1.0);
            client.writeOutputs(out, 1.0);
            assertTrue(TestMaps.await(() -> server.image().writtenEng(Signal.PUMP_A_RUN) == 1.0
                    && server.image().writtenEng(Signal.FEED_VALVE_DEMAND) > 0, WAIT_S), "outputs never arrived");
            ProcessImage served = new ProcessImage();
            server.collectOutputs(served, 0.0);
            // 62 % -> 6200 counts of 0..10000 exactly; -25 mm as float32 is exact
            assertEquals(0.62, served.value(Signal.FEED_VALVE_DEMAND), EXACT_TOL);
            assertEquals(-0.025, served.value(Signal.LEVEL_INDICATED), 1e-9);
            assertEquals(0, server.statistics().snapshot().crcErrors(), "clean line, no CRC errors");
        }
    }
}
