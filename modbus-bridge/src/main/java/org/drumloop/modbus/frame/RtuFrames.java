package org.drumloop.modbus.frame;

/**
 * Modbus RTU framing: whole-frame encoding, frame length rules and the t1.5/t3.5 timers
 * of MODBUS over Serial Line V1.02 §2.5.1.1 (11-bit characters; fixed 0.750 ms / 1.750 ms above
 * 19200 baud).
 */
public final class RtuFrames {
    private RtuFrames() {}

    /** Bits per character on the line: start + 8 data + parity (or second stop) + stop. */
    public static final int BITS_PER_CHAR = 11;

    /** Time of one 11-bit character [s]. */
    public static double charTimeS(int baud) { return (double) BITS_PER_CHAR / baud; }

    /** t1.5: longest silence allowed inside a frame [s]. */
    public static double t15S(int baud) { return baud > 19200 ? 750e-6 : 1.5 * charTimeS(baud); }

    /** t3.5: shortest silence between frames [s]. */
    public static double t35S(int baud) { return baud > 19200 ? 1750e-6 : 3.5 * charTimeS(baud); }

    /** address + PDU + CRC (low byte first) as a new array. */
    public static byte[] frame(int address, byte[] pdu) {
        byte[] out = new byte[pdu.length + 3];
        out[0] = (byte) address;
        System.arraycopy(pdu, 0, out, 1, pdu.length);
        Crc16.append(out, 0, pdu.length + 1);
        return out;
    }

    /**
     * Total length of a request frame (address to CRC) from its first bytes, or -1 when more bytes
     * are needed to tell, or 0 when the function code has no known length rule.
     */
    public static int requestLength(byte[] b, int have) {
        if (have < 2) {
            return -1;
        }
        int fc = b[1] & 0xFF;
        switch (fc) {
            case Modbus.FC_READ_COILS:
            case Modbus.FC_READ_DISCRETE_INPUTS:
            case Modbus.FC_READ_HOLDING_REGISTERS:
            case Modbus.FC_READ_INPUT_REGISTERS:
            case Modbus.FC_WRITE_SINGLE_COIL:
            case Modbus.FC_WRITE_SINGLE_REGISTER:
                return 8;
            case Modbus.FC_WRITE_MULTIPLE_COILS:
            case Modbus.FC_WRITE_MULTIPLE_REGISTERS:
                return have < 7 ? -1 : 9 + (b[6] & 0xFF);
            case Modbus.FC_READ_WRITE_MULTIPLE_REGISTERS:
                return have < 11 ? -1 : 13 + (b[10] & 0xFF);
            default:
                return 0;
        }
    }

    /** Total length of a response frame, with the same conventions as {@link #requestLength}. */
    public static int responseLength(byte[] b, int have) {
        if (have < 2) {
            return -1;
        }
        int fc = b[1] & 0xFF;
        if ((fc & Modbus.EXCEPTION_FLAG) != 0) {
            return 5;
        }
        switch (fc) {
            case Modbus.FC_READ_COILS:
            case Modbus.FC_READ_DISCRETE_INPUTS:
            case Modbus.FC_READ_HOLDING_REGISTERS:
            case Modbus.FC_READ_INPUT_REGISTERS:
            case Modbus.FC_READ_WRITE_MULTIPLE_REGISTERS:
                return have < 3 ? -1 : 5 + (b[2] & 0xFF);
            case Modbus.FC_WRITE_SINGLE_COIL:
            case Modbus.FC_WRITE_SINGLE_REGISTER:
            case Modbus.FC_WRITE_MULTIPLE_COILS:
            case Modbus.FC_WRITE_MULTIPLE_REGISTERS:
                return 8;
            default:
                return 0;
        }
    }
}
