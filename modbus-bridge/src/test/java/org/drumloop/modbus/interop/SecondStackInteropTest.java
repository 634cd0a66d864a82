package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.InetSocketAddress;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;

import com.digitalpetri.modbus.client.ModbusTcpClient;
import com.digitalpetri.modbus.exceptions.ModbusResponseException;
import com.digitalpetri.modbus.pdu.ReadDiscreteInputsRequest;
import com.digitalpetri.modbus.pdu.ReadHoldingRegistersRequest;
import com.digitalpetri.modbus.pdu.ReadInputRegistersRequest;
import com.digitalpetri.modbus.pdu.WriteMultipleRegistersRequest;
import com.digitalpetri.modbus.pdu.WriteSingleCoilRequest;
import com.digitalpetri.modbus.server.ModbusTcpServer;
import com.digitalpetri.modbus.server.ReadWriteModbusServices;
import com.digitalpetri.modbus.tcp.client.NettyTcpClientTransport;
import com.digitalpetri.modbus.tcp.server.NettyTcpServerTransport;

import io.netty.channel.ChannelHandlerContext;
import io.netty.channel.ChannelInboundHandlerAdapter;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.server.ImageServer;
import org.junit.jupiter.api.Test;

/**
 * Interoperability with an independent Modbus implementation (digitalpetri modbus-tcp 2.1.0,
 * Netty based): its client against our server, and our client against its server, on loopback
 * with port 0. Expected register contents come from the channel scaling (check values §3) and
 * IEEE 754 patterns; values cross the wire exactly, so equality is exact unless stated.
 */
class SecondStackInteropTest {
    private static final double EXACT_TOL = 1e-9;
    private static final int WAIT_S = 10;

    @Test
    void theirClientReadsAndWritesOurServedImage() throws Exception {
        ChannelMap map = TestMaps.small(1.0);
        try (ImageServer server = ImageServer.tcp(map, new TcpEndpoint("127.0.0.1", 0))) {
            ProcessImage in = new ProcessImage();
            in.setCurrentMa(Signal.LEVEL_DP_A, 12.0, Quality.GOOD, 0);
            in.setCurrentMa(Signal.LEVEL_DP_B, 20.0, Quality.GOOD, 0);
            in.set(Signal.DRUM_PRESSURE, 4.0e5 + 101_325.0, Quality.GOOD, 0);
            in.set(Signal.FEED_TEMP, 90.0 + 273.15, Quality.GOOD, 0);
            in.setBool(Signal.BURNER_ON, true, Quality.GOOD, 0);
            server.publishInputs(in, 0.0);

            NettyTcpClientTransport transport = NettyTcpClientTransport.create(cfg -> {
                cfg.hostname = "127.0.0.1";
                cfg.port = server.port();
            });
            ModbusTcpClient client = ModbusTcpClient.create(transport);
            client.connect();
            try {
                byte[] regs = client.readInputRegisters(1, new ReadInputRegistersRequest(0, 5)).registers();
                // 12 mA -> 13824 = 0x3600, 20 mA -> 27648 = 0x6C00 (headroom convention, check values §3);
                // 4 barg as float32 0x40800000 in CDAB = 0000 4080; 90 degC in tenths = 900 = 0x0384
                assertArrayEquals(new byte[] {0x36, 0x00, 0x6C, 0x00, 0x00, 0x00, 0x40, (byte) 0x80, 0x03, (byte) 0x84}, regs);
                byte[] bits = client.readDiscreteInputs(1, new ReadDiscreteInputsRequest(0, 2)).inputs();
                assertEquals(0x02, bits[0], "burner_on is bit 1, pump_a_running bit 0 (AP-spec §6.2 bit packing)");

                // 55.5 % -> 5550 = 0x15AE, then level -12.5 mm as float32 ABCD 0xC1480000
                client.writeMultipleRegisters(1, new WriteMultipleRegistersRequest(0, 3,
                        new byte[] {0x15, (byte) 0xAE, (byte) 0xC1, 0x48, 0x00, 0x00}));
                client.writeSingleCoil(1, new WriteSingleCoilRequest(0, true));
                byte[] back = client.readHoldingRegisters(1, new ReadHoldingRegistersRequest(0, 3)).registers();
                assertArrayEquals(new byte[] {0x15, (byte) 0xAE, (byte) 0xC1, 0x48, 0x00, 0x00}, back);

                ModbusResponseException ex = assertThrows(ModbusResponseException.class,
                        () -> client.readInputRegisters(1, new ReadInputRegistersRequest(0, 6)));
                assertEquals(2, ex.getExceptionCode(), "read past the map: illegal data address (AP-spec §7)");
                ModbusResponseException wr = assertThrows(ModbusResponseException.class,
                        () -> client.writeMultipleRegisters(1, new WriteMultipleRegistersRequest(1, 1, new byte[] {0, 0})));
                assertEquals(2, wr.getExceptionCode(), "half a float32 is not writable");
            } finally {
                client.disconnect();
            }
            ProcessImage out = new ProcessImage();
            server.collectOutputs(out, 0.0);
            assertEquals(0.555, out.value(Signal.FEED_VALVE_DEMAND), EXACT_TOL);
            assertEquals(-0.0125, out.value(Signal.LEVEL_INDICATED), EXACT_TOL);
            assertTrue(out.bool(Signal.PUMP_A_RUN));
            assertEquals(Quality.GOOD, out.quality(Signal.PUMP_A_RUN));
        }
    }

