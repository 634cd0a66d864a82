package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Global balances: the water/steam inventory changes by the integral of the flows in and out, and
 * the stored energy by the integral of heat and enthalpy flows (Åström &amp; Bell 2000 global
 * balances, project reference §4.1 and §7: "total mass must change by exactly ∫(qf − qs)dt").
 */
class ConservationTest {
    private static final double MASS_REL_TOL = 1e-6;   // project reference §11: 1e-6 over 100 s
    private static final double ENERGY_REL_TOL = 1e-6; // same integration error order as mass

    @Test
    void inventoryChangeEqualsIntegratedFlowsOverALongRun() throws Exception {
        Plant p = new Plant(PlantFiles.aux(), 3);
        p.initSteadyState(0.8);
        double m0 = p.totalMassKg();
        double e0 = p.totalEnergyJ();
        // flows in and out that do not balance: pumps and valve, steam valve law, a leak, a
        // demand change and a valve move, pressure controller acting
        p.setSteamDemand(1.1);
        p.setFeedValveDemand(0.8);
        p.inject(Fault.of(Fault.Kind.TUBE_LEAK, "drum", 0.2));
        for (int i = 0; i < 1000; i++) {
            p.step(0.1);
        }
        double dm = p.totalMassKg() - m0;
        double de = p.totalEnergyJ() - e0;
        assertTrue(Math.abs(dm) > 10, "the run must move the inventory: " + dm + " kg");
        assertEquals(p.netMassInKg(), dm, MASS_REL_TOL * p.totalMassKg(), "mass change [kg]");
        assertEquals(p.netEnergyInJ(), de, ENERGY_REL_TOL * Math.abs(p.netEnergyInJ()) + 1e-9 * Math.abs(e0), "energy change [J]");
        assertTrue(!p.invalid(), "stayed inside the model");
    }
}
