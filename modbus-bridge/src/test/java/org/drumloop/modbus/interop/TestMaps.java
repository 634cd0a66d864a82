package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.function.BooleanSupplier;

import org.drumloop.core.config.ConfigException;
import org.drumloop.modbus.map.ChannelMap;

/** A small map used by the link tests, and a bounded wait for conditions set by other threads. */
final class TestMaps {
    private TestMaps() {}

    static final String HEADER = "signal,direction,table,unit,address,type,word_order,raw_lo,raw_hi,"
            + "eng_lo,eng_hi,eng_unit,clamp,fault_low,fault_high,stale_after_s,description";

    /** Inputs as 4-20 mA counts, a float, a scaled integer and bits; outputs as register and coils. */
    static ChannelMap small(double staleAfterS) {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap map = ChannelMap.parse("link.csv", List.of(HEADER,
                "level_dp_a,to_controller,input_register,1,0,int16,,0,27648,4,20,mA,,,," + staleAfterS + ",",
                "level_dp_b,to_controller,input_register,1,1,int16,,0,27648,4,20,mA,,,," + staleAfterS + ",",
                "drum_pressure,to_controller,input_register,1,2,float32,CDAB,,,-1,20,barg,,,," + staleAfterS + ",",
                "feed_temp,to_controller,input_register,1,4,int16,,0,2500,0,250,degC,,,," + staleAfterS + ",",
                "pump_a_running,to_controller,discrete_input,1,0,bool,,,,,,,,,," + staleAfterS + ",",
                "burner_on,to_controller,discrete_input,1,1,bool,,,,,,,,,," + staleAfterS + ",",
                "feed_valve_demand,from_controller,holding_register,1,0,uint16,,0,10000,0,100,%,yes,,,,",
                "level_indicated,from_controller,holding_register,1,1,float32,ABCD,,,-1000,1000,mm,yes,,,,",
                "pump_a_run,from_controller,coil,1,0,bool,,,,,,,,,,,",
                "fuel_cutoff,from_controller,coil,1,1,bool,,,,,,,,,,,"), problems);
        assertEquals(List.of(), problems);
        return map;
    }

    /**
     * Wait until {@code condition} holds or {@code limitS} passes; returns whether it held. Polls with
     * a short park: the link runs on its own threads and offers nothing to join on.
     */
    static boolean await(BooleanSupplier condition, double limitS) {
        long end = System.nanoTime() + (long) (limitS * 1e9);
        while (System.nanoTime() < end) {
            if (condition.getAsBoolean()) {
                return true;
            }
            java.util.concurrent.locks.LockSupport.parkNanos(2_000_000L);
        }
        return condition.getAsBoolean();
    }
}
