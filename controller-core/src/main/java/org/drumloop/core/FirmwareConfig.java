package org.drumloop.core;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;
import org.drumloop.core.control.PidParams;
import org.drumloop.core.safety.InterlockConfig;
import org.drumloop.core.safety.InterlockFile;
import org.drumloop.core.signal.AnalogCal;
import org.drumloop.core.signal.LevelCompensator;
import org.drumloop.core.signal.SteamTables;

/**
 * The firmware's settings, read from a {@code .tuning} file, and the interlock configuration that
 * file names. Immutable.
 *
 * <p>Format: plain text, UTF-8. {@code [section]} lines open a section; every other non-blank line
 * is {@code key value unit}, or {@code key word} for the few keys that take a word. {@code #} starts
 * a comment. Every number carries its unit ({@code 100 ms}, {@code -300 mm}, {@code 15 t/h},
 * {@code 0.3 (t/h)/mm}); see {@link TuningKey} for the keys, their quantity and range. Every key is
 * required and may appear once. Errors read {@code file:line: section.key: message}.
 */
public final class FirmwareConfig {
    private final String fileName;
    private final Map<TuningKey, Double> num;
    private final Map<TuningKey, String> word;
    /** Unit of each number as the file spells it (for showing the values back in the user's units). */
    private final Map<TuningKey, String> unitText;
    private final InterlockConfig interlocks;

    private FirmwareConfig(String fileName, Map<TuningKey, Double> num, Map<TuningKey, String> word,
                           Map<TuningKey, String> unitText, InterlockConfig interlocks) {
        this.fileName = fileName;
        this.num = num;
        this.word = word;
        this.unitText = unitText;
        this.interlocks = interlocks;
    }

    /**
     * The same configuration with the swell compensation gain at zero: plain three-element control,
     * for runs that compare the loop with and without the compensation.
     */
    public FirmwareConfig withoutSwellCompensation() {
        Map<TuningKey, Double> n = new EnumMap<>(num);
        n.put(TuningKey.SWELL_GAIN, 0.0);
        return new FirmwareConfig(fileName, n, word, unitText, interlocks);
    }

    /** Read a tuning file and the interlocks file it names (relative to the tuning file's folder). */
    public static FirmwareConfig load(Path tuningFile) throws ConfigException {
        List<String> lines = read(tuningFile);
        Parsed p = parseLines(tuningFile.toString(), lines);
        Path dir = tuningFile.toAbsolutePath().getParent();
        Path il = dir == null ? Path.of(p.word.get(TuningKey.INTERLOCKS)) : dir.resolve(p.word.get(TuningKey.INTERLOCKS));
        if (!Files.isRegularFile(il)) {
            throw new ConfigException(tuningFile.toString(), p.lineOf.get(TuningKey.INTERLOCKS),
                    TuningKey.INTERLOCKS.qualified(), "interlocks file not found: " + p.word.get(TuningKey.INTERLOCKS));
        }
        Path shown = tuningFile.getParent() == null ? il.getFileName() : tuningFile.getParent().resolve(p.word.get(TuningKey.INTERLOCKS));
        InterlockConfig ic = InterlockFile.parse(shown.toString(), read(il));
        return new FirmwareConfig(tuningFile.toString(), p.num, p.word, p.unitText, ic);
    }

    /** Parse tuning lines; the interlock configuration is supplied (the file's {@code interlocks} key is still checked for presence). */
    public static FirmwareConfig parse(String fileName, List<String> lines, InterlockConfig interlocks) throws ConfigException {
        Parsed p = parseLines(fileName, lines);
        return new FirmwareConfig(fileName, p.num, p.word, p.unitText, interlocks);
    }

