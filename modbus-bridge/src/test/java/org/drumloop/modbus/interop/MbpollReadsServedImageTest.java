package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.server.ImageServer;
import org.junit.jupiter.api.Test;

/**
 * The command-line master mbpoll (Debian package mbpoll, an independent libmodbus-based tool)
 * reads the served image over Modbus TCP on loopback. Expected values: the map's scaling
 * (check values §3) and mbpoll's default word order for floats, low word first (CDAB).
 */
class MbpollReadsServedImageTest {
    private static final Pattern VALUE = Pattern.compile("^\\[(\\d+)\\]:\\s+(\\S+)");

    @Test
    void mbpollReadsInputRegistersFloatsAndBits() throws Exception {
        String mbpoll = ExternalTools.require("mbpoll", "mbpoll");
        try (ImageServer server = ImageServer.tcp(TestMaps.small(1.0), new TcpEndpoint("127.0.0.1", 0))) {
            ProcessImage in = new ProcessImage();
            in.setCurrentMa(Signal.LEVEL_DP_A, 12.0, Quality.GOOD, 0);
            in.setCurrentMa(Signal.LEVEL_DP_B, 8.0, Quality.GOOD, 0);
            in.set(Signal.DRUM_PRESSURE, 7.5e5 + 101_325.0, Quality.GOOD, 0);
            in.set(Signal.FEED_TEMP, 105.3 + 273.15, Quality.GOOD, 0);
            in.setBool(Signal.PUMP_A_RUNNING, true, Quality.GOOD, 0);
            server.publishInputs(in, 0.0);
            String port = Integer.toString(server.port());

            // -0: PDU addressing from 0; -t 3: 16-bit input registers; -1: poll once
            List<String> regs = run(mbpoll, "-m", "tcp", "-p", port, "-a", "1", "-0", "-t", "3", "-r", "0", "-c", "2", "-1", "127.0.0.1");
            // 12 mA -> 13824, 8 mA -> 6912 counts on 0..27648 = 4..20 mA (exact integers)
            assertEquals(List.of("13824", "6912"), regs);

            List<String> f = run(mbpoll, "-m", "tcp", "-p", port, "-a", "1", "-0", "-t", "3:float", "-r", "2", "-c", "1", "-1", "127.0.0.1");
            // float32 CDAB holds 7.5 barg exactly (binary fraction)
            assertEquals(7.5, Double.parseDouble(f.get(0)), 1e-6, "mbpoll prints 6 significant digits");

            List<String> t = run(mbpoll, "-m", "tcp", "-p", port, "-a", "1", "-0", "-t", "3", "-r", "4", "-c", "1", "-1", "127.0.0.1");
            // 105.3 degC in tenths = 1053
            assertEquals(List.of("1053"), t);

            List<String> bits = run(mbpoll, "-m", "tcp", "-p", port, "-a", "1", "-0", "-t", "1", "-r", "0", "-c", "2", "-1", "127.0.0.1");
            assertEquals(List.of("1", "0"), bits);
        }
    }

    private static List<String> run(String... cmd) throws IOException, InterruptedException {
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        assertTrue(p.waitFor(20, TimeUnit.SECONDS), "mbpoll did not finish");
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.exitValue(), out);
        List<String> values = new ArrayList<>();
        for (String line : out.split("\\R")) {
            Matcher m = VALUE.matcher(line.trim());
            if (m.find()) {
                values.add(m.group(2));
            }
        }
        return values;
    }
}
