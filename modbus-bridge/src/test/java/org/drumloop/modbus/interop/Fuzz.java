package org.drumloop.modbus.interop;

import java.util.Random;

import org.drumloop.modbus.frame.Mbap;
import org.drumloop.modbus.frame.Modbus;

/**
 * Random and malformed Modbus requests for the fuzz tests, after the request formats of the
 * MODBUS Application Protocol Specification V1.1b3 (§6.1-6.12) and the MBAP header of the TCP
 * implementation guide (§3.1.3), and the checks an answer must pass.
 */
final class Fuzz {
    private Fuzz() {}

    private static final int[] SERVED = {Modbus.FC_READ_COILS, Modbus.FC_READ_DISCRETE_INPUTS,
        Modbus.FC_READ_HOLDING_REGISTERS, Modbus.FC_READ_INPUT_REGISTERS, Modbus.FC_WRITE_SINGLE_COIL,
        Modbus.FC_WRITE_SINGLE_REGISTER, Modbus.FC_WRITE_MULTIPLE_COILS, Modbus.FC_WRITE_MULTIPLE_REGISTERS};

    /** A request PDU: well formed or not, for a served function or not. */
    static byte[] pdu(Random r) {
        int kind = r.nextInt(100);
        if (kind < 30) {
            return wellFormed(r, SERVED[r.nextInt(SERVED.length)], r.nextInt(4) == 0 ? r.nextInt(65536) : r.nextInt(8));
        }
        if (kind < 45) {
            // unknown or unserved function with a random body (FC 0, 7, 8, 0x2B, 0x80+ ...)
            int fc;
            do {
                fc = r.nextInt(256);
            } while (isServed(fc));
            return withFirst(fc, random(r, r.nextInt(20)));
        }
        if (kind < 60) {
            // quantity out of range: 0, or one above the limit, or anything up to 0xFFFF
            int fc = SERVED[r.nextInt(SERVED.length)];
            int qty = switch (r.nextInt(3)) {
                case 0 -> 0;
                case 1 -> limit(fc) + 1;
                default -> r.nextInt(65536);
            };
            byte[] p = wellFormed(r, fc, r.nextInt(8));
            if (p.length >= 5 && fc != Modbus.FC_WRITE_SINGLE_COIL && fc != Modbus.FC_WRITE_SINGLE_REGISTER) {
                p[3] = (byte) (qty >>> 8);
                p[4] = (byte) qty;
            } else if (fc == Modbus.FC_WRITE_SINGLE_COIL) {
                p[3] = (byte) r.nextInt(256);
                p[4] = (byte) (1 + r.nextInt(255));
            }
            return p;
        }
        if (kind < 75) {
            // truncated: the function code and part of its fields
            byte[] p = wellFormed(r, SERVED[r.nextInt(SERVED.length)], r.nextInt(8));
            return java.util.Arrays.copyOf(p, 1 + r.nextInt(Math.max(1, p.length - 1)));
        }
        if (kind < 85) {
            // multiple write whose byte count disagrees with the quantity or the data
            int fc = r.nextBoolean() ? Modbus.FC_WRITE_MULTIPLE_COILS : Modbus.FC_WRITE_MULTIPLE_REGISTERS;
            byte[] p = wellFormed(r, fc, r.nextInt(8));
            p[5] = (byte) (p[5] + 1 + r.nextInt(5));
            return p;
        }
        return withFirst(SERVED[r.nextInt(SERVED.length)], random(r, 1 + r.nextInt(40)));
    }

    /**
     * One TCP ADU to send, and whether its header breaks the framing: a protocol id other than 0,
     * a length outside 2..254, a length that lies about the bytes that follow, a header cut short
     * or plain noise. After such a frame the server closes the connection (or waits for bytes
     * that will not come), so it is the last on its connection.
     */
    record Frame(byte[] bytes, boolean breaksFraming) {}

    /** A whole TCP ADU: mostly a plausible header around {@link #pdu}, some with a bad or lying header. */
    static Frame frame(Random r, int transactionId) {
        byte[] pdu = pdu(r);
        int unit = r.nextInt(20) == 0 ? 2 + r.nextInt(254) : 1;
        byte[] f = Mbap.frame(transactionId, unit, pdu);
        int kind = r.nextInt(100);
        if (kind < 3) {
            f[2] = (byte) (1 + r.nextInt(255));
        } else if (kind < 5) {
            int len = switch (r.nextInt(3)) {
                case 0 -> 0;
                case 1 -> 1;
                default -> 255 + r.nextInt(65536 - 255);
            };
            f[4] = (byte) (len >>> 8);
            f[5] = (byte) len;
        } else if (kind < 8) {
            int len = Math.max(2, Math.min(254, pdu.length + 1 + (r.nextBoolean() ? 1 + r.nextInt(10) : -1 - r.nextInt(3))));
            if (len == pdu.length + 1) {
                len++;
            }
            f[4] = 0;
            f[5] = (byte) len;
        } else if (kind < 9) {
            return new Frame(r.nextBoolean() ? java.util.Arrays.copyOf(f, 1 + r.nextInt(6)) : random(r, 1 + r.nextInt(300)), true);
        } else {
            return new Frame(f, false);
        }
        return new Frame(f, true);
    }

