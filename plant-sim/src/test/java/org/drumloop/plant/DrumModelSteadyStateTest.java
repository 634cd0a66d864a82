package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.drumloop.plant.water.SaturationState;
import org.drumloop.plant.water.SaturationTable;
import org.junit.jupiter.api.Test;

/**
 * Steady state of the 160 MW unit at its operating point (source: Åström &amp; Bell 2000 model,
 * values computed by an independent implementation with IF97, as recorded in the project
 * reference §6): Ts = 299.27 °C, hf = 1047.5 kJ/kg, qdc = 1192.7 kg/s, av = 0.2704, Q = 85.78 MW,
 * qs = qf = 50.36 kg/s, qcd = 10.47 kg/s, Vsd0 = 7.654 m3, Vwd = 19.21 m3, l_ref = 1.205 m.
 */
class DrumModelSteadyStateTest {

    @Test
    void operatingPointMatchesTheReferenceValues() {
        PaperCase c = new PaperCase();
        double[] d = new double[4];
        c.model.computeDerivatives(0, c.y, d);
        SaturationState s = new SaturationState();
        SaturationTable.standard().lookup(PaperCase.P0_PA, s);
        // tolerances: half a unit in the last printed digit of each reference value
        assertEquals(299.27, s.tsK - 273.15, 0.005, "Ts [degC]");
        assertEquals(1047.5e3, c.hfJKg, 50, "feed enthalpy, IF97 region 1 at 8.5 MPa, 242 degC [J/kg]");
        assertEquals(1192.7, c.model.qdcOut, 0.05, "downcomer flow [kg/s]");
        assertEquals(0.2704, c.model.avOut, 0.00005, "riser void fraction");
        assertEquals(85.78e6, c.model.heatW, 0.005e6, "heat [W]");
        assertEquals(50.36, c.model.qfKgS, 0.005, "feed = steam flow [kg/s]");
        assertEquals(10.47, c.model.qcdOut, 0.01, "drum condensation [kg/s]");
        assertEquals(7.654, c.model.vsd0M3, 0.0005, "Vsd0 [m3]");
        assertEquals(19.21, c.model.vwdOut, 0.005, "water in the drum [m3]");
        assertEquals(1.205, c.vBelowRefM3 / PaperCase.AD_M2, 0.0005, "l_ref [m]");
    }

    @Test
    void allDerivativesVanishAtTheSteadyState() {
        PaperCase c = new PaperCase();
        double[] d = new double[4];
        c.model.computeDerivatives(0, c.y, d);
        // scaled by each state's size: 1e-9 per second relative (project reference §11); the
        // steady state is exact up to round-off of the property table
        assertEquals(0, d[0] / 57.2, 1e-9, "dVwt/dt scaled");
        assertEquals(0, d[1] / 8.5e6, 1e-9, "dp/dt scaled");
        assertEquals(0, d[2] / 0.051, 1e-9, "dar/dt scaled");
        assertEquals(0, d[3] / 4.9, 1e-9, "dVsd/dt scaled");
    }

    @Test
    void plantFromTheReferenceFileStartsBalancedAtNormalWaterLevel() throws Exception {
        Plant p = new Plant(PlantFiles.ab160(), 1);
        double[] d = new double[4];
        double[] y = new double[4];
        p.state(y);
        p.drumModel().computeDerivatives(0, y, d);
        assertEquals(0, p.levelM(), 1e-9, "level at NWL [m] by construction of the steady state");
        assertEquals(8.5e6, p.drumPressurePa(), 1e-6, "pressure at the setpoint [Pa]");
        assertEquals(p.steamFlowKgS(), p.feedFlowKgS(), 1e-6, "feed balances steam [kg/s] to the valve-balancing bisection's resolution");
        assertEquals(0.051, p.riserQuality(), 5e-4, "quality near the paper's 0.051 at the paper's steam flow");
        assertEquals(0, d[1] / 8.5e6, 1e-8, "dp/dt scaled");
        assertEquals(0, d[3] / 4.9, 1e-8, "dVsd/dt scaled");
    }
}
