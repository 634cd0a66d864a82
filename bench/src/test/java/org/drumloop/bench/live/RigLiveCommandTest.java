package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.drumloop.bench.ExitCode;
import org.drumloop.bench.Main;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code drumloop live --rig}: the caution banner comes first, and options that make no sense on
 * hardware (a plant, a scenario, a speed other than real time, no map, no link) stop it before
 * anything connects.
 */
class RigLiveCommandTest {
    @TempDir
    Path dir;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int drumloop(String... args) {
        return Main.execute(new PrintWriter(out), new PrintWriter(err), args);
    }

    private void assertRefused(String errorPart, String... args) {
        assertEquals(ExitCode.BAD_INPUT, drumloop(args), err.toString());
        assertTrue(out.toString().startsWith("*"), "the caution banner comes first: " + out);
        assertTrue(out.toString().contains("Never connect to a live boiler"), out.toString());
        assertTrue(err.toString().contains(errorPart), err.toString());
    }

    @Test
    void withoutAMapItStops() {
        assertRefused("--map: give the channel map of the rig", "live", "--rig", "--tcp", "127.0.0.1:1");
    }

    @Test
    void withoutALinkItStops() {
        assertRefused("give --tcp HOST:PORT or --rtu DEVICE", "live", "--rig", "--map", "aux-4-20ma");
    }

    @Test
    void itRunsInRealTimeOnly() {
        assertRefused("--speed: the firmware drives hardware in real time", "live", "--rig", "--map", "aux-4-20ma",
                "--tcp", "127.0.0.1:1", "--speed", "2");
    }

    @Test
    void aPlantOrScenarioMakesNoSenseOnHardware() {
        assertRefused("--plant: not used with --rig", "live", "--rig", "--map", "aux-4-20ma", "--tcp", "127.0.0.1:1",
                "--plant", "aux-boiler");
    }

    @Test
    void loopbackAndRigExcludeEachOther() {
        assertRefused("give --rig or --loopback, not both", "live", "--rig", "--loopback", "--map", "aux-4-20ma",
                "--tcp", "127.0.0.1:1");
    }

    @Test
    void aMapWithoutTheControlSignalsIsRefused() throws Exception {
        Path thin = dir.resolve("thin.csv");
        Files.write(thin, List.of("signal,direction,table,unit,address,type,raw_lo,raw_hi,eng_lo,eng_hi,eng_unit",
                "level_dp_a,to_controller,input_register,1,0,int16,0,27648,4,20,mA"));
        assertRefused("feed_valve_demand: this mode needs the signal", "live", "--rig", "--map", thin.toString(),
                "--tcp", "127.0.0.1:1");
    }

    @Test
    void linkOptionsWithoutRigAreAMistake() {
        assertEquals(ExitCode.BAD_INPUT, drumloop("live", "--tcp", "127.0.0.1:502"));
        assertTrue(err.toString().contains("are for --rig"), err.toString());
    }
}