    private static List<String> read(Path p) throws ConfigException {
        try {
            return Files.readAllLines(p, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new ConfigException(p.toString(), 0, "", "cannot read: " + e.getMessage());
        }
    }

    private static final class Parsed {
        final Map<TuningKey, Double> num = new EnumMap<>(TuningKey.class);
        final Map<TuningKey, String> word = new EnumMap<>(TuningKey.class);
        final Map<TuningKey, Integer> lineOf = new EnumMap<>(TuningKey.class);
        final Map<TuningKey, String> unitText = new EnumMap<>(TuningKey.class);
    }

    private static Parsed parseLines(String file, List<String> lines) throws ConfigException {
        Parsed p = new Parsed();
        List<ConfigException> problems = new ArrayList<>();
        String section = null;
        boolean badSection = false;
        for (int ln = 1; ln <= lines.size(); ln++) {
            String text = lines.get(ln - 1);
            int hash = text.indexOf('#');
            if (hash >= 0) {
                text = text.substring(0, hash);
            }
            text = text.strip();
            if (text.isEmpty()) {
                continue;
            }
            try {
                if (text.startsWith("[")) {
                    badSection = true; // until the line proves good; its keys are then skipped, not reported again
                    if (!text.endsWith("]")) {
                        throw new ConfigException(file, ln, text, "a section line reads [name]");
                    }
                    section = text.substring(1, text.length() - 1).strip();
                    if (!TuningKey.isSection(section)) {
                        throw new ConfigException(file, ln, section, "unknown section");
                    }
                    badSection = false;
                } else if (!badSection) {
                    keyLine(file, ln, text, section, p);
                }
            } catch (ConfigException e) {
                problems.add(e); // go on: the user sees every problem of the file at once
            }
        }
        for (TuningKey k : TuningKey.values()) {
            if (!p.lineOf.containsKey(k)) {
                problems.add(new ConfigException(file, 0, k.qualified(), "missing key"));
            }
        }
        if (!problems.isEmpty()) {
            throw problems.size() == 1 ? problems.get(0) : new ConfigProblems(problems);
        }
        order(file, p, TuningKey.TAP_LOW, TuningKey.TAP_HIGH, "tap_high must be above tap_low");
        order(file, p, TuningKey.DP_RANGE_LOW, TuningKey.DP_RANGE_HIGH, "range_high must be above range_low");
        order(file, p, TuningKey.FT_RANGE_LOW, TuningKey.FT_RANGE_HIGH, "range_high must be above range_low");
        order(file, p, TuningKey.FP_RANGE_LOW, TuningKey.FP_RANGE_HIGH, "range_high must be above range_low");
        order(file, p, TuningKey.LEVEL_RANGE_LOW, TuningKey.LEVEL_RANGE_HIGH, "range_high must be above range_low");
        order(file, p, TuningKey.SE_OUT_LOW, TuningKey.SE_OUT_HIGH, "output_high must be above output_low");
        order(file, p, TuningKey.LM_OUT_LOW, TuningKey.LM_OUT_HIGH, "output_high must be above output_low");
        order(file, p, TuningKey.FS_OUT_LOW, TuningKey.FS_OUT_HIGH, "output_high must be above output_low");
        order(file, p, TuningKey.DOWN_LOAD, TuningKey.UP_LOAD, "three_element_above must be above single_element_below");
        order(file, p, TuningKey.PUMP_START_LEVEL, TuningKey.PUMP_STOP_LEVEL, "stop_level must be above start_level");
        double lo = p.num.get(TuningKey.LEVEL_RANGE_LOW);
        double hi = p.num.get(TuningKey.LEVEL_RANGE_HIGH);
        if (lo < p.num.get(TuningKey.TAP_LOW) - 1e-9 || hi > p.num.get(TuningKey.TAP_HIGH) + 1e-9) {
            throw new ConfigException(file, p.lineOf.get(TuningKey.LEVEL_RANGE_HIGH), TuningKey.LEVEL_RANGE_HIGH.qualified(),
                    "the calibrated range must lie between the tappings");
        }
        return p;
    }

    /** One {@code key value unit} (or {@code key word}) line of a section into {@code p}. */
    private static void keyLine(String file, int ln, String text, String section, Parsed p) throws ConfigException {
        String[] f = text.split("\\s+");
        if (section == null) {
            throw new ConfigException(file, ln, f[0], "key before the first [section]");
        }
        TuningKey k = TuningKey.find(section, f[0]);
        if (k == null) {
            throw new ConfigException(file, ln, section + "." + f[0], "unknown key");
        }
        if (p.lineOf.containsKey(k)) {
            throw new ConfigException(file, ln, k.qualified(), "given twice (first on line " + p.lineOf.get(k) + ")");
        }
        p.lineOf.put(k, ln);
        if (k.dim == null) {
            if (f.length != 2) {
                throw new ConfigException(file, ln, k.qualified(), "expected one word: " + choicesText(k));
            }
            String w = k.choices.length == 1 && k.choices[0].equals("*") ? f[1] : f[1].toLowerCase(Locale.ROOT);
            if (!(k.choices.length == 1 && k.choices[0].equals("*")) && !contains(k.choices, w)) {
                throw new ConfigException(file, ln, k.qualified(), "'" + f[1] + "' is not one of " + choicesText(k));
            }
            p.word.put(k, w);
            return;
        }
        if (k.name.equals("integral_time") && f.length == 2 && f[1].equals("off")) {
            p.num.put(k, Double.POSITIVE_INFINITY);
            return;
        }
        if (f.length != 3) {
            throw new ConfigException(file, ln, k.qualified(), "expected a value and a unit in " + k.dim
                    + (f.length == 2 ? " (the unit is missing)" : ""));
        }
        double v;
        try {
            v = Double.parseDouble(f[1]);
        } catch (NumberFormatException e) {
            throw new ConfigException(file, ln, k.qualified(), "'" + f[1] + "' is not a number");
        }
        if (!Double.isFinite(v)) {
            throw new ConfigException(file, ln, k.qualified(), "value must be finite");
        }
        TuningUnits.Unit u = TuningUnits.parse(f[2]);
        if (u == null) {
            throw new ConfigException(file, ln, k.qualified(), "unknown unit '" + f[2] + "'");
        }
        if (!u.dim().equals(k.dim)) {
            throw new ConfigException(file, ln, k.qualified(), "unit '" + f[2] + "' is " + u.dim() + ", expected " + k.dim);
        }
        double si = u.toSi(v);
        if (si < k.minSi - 1e-12 * Math.abs(k.minSi) || si > k.maxSi + 1e-12 * Math.abs(k.maxSi)) {
            throw new ConfigException(file, ln, k.qualified(), "out of range: " + fmt(si) + " " + k.dim
                    + " is outside " + fmt(k.minSi) + " to " + fmt(k.maxSi) + " " + k.dim);
        }
        p.num.put(k, si);
        p.unitText.put(k, f[2]);
    }

    private static void order(String file, Parsed p, TuningKey low, TuningKey high, String msg) throws ConfigException {
        if (!(p.num.get(high) > p.num.get(low))) {
            throw new ConfigException(file, p.lineOf.get(high), high.qualified(), msg);
        }
    }

    private static boolean contains(String[] a, String w) {
        for (String s : a) {
            if (s.equals(w)) {
                return true;
            }
        }
        return false;
    }

    private static String choicesText(TuningKey k) {
        return k.choices.length == 1 && k.choices[0].equals("*") ? "a file name" : String.join(" | ", k.choices);
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }

    // ---- typed views ---------------------------------------------------------------------------

    double get(TuningKey k) { return num.get(k); }

    /** The tuning file as the user named it. */
    public String fileName() { return fileName; }

    /** Scan period [s], 0.010 to 1.000. */
    public double scanPeriodS() { return get(TuningKey.SCAN_PERIOD); }

    public InterlockConfig interlocks() { return interlocks; }

    public double ratedSteamFlowKgS() { return get(TuningKey.RATED_STEAM_FLOW); }

    public double designPressurePa() { return get(TuningKey.DESIGN_PRESSURE); }

    public double designFeedTempK() { return get(TuningKey.DESIGN_FEED_TEMP); }

    /** Mode at start: MANUAL means auto off with three-element requested. */
    public Mode startMode() { return Mode.byLabel(word.get(TuningKey.START_MODE)); }

    public double levelSetpointM() { return get(TuningKey.LEVEL_SETPOINT); }

    public double manualValveFrac() { return get(TuningKey.MANUAL_VALVE); }

    /** The level compensation of transmitters A, B and C. */
    public LevelCompensator levelCompensator() {
        double tapLow = get(TuningKey.TAP_LOW);
        return new LevelCompensator(get(TuningKey.TAP_HIGH) - tapLow, -tapLow, get(TuningKey.REF_LEG_TEMP));
    }

    /**
     * Differential pressure [Pa] at a level [m rel. NWL] at the calibration pressure: the transmitter's
     * calibration sheet (4 mA at range_low, 20 mA at range_high: output rises with level).
     */
    public double levelCalibrationDpPa(double levelM) {
        double pCal = get(TuningKey.CALIBRATION_PRESSURE);
        double tapLow = get(TuningKey.TAP_LOW);
        double span = get(TuningKey.TAP_HIGH) - tapLow;
        return LevelCompensator.dpPa(levelM - tapLow, span,
                SteamTables.liquidDensity(get(TuningKey.REF_LEG_TEMP), pCal),
                SteamTables.saturatedLiquidDensity(pCal), SteamTables.saturatedVapourDensity(pCal));
    }

    /** Calibration of the level dp transmitters [Pa]: 4 mA at range_low (high dp), 20 mA at range_high. */
    public AnalogCal levelCal() {
        double pCal = get(TuningKey.CALIBRATION_PRESSURE);
        double dRho = SteamTables.saturatedLiquidDensity(pCal) - SteamTables.saturatedVapourDensity(pCal);
        return new AnalogCal(levelCalibrationDpPa(get(TuningKey.LEVEL_RANGE_LOW)),
                levelCalibrationDpPa(get(TuningKey.LEVEL_RANGE_HIGH)),
                get(TuningKey.LEVEL_RATE_LIMIT) * LevelCompensator.G_M_S2 * dRho, get(TuningKey.LEVEL_STALE_AFTER));
    }

    public AnalogCal drumPressureCal() {
        return new AnalogCal(get(TuningKey.DP_RANGE_LOW), get(TuningKey.DP_RANGE_HIGH),
                get(TuningKey.DP_RATE_LIMIT), get(TuningKey.DP_STALE_AFTER));
    }

    public AnalogCal steamFlowCal() {
        return new AnalogCal(0.0, get(TuningKey.SF_DP_RANGE), get(TuningKey.SF_RATE_LIMIT), get(TuningKey.SF_STALE_AFTER));
    }

    public AnalogCal feedFlowCal() {
        return new AnalogCal(0.0, get(TuningKey.FF_DP_RANGE), get(TuningKey.FF_RATE_LIMIT), get(TuningKey.FF_STALE_AFTER));
    }

    public AnalogCal feedTempCal() {
        return new AnalogCal(get(TuningKey.FT_RANGE_LOW), get(TuningKey.FT_RANGE_HIGH),
                get(TuningKey.FT_RATE_LIMIT), get(TuningKey.FT_STALE_AFTER));
    }

    public AnalogCal feedPressureCal() {
        return new AnalogCal(get(TuningKey.FP_RANGE_LOW), get(TuningKey.FP_RANGE_HIGH),
                get(TuningKey.FP_RATE_LIMIT), get(TuningKey.FP_STALE_AFTER));
    }

    public double steamFlowRangeKgS() { return get(TuningKey.SF_RANGE); }

    public double steamFlowDesignDensity() { return get(TuningKey.SF_DESIGN_DENSITY); }

    public double steamFlowCutoffFrac() { return get(TuningKey.SF_CUTOFF); }

    public double feedFlowRangeKgS() { return get(TuningKey.FF_RANGE); }

    public double feedFlowDesignDensity() { return get(TuningKey.FF_DESIGN_DENSITY); }

    public double feedFlowCutoffFrac() { return get(TuningKey.FF_CUTOFF); }

    /** Single-element controller: level [m] to valve [1], reverse acting, derivative on measurement. */
    public PidParams singleElement() {
        return pid(TuningKey.SE_GAIN, TuningKey.SE_TI, TuningKey.SE_TD, TuningKey.SE_N, TuningKey.SE_B,
                TuningKey.SE_OUT_LOW, TuningKey.SE_OUT_HIGH, TuningKey.SE_RATE, TuningKey.SE_TT);
    }

    /** Level master: level [m] to feed-flow correction [kg/s], reverse acting. */
    public PidParams levelMaster() {
        return pid(TuningKey.LM_GAIN, TuningKey.LM_TI, TuningKey.LM_TD, TuningKey.LM_N, TuningKey.LM_B,
                TuningKey.LM_OUT_LOW, TuningKey.LM_OUT_HIGH, TuningKey.LM_RATE, TuningKey.LM_TT);
    }

    /** Feed-flow slave: feed flow [kg/s] to valve [1], reverse acting. */
    public PidParams feedSlave() {
        return pid(TuningKey.FS_GAIN, TuningKey.FS_TI, TuningKey.FS_TD, TuningKey.FS_N, TuningKey.FS_B,
                TuningKey.FS_OUT_LOW, TuningKey.FS_OUT_HIGH, TuningKey.FS_RATE, TuningKey.FS_TT);
    }

    private PidParams pid(TuningKey kc, TuningKey ti, TuningKey td, TuningKey n, TuningKey b,
                          TuningKey lo, TuningKey hi, TuningKey rate, TuningKey tt) {
        return new PidParams(get(kc), get(ti), get(td), get(n), get(b), 0.0, get(lo), get(hi), get(rate), get(tt), true);
    }

    public double feedforwardGain() { return get(TuningKey.FF_GAIN); }

    public double feedforwardBiasKgS() { return get(TuningKey.FF_BIAS); }

    public double feedSetpointMaxKgS() { return get(TuningKey.FEED_SP_MAX); }

    public boolean autoSelect() { return "on".equals(word.get(TuningKey.AUTO_SELECT)); }

    public double threeElementAboveFrac() { return get(TuningKey.UP_LOAD); }

    public double singleElementBelowFrac() { return get(TuningKey.DOWN_LOAD); }

    public double flowGoodDelayS() { return get(TuningKey.FLOW_RETURN_DELAY); }

    public double swellGainMPerKgS() { return get(TuningKey.SWELL_GAIN); }

    public double swellTauS() { return get(TuningKey.SWELL_TAU); }

    public boolean setpointProgram() { return "on".equals(word.get(TuningKey.SP_PROGRAM)); }

    public double setpointOffsetAtZeroLoadM() { return get(TuningKey.SP_OFFSET_ZERO); }

    public double setpointOffsetAtRatedLoadM() { return get(TuningKey.SP_OFFSET_RATED); }

    public boolean dutyPumpB() { return "b".equals(word.get(TuningKey.PUMP_DUTY)); }

    public boolean pumpStopStart() { return "stop_start".equals(word.get(TuningKey.PUMP_OPERATION)); }

    public double pumpStartLevelM() { return get(TuningKey.PUMP_START_LEVEL); }

    public double pumpStopLevelM() { return get(TuningKey.PUMP_STOP_LEVEL); }

    public double pumpStartTimeoutS() { return get(TuningKey.PUMP_START_TIMEOUT); }

    public double pumpLowPressurePa() { return get(TuningKey.PUMP_LOW_PRESSURE); }

    public double pumpLowPressureDelayS() { return get(TuningKey.PUMP_LOW_PRESSURE_DELAY); }

    /** Name of the interlocks file as written in the tuning file. */
    public String interlocksFileName() { return word.get(TuningKey.INTERLOCKS); }

    /**
     * One setting in use, for records: its section and key as in the file, the value in the unit
     * the file wrote it in (a word for word keys), and that unit ("" for a word).
     */
    public record Setting(String section, String key, String value, String unit) {
    }

    /**
     * Every setting in use, section by section in the order of the format, each number shown in
     * the unit the file used (a value changed by the bench, such as swell compensation switched off
     * for a run, is shown as in use).
     */
    public List<Setting> settings() {
        List<Setting> out = new ArrayList<>();
        for (TuningKey k : TuningKey.values()) {
            if (k.dim == null) {
                out.add(new Setting(k.section, k.name, word.get(k), ""));
                continue;
            }
            double si = num.get(k);
            String unit = unitText.get(k);
            TuningUnits.Unit u = unit == null ? null : TuningUnits.parse(unit);
            if (Double.isInfinite(si) || u == null) {
                out.add(new Setting(k.section, k.name, Double.isInfinite(si) ? "off" : shown(si), unit == null ? "" : unit));
            } else {
                out.add(new Setting(k.section, k.name, shown((si - u.offset()) / u.factor()), unit));
            }
        }
        return out;
    }

    /** Up to six significant digits, no trailing zeros, no exponent for ordinary settings. */
    private static String shown(double v) {
        if (Math.abs(v) < 1e-9) {
            return "0";
        }
        String s = new java.math.BigDecimal(v).round(new java.math.MathContext(6)).stripTrailingZeros().toPlainString();
        return s.length() > 14 ? String.format(Locale.ROOT, "%.6g", v) : s;
    }
}