    @Test
    void ourClientPollsAndWritesTheirServer() throws Exception {
        com.digitalpetri.modbus.server.ProcessImage theirs = new com.digitalpetri.modbus.server.ProcessImage();
        theirs.with(tx -> {
            tx.writeInputRegisters(m -> {
                m.put(0, new byte[] {0x00, 0x00});                // 0 counts = 4 mA
                m.put(1, new byte[] {0x36, 0x00});                // 13824 = 12 mA
                m.put(2, new byte[] {0x00, 0x00});                // float32 CDAB 0x41200000 = 10.0 barg
                m.put(3, new byte[] {0x41, 0x20});
                m.put(4, new byte[] {0x03, (byte) 0x84});         // 900 tenths = 90 degC
            });
            tx.writeDiscreteInputs(m -> {
                m.put(0, true);
                m.put(1, false);
            });
            tx.writeHoldingRegisters(m -> {
                for (int a = 0; a < 3; a++) {
                    m.put(a, new byte[] {0, 0});
                }
            });
            tx.writeCoils(m -> {
                m.put(0, false);
                m.put(1, false);
            });
        });
        ReadWriteModbusServices services = new ReadWriteModbusServices() {
            @Override
            protected Optional<com.digitalpetri.modbus.server.ProcessImage> getProcessImage(int unitId) {
                return unitId == 1 ? Optional.of(theirs) : Optional.empty();
            }
        };
        CompletableFuture<Integer> bound = new CompletableFuture<>();
        NettyTcpServerTransport transport = NettyTcpServerTransport.create(cfg -> {
            cfg.bindAddress = "127.0.0.1";
            cfg.port = 0;
            cfg.bootstrapCustomizer = b -> b.handler(new ChannelInboundHandlerAdapter() {
                @Override
                public void channelActive(ChannelHandlerContext ctx) {
                    bound.complete(((InetSocketAddress) ctx.channel().localAddress()).getPort());
                    ctx.fireChannelActive();
                }
            });
        });
        ModbusTcpServer server = ModbusTcpServer.create(transport, services);
        server.start();
        int port = bound.get(WAIT_S, TimeUnit.SECONDS);
        try (RigClient client = RigClient.tcp(TestMaps.small(1.0), new TcpEndpoint("127.0.0.1", port),
                new RigClient.Options(0.02, 0.5, 1, 0.05, 0.5))) {
            client.start();
            assertTrue(TestMaps.await(() -> client.isFresh(Signal.FEED_TEMP) && client.isFresh(Signal.PUMP_A_RUNNING), WAIT_S));
            ProcessImage in = new ProcessImage();
            client.readInputs(in, 100.0);
            assertEquals(4.0, in.currentMa(Signal.LEVEL_DP_A), EXACT_TOL);
            assertEquals(12.0, in.currentMa(Signal.LEVEL_DP_B), EXACT_TOL);
            // 10 barg = 1e6 + 101325 Pa absolute (EngUnit, ISO 2533 standard atmosphere)
            assertEquals(1_101_325.0, in.value(Signal.DRUM_PRESSURE), 1e-6);
            assertEquals(363.15, in.value(Signal.FEED_TEMP), EXACT_TOL);
            assertTrue(in.bool(Signal.PUMP_A_RUNNING));
            assertEquals(Quality.GOOD, in.quality(Signal.LEVEL_DP_A), "4 mA is a live zero, not a fault (NE 43)");
            assertEquals(Quality.GOOD, in.quality(Signal.LEVEL_DP_B));

            ProcessImage out = new ProcessImage();
            out.set(Signal.FEED_VALVE_DEMAND, 0.25, Quality.GOOD, 100.0);
            out.set(Signal.LEVEL_INDICATED, 0.004, Quality.GOOD, 100.0);
            out.setBool(Signal.PUMP_A_RUN, true, Quality.GOOD, 100.0);
            out.setBool(Signal.FUEL_CUTOFF, true, Quality.GOOD, 100.0);
            client.writeOutputs(out, 100.0);
            // 25 % -> 2500 = 0x09C4; 4 mm as float32 ABCD = 0x40800000 (IEEE 754, check values §3)
            byte[] expected = {0x09, (byte) 0xC4, 0x40, (byte) 0x80, 0x00, 0x00};
            assertTrue(TestMaps.await(() -> java.util.Arrays.equals(expected, holding(theirs))
                    && theirs.get(tx -> tx.readCoils(m -> m.get(0) && m.get(1))), WAIT_S), "outputs reach the server");
        } finally {
            server.stop();
        }
    }

    private static byte[] holding(com.digitalpetri.modbus.server.ProcessImage img) {
        return img.get(tx -> tx.readHoldingRegisters((Map<Integer, byte[]> m) -> {
            byte[] out = new byte[6];
            for (int a = 0; a < 3; a++) {
                byte[] r = m.getOrDefault(a, new byte[2]);
                out[2 * a] = r[0];
                out[2 * a + 1] = r[1];
            }
            return out;
        }));
    }
}
