package org.drumloop.bench.live;

import java.util.List;

/**
 * What the live page needs to know about a session before the first value arrives: names, the
 * drum's alarm and trip lines, trend ranges and the choices offered to operator and instructor.
 * All values SI (levels in metres relative to normal water level).
 *
 * @param plantName      plant name shown in the header (from the plant file)
 * @param description    one line describing the rig (invented plant for demo data)
 * @param tuningName     tuning file name
 * @param hardware       true when the firmware's I/O goes to real hardware over Modbus: the page
 *                       then shows a banner that cannot be hidden and asks before every write
 * @param ioDescription  what the I/O is connected to, e.g. "simulated plant, in process"
 * @param scanPeriodS    firmware scan period [s]
 * @param gaugeMinM      lower end of the drum level gauge [m], relative to NWL
 * @param gaugeMaxM      upper end of the drum level gauge [m], relative to NWL
 * @param lines          alarm and trip lines to draw on the drum (tag, level, trip or alarm)
 * @param steamRatedKgS  rated steam flow [kg/s] (trend and faceplate range)
 * @param pressureMaxPa  upper end of the pressure trend [Pa abs]
 * @param transmitters   transmitters the instructor may fault, with the SI unit of their value
 * @param interlocks     interlock tags in the order of the snapshot arrays
 * @param trippable      equipment the instructor may trip ("feed_pump_a", "feed_pump_b", "burner")
 */
public record LiveInfo(String plantName, String description, String tuningName, boolean hardware,
                       String ioDescription, double scanPeriodS, double gaugeMinM, double gaugeMaxM,
                       List<Line> lines, double steamRatedKgS, double pressureMaxPa,
                       List<Transmitter> transmitters, List<String> interlocks, List<String> trippable) {

    public LiveInfo {
        lines = List.copyOf(lines);
        transmitters = List.copyOf(transmitters);
        interlocks = List.copyOf(interlocks);
        trippable = List.copyOf(trippable);
        if (!(scanPeriodS > 0) || !(gaugeMaxM > gaugeMinM)) {
            throw new IllegalArgumentException("scan period must be positive and the gauge span increasing");
        }
    }

    /** A level line on the drum: an alarm or trip setting relative to NWL [m]. */
    public record Line(String tag, double levelM, boolean trip) {
    }

    /** A transmitter the instructor may fault; {@code siUnit} is the unit of its measured value. */
    public record Transmitter(String tag, String label, String siUnit) {
    }

    /** The lowest and highest alarm (not trip) line, for the setpoint range; gauge span if none. */
    double[] setpointRangeM() {
        double lo = gaugeMinM;
        double hi = gaugeMaxM;
        for (Line l : lines) {
            if (!l.trip()) {
                if (l.levelM() < 0) {
                    lo = Math.max(lo, l.levelM());
                } else {
                    hi = Math.min(hi, l.levelM());
                }
            }
        }
        return new double[] {lo, hi};
    }

    Transmitter transmitter(String tag) {
        for (Transmitter t : transmitters) {
            if (t.tag().equals(tag)) {
                return t;
            }
        }
        return null;
    }
}
