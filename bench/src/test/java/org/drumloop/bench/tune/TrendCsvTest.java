package org.drumloop.bench.tune;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringWriter;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.drumloop.core.config.ConfigException;
import org.junit.jupiter.api.Test;

/** The trend reader: units from the header, column mapping, and every kind of bad data located by line and column. */
class TrendCsvTest {
    private static final Set<TrendSignal> LEVEL = EnumSet.of(TrendSignal.TIME, TrendSignal.DRUM_LEVEL);

    private static List<String> rows(String header, String... rows) {
        List<String> l = new java.util.ArrayList<>();
        l.add(header);
        l.addAll(List.of(rows));
        return l;
    }

    private static String[] series(int n, String fmt) {
        String[] r = new String[n];
        for (int i = 0; i < n; i++) {
            r[i] = String.format(java.util.Locale.ROOT, fmt, i * 0.5, i * 1.0);
        }
        return r;
    }

    @Test
    void unitsInTheHeaderAreConvertedToSi() throws ConfigException {
        // 1 t/h = 1000/3600 kg/s, barg adds 101 325 Pa, mm = 1e-3 m (definitions; EngUnit)
        Trend t = TrendCsv.parse("x.csv", rows("t[s],drum_level[mm],steam_flow[t/h],drum_pressure[barg]",
                series(12, "%.1f,%.1f,36,8")), Map.of(), EnumSet.of(TrendSignal.TIME, TrendSignal.DRUM_LEVEL,
                TrendSignal.STEAM_FLOW, TrendSignal.DRUM_PRESSURE), Set.of());
        assertEquals(0.003, t.get(TrendSignal.DRUM_LEVEL)[3], 1e-15);
        assertEquals(10.0, t.get(TrendSignal.STEAM_FLOW)[0], 1e-12);
        assertEquals(901_325, t.get(TrendSignal.DRUM_PRESSURE)[0], 1e-6);
        assertEquals(5.5, t.durationS(), 1e-12);
    }

    @Test
    void aHistorianExportIsReadThroughTheColumnMapWithDateTimes() throws ConfigException {
        String[] r = new String[12];
        for (int i = 0; i < 12; i++) {
            r[i] = String.format(java.util.Locale.ROOT, "2031-05-04 10:00:%02d.500;%d", i * 2, i);
        }
        Trend t = TrendCsv.parse("hist.csv", rows("Timestamp;LT101.PV[mm]", r),
                TrendCsv.columnMap(List.of("t=Timestamp", "drum_level=LT101.PV")), LEVEL, Set.of());
        assertEquals(22.0, t.tS()[11], 1e-9);
        assertEquals(0.011, t.get(TrendSignal.DRUM_LEVEL)[11], 1e-15);
    }

    @Test
    void aMissingColumnIsNamedWithTheHeaderLine() {
        ConfigException e = assertThrows(ConfigException.class, () -> TrendCsv.parse("x.csv",
                rows("# comment", "t[s],level[mm]"), Map.of(), LEVEL, Set.of()));
        assertEquals(2, e.line());
        assertEquals("drum_level", e.key());
        assertTrue(e.getMessage().startsWith("x.csv:2: drum_level: no such column"), e.getMessage());
    }

    @Test
    void aHeaderWithoutUnitIsRefused() {
        ConfigException e = assertThrows(ConfigException.class, () -> TrendCsv.parse("x.csv",
                rows("t[s],drum_level", series(12, "%.1f,%.1f")), Map.of(), LEVEL, Set.of()));
        assertTrue(e.getMessage().contains("x.csv:1: drum_level: the header carries no unit"), e.getMessage());
    }

