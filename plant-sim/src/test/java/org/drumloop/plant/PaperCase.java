package org.drumloop.plant;

import org.drumloop.plant.water.Iapws97;
import org.drumloop.plant.water.SaturationState;
import org.drumloop.plant.water.SaturationTable;

/**
 * The 160 MW unit of Åström &amp; Bell 2000 at the paper's operating point, with the parameters
 * and steady-state definition of the project's model reference §6 (source: [AB] parameter list as
 * restated by a public Modelica re-implementation): Vd, Vr, Vdc = 40, 37, 11 m3; Ad = 20 m2;
 * Adc = 0.38 m2; mt, mr = 300 t, 160 t; md = 0; Cp = 550 J/(kg K); k = 25; beta = 0.3; Td = 12 s;
 * p0 = 8.5 MPa; ar0 = 0.051; Vwt0 = 57.2 m3; Vsd at steady state 4.9 m3; feed 242 °C.
 */
final class PaperCase {
    static final double AD_M2 = 20;
    static final double P0_PA = 8.5e6;
    static final double AR0 = 0.051;
    static final double VWT0_M3 = 57.2;
    static final double VSD_SS_M3 = 4.9;
    static final double FEED_T_K = 242 + 273.15;
    /** The re-implementation's gravity (reproduces its circulation flow 1192.7 kg/s). */
    static final double G = 9.81;

    final DrumModel model;
    final double[] y = new double[4];
    /** Water and bubble volume below the surface at the steady state (l = 0) [m3]. */
    final double vBelowRefM3;
    final double hfJKg;

    PaperCase(double mdKg) {
        model = new DrumModel(40, 37, 11, 0.38, 300_000, 160_000, mdKg, 550, 25, 0.3, 12, G,
                SaturationTable.standard());
        hfJKg = Iapws97.enthalpy1(P0_PA, FEED_T_K);
        SaturationState s = new SaturationState();
        SaturationTable.standard().lookup(P0_PA, s);
        double av = VoidFraction.av(AR0, s.rhoW, s.rhoS);
        vBelowRefM3 = VWT0_M3 - 11 - (1 - av) * 37 + VSD_SS_M3;
        model.steadyStateFromQuality(P0_PA, AR0, hfJKg, VSD_SS_M3, vBelowRefM3, y);
    }

    PaperCase() {
        this(0);
    }

    /** Level deviation for state {@code yy} with the paper's constant surface area [m]. */
    double levelM(double[] yy) {
        double[] d = new double[4];
        model.computeDerivatives(0, yy, d);
        return (model.vwdOut + yy[3] - vBelowRefM3) / AD_M2;
    }
}
