package org.drumloop.bench.hil;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.drumloop.bench.ExitCode;
import org.drumloop.core.Firmware;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.FirmwareStatus;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.exec.HangMonitor;
import org.drumloop.core.exec.RealTimeClock;
import org.drumloop.core.exec.ScanExecutive;
import org.drumloop.core.io.EngUnit;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.stats.LinkStatistics;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code drumloop drive-rig}: the built-in firmware in real time as a Modbus client (master)
 * against a PLC or test rig. Keeps scanning through link faults: inputs not refreshed within their
 * age limit turn BAD and the firmware reacts as its tuning says.
 */
@Command(name = "drive-rig", mixinStandardHelpOptions = true,
        description = {"Run the firmware in real time as a Modbus TCP or RTU client (master) against a PLC or rig,"
                + " laid out by a channel map. It writes to the rig.",
            "CAUTION: write-capable mode. Never connect to a live boiler without a permit to work and licensed"
                + " supervision. A test bench, not a safety system: interlock settings come from the boiler maker,"
                + " classification rules and local codes."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:the run ended", "2:bad input (file:line: key: message) or option", "3:records could not be written",
            "4:internal error"})
public final class DriveRigCommand implements Callable<Integer> {
    static final String BANNER = String.join(System.lineSeparator(),
            "*****************************************************************************",
            "* CAUTION: drive-rig WRITES valve demand, pump run commands and fuel cut-off *",
            "* to the connected device. Never connect to a live boiler without a permit   *",
            "* to work and licensed supervision. A test bench, not a safety system:       *",
            "* interlock settings come from the boiler maker, classification rules and    *",
            "* local codes.                                                               *",
            "*****************************************************************************");

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--map", paramLabel = "MAP", required = true, description = "channel map (file or name in config/maps)")
    String map;

    @Mixin
    LinkOptions link = new LinkOptions();

    @Option(names = "--tuning", paramLabel = "FILE", defaultValue = "default", description = "tuning file (default ${DEFAULT-VALUE})")
    String tuning;

    @Option(names = "--duration", paramLabel = "S", defaultValue = "0", description = "run time [s]; 0 runs until stopped (default)")
    double durationS;

    @Option(names = "--poll", paramLabel = "MS", defaultValue = "50", description = "input poll period [ms] (default ${DEFAULT-VALUE})")
    double pollMs;

    @Option(names = "--timeout", paramLabel = "MS", defaultValue = "500", description = "answer timeout [ms] (default ${DEFAULT-VALUE})")
    double timeoutMs;

    @Option(names = "--retries", paramLabel = "N", defaultValue = "1", description = "retries after a timeout (default ${DEFAULT-VALUE})")
    int retries;

    @Option(names = "--out", paramLabel = "DIR", description = "write link-stats.csv and events.csv here")
    Path out;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        o.println(BANNER);
        o.flush();
        String bad = link.problem(null);
        if (bad != null) {
            err.println(bad);
            return ExitCode.BAD_INPUT;
        }
        if (durationS < 0 || !(pollMs >= 5) || !(timeoutMs >= 10) || retries < 0) {
            err.println("--duration >= 0, --poll >= 5 ms, --timeout >= 10 ms, --retries >= 0");
            return ExitCode.BAD_INPUT;
        }
        ChannelMap m = HilFiles.map(map, HilFiles.CONTROL_SIGNALS, err);
        Path tuningPath = HilFiles.find(tuning, "tuning", ".tuning", err);
        if (m == null || tuningPath == null) {
            return ExitCode.BAD_INPUT;
        }
        if (link.unit != null) {
            m = m.withUnitId(link.unit);
        }
        FirmwareConfig fc;
        try {
            fc = FirmwareConfig.load(tuningPath);
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        }
        RigClient.Options opts = new RigClient.Options(pollMs / 1000, timeoutMs / 1000, retries, 0.1, 5.0);
        Firmware fw = new Firmware(fc);
        try (RigClient client = link.isRtu() ? RigClient.rtu(m, link.serial(), opts) : RigClient.tcp(m, link.tcp(null), opts);
             Loopback.Events events = new Loopback.Events(out == null ? null : prepare(out).resolve("events.csv"), o)) {
            client.start();
            ScanExecutive ex = new ScanExecutive(new RealTimeClock(), client, fw, fc.scanPeriodS(), fc.interlocks().failSafe(), fw.events());
            // a scan that never returns is caught from another thread and the fail-safe outputs written
            HangMonitor hang = new HangMonitor(ex);
            Thread hangThread = hang.start();
            double[] nextPrintS = {10.0};
            ex.setListener((k, tS, in, outImg) -> {
                fw.events().drainTo(events);
                if (tS >= nextPrintS[0]) {
                    nextPrintS[0] += 10.0;
                    FirmwareStatus st = fw.status();
                    o.println(String.format(Locale.ROOT, "%8.1f s  %s level %+7.1f mm (%s) setpoint %+6.1f mm valve %5.1f %%",
                            tS, st.mode.label(), EngUnit.MM.fromSi(st.levelM), st.levelQuality,
                            EngUnit.MM.fromSi(st.levelSetpointM), 100 * st.valveDemandFrac));
                    o.println("          " + client.statistics().snapshot());
                    o.flush();
                }
            });
            Thread main = Thread.currentThread();
            Thread hook = new Thread(() -> {
                ex.requestStop();
                try {
                    main.join(3000);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            });
            Runtime.getRuntime().addShutdownHook(hook);
            try {
                if (durationS > 0) {
                    ex.runUntil(durationS - fc.scanPeriodS());
                } else {
                    ex.runUntilStopped();
                }
            } finally {
                hang.stop();
                hangThread.join(5000);
                try {
                    Runtime.getRuntime().removeShutdownHook(hook);
                } catch (IllegalStateException e) {
                    // already shutting down
                }
            }
            o.println(client.statistics().snapshot());
            o.println(ex.statistics().summary());
            if (out != null) {
                LinkStatistics.writeCsv(out.resolve("link-stats.csv"), client.statistics());
            }
            return ExitCode.OK;
        } catch (IOException e) {
            err.println("cannot write records: " + e.getMessage());
            return ExitCode.IO_ERROR;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return ExitCode.OK;
        }
    }

    private static Path prepare(Path dir) throws IOException {
        Files.createDirectories(dir);
        return dir;
    }
}