    @Test
    void aUnitOfTheWrongQuantityAndABareBarAreRefused() {
        ConfigException e = assertThrows(ConfigException.class, () -> TrendCsv.parse("x.csv",
                rows("t[s],drum_level[t/h]", series(12, "%.1f,%.1f")), Map.of(), LEVEL, Set.of()));
        assertTrue(e.getMessage().contains("drum_level[t/h]: unit 't/h' does not measure drum_level"), e.getMessage());
        e = assertThrows(ConfigException.class, () -> TrendCsv.parse("x.csv", rows("t[s],drum_pressure[bar]",
                series(12, "%.1f,%.1f")), Map.of(), EnumSet.of(TrendSignal.TIME, TrendSignal.DRUM_PRESSURE), Set.of()));
        assertTrue(e.getMessage().contains("bara or barg"), e.getMessage());
    }

    @Test
    void timeThatGoesBackIsNamedByLineAndColumn() {
        String[] r = series(12, "%.1f,%.1f");
        r[7] = "2.0,7";
        ConfigException e = assertThrows(ConfigException.class, () -> TrendCsv.parse("x.csv",
                rows("t[s],drum_level[mm]", r), Map.of(), LEVEL, Set.of()));
        assertEquals(9, e.line());
        assertEquals("t[s]", e.key());
        assertTrue(e.getMessage().contains("time does not increase"), e.getMessage());
    }

    @Test
    void aGapInTheRecordIsNamedByLineAndColumn() {
        String[] r = series(20, "%.1f,%.1f");
        r[10] = "30.0,10";
        for (int i = 11; i < 20; i++) {
            r[i] = String.format(java.util.Locale.ROOT, "%.1f,%d", 30.0 + (i - 10) * 0.5, i);
        }
        ConfigException e = assertThrows(ConfigException.class, () -> TrendCsv.parse("x.csv",
                rows("t[s],drum_level[mm]", r), Map.of(), LEVEL, Set.of()));
        assertEquals(12, e.line());
        assertTrue(e.getMessage().contains("gap in the record: 25.5 s"), e.getMessage());
    }

    @Test
    void aCellThatIsNotANumberAndAShortRowAreNamed() {
        String[] r = series(12, "%.1f,%.1f");
        r[4] = "2.0,n/a";
        r[6] = "3.0";
        ConfigException e = assertThrows(ConfigException.class, () -> TrendCsv.parse("x.csv",
                rows("t[s],drum_level[mm]", r), Map.of(), LEVEL, Set.of()));
        assertTrue(e.getMessage().contains("x.csv:6: drum_level[mm]: 'n/a' is not a number"), e.getMessage());
        assertTrue(e.getMessage().contains("x.csv:8: drum_level[mm]: no value"), e.getMessage());
    }

    @Test
    void aWrittenTrendReadsBackToTheSameValues() throws Exception {
        double[] t = {0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0};
        Map<TrendSignal, double[]> v = new EnumMap<>(TrendSignal.class);
        double[] level = new double[t.length];
        double[] p = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            level[i] = 0.001 * i - 0.0042;
            p[i] = 9e5 + 17 * i;
        }
        v.put(TrendSignal.DRUM_LEVEL, level);
        v.put(TrendSignal.DRUM_PRESSURE, p);
        StringWriter w = new StringWriter();
        TrendCsv.write(Trend.of("mem", t, v), w);
        Trend back = TrendCsv.parse("mem", w.toString().lines().toList(), Map.of(),
                EnumSet.of(TrendSignal.TIME, TrendSignal.DRUM_LEVEL, TrendSignal.DRUM_PRESSURE), Set.of());
        for (int i = 0; i < t.length; i++) {
            assertEquals(level[i], back.get(TrendSignal.DRUM_LEVEL)[i], 1e-9);
            assertEquals(p[i], back.get(TrendSignal.DRUM_PRESSURE)[i], 1e-2);
        }
    }

    @Test
    void aBadColumnOptionIsRefused() {
        assertThrows(ConfigException.class, () -> TrendCsv.columnMap(List.of("level")));
        assertThrows(ConfigException.class, () -> TrendCsv.columnMap(List.of("nonsense=X")));
    }
}
