package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.drumloop.plant.water.Iapws97;
import org.junit.jupiter.api.Test;

/** Valve characteristics, the Kv sizing form and the feed-train closed form. */
class ValveAndFeedTrainTest {
    private static final double[] X = {0.10, 0.25, 0.50, 0.75, 0.90, 1.00};
    // equal-percentage f = R^(x-1), R = 50 (check-values §7 table, computed there)
    private static final double[] EQP_R50 = {0.02958, 0.05318, 0.14142, 0.37606, 0.67624, 1.00000};

    @Test
    void linearCharacteristicIsTravel() {
        for (double x : X) {
            // check-values §7 table: linear f = x; exact arithmetic
            assertEquals(x, ValveCharacteristic.LINEAR.relativeKv(x, 50), 1e-15);
        }
    }

    @Test
    void equalPercentageCharacteristicMatchesTheTable() {
        for (int i = 0; i < X.length; i++) {
            // table printed to 5 decimals: half a unit in the last place
            assertEquals(EQP_R50[i], ValveCharacteristic.EQUAL_PERCENTAGE.relativeKv(X[i], 50), 5e-6, "x = " + X[i]);
        }
        // each +10 % of travel multiplies flow by 1.47876 (check-values §7); 5e-6 for the rounding
        double r = ValveCharacteristic.EQUAL_PERCENTAGE.relativeKv(0.6, 50) / ValveCharacteristic.EQUAL_PERCENTAGE.relativeKv(0.5, 50);
        assertEquals(1.47876, r, 5e-6);
    }

    @Test
    void kvWorkedExampleGivesThirtyCubicMetresPerHour() {
        // check-values §7 worked example: 30 m3/h of water at 120 degC, p1 = 15 bar(a), dp = 2 bar
        // needs Kv = 20.617 (rho1 = 943.755, rho0 = 999.101 kg/m3). A valve of that Kv passes
        // 30 m3/h at 2 bar: dp = Rv Q^2.
        double rho = Iapws97.liquidDensity(15e5, 120 + 273.15);
        assertEquals(943.755, rho, 0.0005, "IF97 density at 15 bar, 120 degC (check-values §7)");
        FeedTrain ft = new FeedTrain(150, 120, 10.4 / 3600, 1.3e5, 5, 0.5e5, 10.4 / 3600, 0,
                20.617, ValveCharacteristic.LINEAR, 50);
        double rv = ft.valveResistance(1.0, rho);
        double q = Math.sqrt(2e5 / rv) * 3600;
        assertEquals(30.0, q, 0.002, "flow [m3/h]; Kv given to 5 digits");
    }

    @Test
    void auxiliaryFeedTrainClosedFormAtSevenAndTenBar() throws Exception {
        // project reference §10 (computed): valve fixed at 0.62 gives 12.0 m3/h at 7 bar and
        // 9.5 m3/h at 10 bar drum pressure (absolute), pump/line/valve of the demo set, no
        // recirculation. Tolerance: half a unit of the printed digit.
        PlantConfig c = PlantFiles.aux().with(PlantKey.FEED_RECIRC_FLOW_AT_SHUTOFF, 0);
        FeedTrain ft = FeedTrain.of(c);
        double rho = Iapws97.liquidDensity(12e5, 90 + 273.15);
        assertEquals(12.0, ft.solve(7e5, 0.62, 1, 0, rho) * 3600, 0.05, "m3/h at 7 bar");
        assertEquals(9.5, ft.solve(10e5, 0.62, 1, 0, rho) * 3600, 0.05, "m3/h at 10 bar");
    }

    @Test
    void recirculationTakesPartOfThePumpFlowAndCheckValveStopsReverseFlow() throws Exception {
        FeedTrain ft = FeedTrain.of(PlantFiles.aux());
        double rho = 965;
        double q = ft.solve(9e5, 0.62, 1, 0, rho);
        // header balance: pump = feed + recirculation (closed form of each element; round-off)
        assertEquals(ft.pumpM3S(0), q + ft.recircM3S(), 1e-9 * ft.pumpM3S(0));
        // header pressure satisfies the pump curve (definition of the curve, 1 Pa)
        double a = (150 - 120) / Math.pow(10.4 / 3600, 2);
        assertEquals(1.3e5 + rho * DrumModel.G * (150 - a * ft.pumpM3S(0) * ft.pumpM3S(0)), ft.headerPa(), 1.0);
        // drum above shut-off pressure: no reverse flow
        assertEquals(0, ft.solve(30e5, 1.0, 1, 0, rho), 0.0);
        // two pumps deliver more than one against the same system
        double two = ft.solve(9e5, 0.8, 1, 1, rho);
        double one = ft.solve(9e5, 0.8, 1, 0, rho);
        assertEquals(true, two > one, "parallel pumps raise the flow");
    }
}
