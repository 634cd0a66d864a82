package org.drumloop.bench.hil;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import org.drumloop.core.io.EngUnit;
import org.drumloop.plant.Plant;

/**
 * The trend of a Modbus run as CSV (engineering units in the header): time, true drum level and
 * setpoint, drum pressure, steam and feed flow, valve position, steam demand. Also tracks the
 * largest level deviation from the setpoint, overall and after a given time.
 */
final class Trend implements AutoCloseable {
    private final BufferedWriter w;
    private final double setpointM;
    private final double fromS;
    private double maxDevM;
    private double maxDevAfterM;

    /** @param file CSV to write, or null to only track deviations */
    Trend(Path file, double setpointM, double fromS) throws IOException {
        this.setpointM = setpointM;
        this.fromS = fromS;
        if (file != null) {
            w = Files.newBufferedWriter(file, StandardCharsets.UTF_8);
            w.write("t_s,level_mm,setpoint_mm,drum_pressure_barg,steam_flow_t_h,feed_flow_t_h,feed_valve_pct,steam_demand_pct\n");
        } else {
            w = null;
        }
    }

    void record(double tS, Plant p, double steamDemandFrac) throws IOException {
        double dev = Math.abs(p.levelM() - setpointM);
        maxDevM = Math.max(maxDevM, dev);
        if (tS >= fromS) {
            maxDevAfterM = Math.max(maxDevAfterM, dev);
        }
        if (w != null) {
            w.write(String.format(Locale.ROOT, "%.3f,%.2f,%.2f,%.4f,%.4f,%.4f,%.3f,%.2f%n", tS,
                    EngUnit.MM.fromSi(p.levelM()), EngUnit.MM.fromSi(setpointM), EngUnit.BARG.fromSi(p.drumPressurePa()),
                    EngUnit.T_PER_H.fromSi(p.steamFlowKgS()), EngUnit.T_PER_H.fromSi(p.feedFlowKgS()),
                    100.0 * p.feedValvePositionFrac(), 100.0 * steamDemandFrac));
        }
    }

    /** Largest |level - setpoint| over the whole run [m]. */
    double maxDeviationM() { return maxDevM; }

    /** Largest |level - setpoint| from the given time on [m]. */
    double maxDeviationAfterM() { return maxDevAfterM; }

    @Override
    public void close() throws IOException {
        if (w != null) {
            w.close();
        }
    }
}