    /**
     * Null when {@code pdu[0..len)} is a well-formed answer: an exception (function + 0x80 and one
     * of the codes the server uses), a read with a byte count that matches, or a write echo.
     */
    static String checkAnswer(byte[] pdu, int len) {
        int fc = pdu[0] & 0xFF;
        if ((fc & Modbus.EXCEPTION_FLAG) != 0) {
            int code = len == 2 ? pdu[1] & 0xFF : -1;
            boolean known = code == Modbus.EX_ILLEGAL_FUNCTION || code == Modbus.EX_ILLEGAL_DATA_ADDRESS
                    || code == Modbus.EX_ILLEGAL_DATA_VALUE || code == Modbus.EX_GATEWAY_TARGET_NO_RESPONSE;
            return known ? null : "exception answer of " + len + " bytes, code " + code;
        }
        if (!isServed(fc)) {
            return "answer with function " + fc;
        }
        if (fc <= Modbus.FC_READ_INPUT_REGISTERS) {
            return len >= 3 && (pdu[1] & 0xFF) == len - 2 ? null : "read answer of " + len + " bytes, byte count " + (pdu[1] & 0xFF);
        }
        return len == 5 ? null : "write answer of " + len + " bytes";
    }

    /** A request of function {@code fc} that follows the specification's format, at {@code start}. */
    static byte[] wellFormed(Random r, int fc, int start) {
        switch (fc) {
            case Modbus.FC_WRITE_SINGLE_COIL:
                return bytes(fc, start >>> 8, start, r.nextBoolean() ? 0xFF : 0, 0);
            case Modbus.FC_WRITE_SINGLE_REGISTER:
                return bytes(fc, start >>> 8, start, r.nextInt(256), r.nextInt(256));
            case Modbus.FC_WRITE_MULTIPLE_COILS: {
                int qty = 1 + r.nextInt(16);
                byte[] p = new byte[6 + (qty + 7) / 8];
                fill(p, fc, start, qty);
                p[5] = (byte) ((qty + 7) / 8);
                return p;
            }
            case Modbus.FC_WRITE_MULTIPLE_REGISTERS: {
                int qty = 1 + r.nextInt(4);
                byte[] p = new byte[6 + 2 * qty];
                fill(p, fc, start, qty);
                p[5] = (byte) (2 * qty);
                for (int k = 6; k < p.length; k++) {
                    p[k] = (byte) r.nextInt(256);
                }
                return p;
            }
            default: {
                byte[] p = new byte[5];
                fill(p, fc, start, 1 + r.nextInt(limit(fc)));
                return p;
            }
        }
    }

    private static void fill(byte[] p, int fc, int start, int qty) {
        p[0] = (byte) fc;
        p[1] = (byte) (start >>> 8);
        p[2] = (byte) start;
        p[3] = (byte) (qty >>> 8);
        p[4] = (byte) qty;
    }

    private static int limit(int fc) {
        return switch (fc) {
            case Modbus.FC_READ_COILS, Modbus.FC_READ_DISCRETE_INPUTS -> Modbus.MAX_READ_BITS;
            case Modbus.FC_WRITE_MULTIPLE_COILS -> Modbus.MAX_WRITE_COILS;
            case Modbus.FC_WRITE_MULTIPLE_REGISTERS -> Modbus.MAX_WRITE_REGISTERS;
            default -> Modbus.MAX_READ_REGISTERS;
        };
    }

    static boolean isServed(int fc) {
        for (int s : SERVED) {
            if (s == fc) {
                return true;
            }
        }
        return false;
    }

    static byte[] random(Random r, int n) {
        byte[] b = new byte[n];
        r.nextBytes(b);
        return b;
    }

    private static byte[] withFirst(int fc, byte[] rest) {
        byte[] p = new byte[rest.length + 1];
        p[0] = (byte) fc;
        System.arraycopy(rest, 0, p, 1, rest.length);
        return p;
    }

    private static byte[] bytes(int... b) {
        byte[] out = new byte[b.length];
        for (int i = 0; i < b.length; i++) {
            out[i] = (byte) b[i];
        }
        return out;
    }
}
