package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import org.drumloop.modbus.SerialSettings;

/**
 * Two pseudo-terminals joined by socat: a serial line pair on which an RTU server and a master
 * talk as over a cable. The line ends when either side closes.
 */
final class SerialPair implements AutoCloseable {
    private final Process socat;
    private final Path a;
    private final Path b;

    SerialPair(Path dir) throws IOException {
        String tool = ExternalTools.require("socat", "socat");
        a = dir.resolve("ttyA");
        b = dir.resolve("ttyB");
        socat = new ProcessBuilder(tool, "-d", "-d", "pty,raw,echo=0,link=" + a, "pty,raw,echo=0,link=" + b)
                .redirectErrorStream(true).redirectOutput(dir.resolve("socat.log").toFile()).start();
        assertTrue(TestMaps.await(() -> Files.exists(a) && Files.exists(b), 15), "socat did not create the pty pair");
    }

    /** One end at 19200 baud, even parity, 1 stop bit: the serial guide's default character format. */
    SerialSettings a() { return new SerialSettings(a.toString(), 19200, SerialSettings.Parity.EVEN, 1); }

    /** The other end, same format. */
    SerialSettings b() { return new SerialSettings(b.toString(), 19200, SerialSettings.Parity.EVEN, 1); }

    @Override
    public void close() throws InterruptedException {
        socat.destroy();
        socat.waitFor();
    }
}
