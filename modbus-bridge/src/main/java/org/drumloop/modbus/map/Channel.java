package org.drumloop.modbus.map;

import org.drumloop.core.io.EngUnit;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;

/**
 * One row of a channel map: where a signal lives on Modbus and how its raw value scales.
 *
 * @param signal the process-image signal
 * @param table Modbus table
 * @param unitId Modbus unit id (slave address), 0..255
 * @param address 0-based PDU offset, 0..65535
 * @param type data type in the table
 * @param order word order of a 32-bit value, null for 16-bit and bits
 * @param rawLo raw value at {@code engLo} (NaN for bits)
 * @param rawHi raw value at {@code engHi} (NaN for bits)
 * @param engLo engineering value at the bottom of the range, in {@code engUnit}
 * @param engHi engineering value at the top of the range, in {@code engUnit}
 * @param engUnit engineering unit ({@link EngUnit#MA} for a 4-20 mA loop current)
 * @param clamp limit decoded values to [engLo, engHi]
 * @param faultLow at or below this engineering value the input is a device failure (NaN: none)
 * @param faultHigh at or above this engineering value the input is a device failure (NaN: none)
 * @param staleAfterS an input not refreshed for longer than this is BAD [s] (infinite: no limit)
 * @param description free text
 * @param line line in the map file, for messages
 */
public record Channel(Signal signal, Table table, int unitId, int address, DataType type, WordOrder order,
                      double rawLo, double rawHi, double engLo, double engHi, EngUnit engUnit, boolean clamp,
                      double faultLow, double faultHigh, double staleAfterS, String description, int line) {

    /** NAMUR NE 43: at or below 3.6 mA is a failure signal. */
    public static final double NE43_FAIL_LOW_MA = 3.6;
    /** NAMUR NE 43: at or above 21.0 mA is a failure signal. */
    public static final double NE43_FAIL_HIGH_MA = 21.0;
    /** NAMUR NE 43: measurement information reaches down to 3.8 mA. */
    public static final double NE43_MEAS_LOW_MA = 3.8;
    /** NAMUR NE 43: measurement information reaches up to 20.5 mA. */
    public static final double NE43_MEAS_HIGH_MA = 20.5;

    /** Registers (or bits, for bit tables) the channel occupies. */
    public int width() { return table.isBits() ? 1 : type.registers(); }

    /** Last address occupied. */
    public int lastAddress() { return address + width() - 1; }

    public boolean isLoopCurrent() { return engUnit == EngUnit.MA; }

    public boolean isBool() { return type == DataType.BOOL; }

    /** Raw → engineering, with the channel's clamp. */
    public double engFromRaw(double raw) {
        double eng = Scaling.toEng(raw, rawLo, rawHi, engLo, engHi);
        return clamp ? Scaling.clamp(eng, engLo, engHi) : eng;
    }

    /** Engineering → raw (not clamped; the register write saturates). */
    public double rawFromEng(double eng) { return Scaling.toRaw(eng, rawLo, rawHi, engLo, engHi); }

    /** Decode the channel from the registers {@code regs[off..]} to an engineering value. */
    public double engFromRegisters(int[] regs, int off) {
        return engFromRaw(Scaling.readRaw(type, order, regs, off));
    }

    /** Encode an engineering value into {@code regs[off..]}. */
    public void engToRegisters(double eng, int[] regs, int off) {
        Scaling.writeRaw(type, order, rawFromEng(eng), regs, off);
    }

    /**
     * Transport quality of a decoded input value (before any clamp): not finite or beyond the
     * fault thresholds is BAD; for a loop current inside NE 43's bands between measurement and
     * failure (3.6-3.8 mA, 20.5-21.0 mA) UNCERTAIN; otherwise GOOD.
     */
    public Quality classify(double eng) {
        if (!Double.isFinite(eng)) {
            return Quality.BAD;
        }
        if ((!Double.isNaN(faultLow) && eng <= faultLow) || (!Double.isNaN(faultHigh) && eng >= faultHigh)) {
            return Quality.BAD;
        }
        if (isLoopCurrent() && (eng < NE43_MEAS_LOW_MA || eng > NE43_MEAS_HIGH_MA)) {
            return Quality.UNCERTAIN;
        }
        return Quality.GOOD;
    }

    /** Put an engineering value into an image: bool, loop current, or SI value. */
    public void toImage(double eng, ProcessImage img, Quality q, double tS) {
        if (isBool()) {
            img.setBool(signal, eng >= 0.5, q, tS);
        } else if (isLoopCurrent()) {
            img.setCurrentMa(signal, eng, q, tS);
        } else {
            img.set(signal, engUnit.toSi(eng), q, tS);
        }
    }

    /** Take the engineering value of this channel from an image (loop current for mA channels). */
    public double engFromImage(ProcessImage img) {
        if (isBool()) {
            return img.bool(signal) ? 1.0 : 0.0;
        }
        if (isLoopCurrent()) {
            return img.currentMa(signal);
        }
        return engUnit.fromSi(img.value(signal));
    }

    /** The same channel on another unit id. */
    public Channel withUnitId(int newUnit) {
        return new Channel(signal, table, newUnit, address, type, order, rawLo, rawHi, engLo, engHi, engUnit,
                clamp, faultLow, faultHigh, staleAfterS, description, line);
    }
}
