package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Flow elements: dP = k q^2 / rho with k fixed at the design density (ISO 5167-1 form, q ∝
 * sqrt(dP rho); check-values §4.2), and the 4–20 mA scaling linear in dP (check-values §3).
 */
class FlowTransmitterTest {

    @Test
    void steamFlowElementReadsDesignDpAtRangeFlowAndDesignDensity() throws Exception {
        PlantConfig c = PlantFiles.aux();
        Plant p = new Plant(c, 1);
        p.setSteamFlowOverrideKgS(15 / 3.6); // the range flow, 15 t/h (aux-boiler.plant)
        p.step(0.1);
        for (int i = 0; i < 20; i++) { // let the 0.2 s lag settle (e^-10)
            p.step(0.1);
        }
        double rho = p.steamDensity();
        // 25 kPa at 15 t/h and 4.65 kg/m3; scaled by design/actual density; noise 50 Pa, 6 sigma
        double expected = 25e3 * 4.65 / rho;
        assertEquals(expected, p.transmitter(TransmitterId.STEAM_FLOW).value(), 300);
        // 4 + 16 dP/dPmax mA (check-values §3 scaling); noise 50 Pa = 0.032 mA, 6 sigma
        double ma = Math.min(20.5, 4 + 16 * expected / 25e3);
        assertEquals(ma, p.transmitter(TransmitterId.STEAM_FLOW).currentMa(), 0.2);
    }

    @Test
    void feedFlowDpScalesWithTheSquareOfFlow() throws Exception {
        Plant p = new Plant(PlantFiles.aux(), 1);
        double q0 = p.feedFlowKgS();
        double dp0 = p.transmitter(TransmitterId.FEED_FLOW).value();
        p.setFeedFlowOverrideKgS(2 * q0);
        for (int i = 0; i < 30; i++) {
            p.step(0.1);
        }
        // doubling the flow quadruples dP (square law); noise 50 Pa on ~8 kPa, 6 sigma each
        assertEquals(4 * dp0, p.transmitter(TransmitterId.FEED_FLOW).value(), 6 * 50 * 5);
    }
}
