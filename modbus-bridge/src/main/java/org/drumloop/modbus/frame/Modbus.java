package org.drumloop.modbus.frame;

/**
 * Function codes, exception codes and quantity limits of the Modbus application protocol
 * (MODBUS Application Protocol Specification V1.1b3, §6.1-6.17 and §7), and the size limits
 * of the PDU and of the TCP and serial ADUs (§4.1).
 */
public final class Modbus {
    private Modbus() {}

    public static final int FC_READ_COILS = 0x01;
    public static final int FC_READ_DISCRETE_INPUTS = 0x02;
    public static final int FC_READ_HOLDING_REGISTERS = 0x03;
    public static final int FC_READ_INPUT_REGISTERS = 0x04;
    public static final int FC_WRITE_SINGLE_COIL = 0x05;
    public static final int FC_WRITE_SINGLE_REGISTER = 0x06;
    public static final int FC_WRITE_MULTIPLE_COILS = 0x0F;
    public static final int FC_WRITE_MULTIPLE_REGISTERS = 0x10;
    public static final int FC_READ_WRITE_MULTIPLE_REGISTERS = 0x17;

    /** Added to the function code in an exception response. */
    public static final int EXCEPTION_FLAG = 0x80;

    public static final int EX_ILLEGAL_FUNCTION = 1;
    public static final int EX_ILLEGAL_DATA_ADDRESS = 2;
    public static final int EX_ILLEGAL_DATA_VALUE = 3;
    public static final int EX_SERVER_DEVICE_FAILURE = 4;
    public static final int EX_SERVER_DEVICE_BUSY = 6;
    public static final int EX_GATEWAY_TARGET_NO_RESPONSE = 0x0B;

    /** FC 1 and 2: 1..2000 bits per read. */
    public static final int MAX_READ_BITS = 2000;
    /** FC 3 and 4: 1..125 registers per read. */
    public static final int MAX_READ_REGISTERS = 125;
    /** FC 15: 1..1968 coils per write. */
    public static final int MAX_WRITE_COILS = 1968;
    /** FC 16: 1..123 registers per write. */
    public static final int MAX_WRITE_REGISTERS = 123;
    /** FC 23 write part: 1..121 registers. */
    public static final int MAX_RW_WRITE_REGISTERS = 121;

    /** Largest PDU (function code + data). */
    public static final int MAX_PDU = 253;
    /** MBAP header length. */
    public static final int MBAP_LENGTH = 7;
    /** Largest TCP ADU: MBAP + PDU. */
    public static final int MAX_TCP_ADU = MBAP_LENGTH + MAX_PDU;
    /** Largest serial ADU: address + PDU + CRC. */
    public static final int MAX_RTU_ADU = 1 + MAX_PDU + 2;

    /** Coil value ON in FC 5. */
    public static final int COIL_ON = 0xFF00;
    /** Coil value OFF in FC 5. */
    public static final int COIL_OFF = 0x0000;

    /** A short human name of an exception code, for logs and statistics. */
    public static String exceptionName(int code) {
        switch (code) {
            case EX_ILLEGAL_FUNCTION: return "illegal function";
            case EX_ILLEGAL_DATA_ADDRESS: return "illegal data address";
            case EX_ILLEGAL_DATA_VALUE: return "illegal data value";
            case EX_SERVER_DEVICE_FAILURE: return "server device failure";
            case EX_SERVER_DEVICE_BUSY: return "server device busy";
            case EX_GATEWAY_TARGET_NO_RESPONSE: return "gateway target failed to respond";
            default: return "exception " + code;
        }
    }
}
