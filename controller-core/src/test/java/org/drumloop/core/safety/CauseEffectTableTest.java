package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.soe.SoeLog;
import org.junit.jupiter.api.Test;

/**
 * The cause-and-effect matrix printed from the interlocks file: one row per cause, an X under each
 * effect it drives (the usual layout of a safety cause-and-effect chart, common practice).
 */
class CauseEffectTableTest {
    private static final Path DEFAULT_FILE = Path.of("..", "config", "tuning", "default.interlocks");

    @Test
    void everyInterlockHasARowWithItsEffectsMarked() throws ConfigException {
        InterlockSet set = new InterlockSet(InterlockFile.load(DEFAULT_FILE), new SoeLog(16));
        List<String[]> rows = set.causeEffectTable();
        assertArrayEquals(InterlockConfig.CAUSE_EFFECT_HEADER, rows.get(0));
        assertEquals(1 + set.size(), rows.size());
        String[] lall = rows.get(1 + set.indexOf("LALL"));
        assertEquals("LALL", lall[0]);
        assertEquals("trip", lall[1]);
        assertEquals("level [a b c] <= -200 mm (hyst 10 mm)", lall[2]);
        assertEquals("2oo3", lall[3]);
        assertEquals("2 s", lall[4]);
        assertEquals("X", lall[6]);
        assertEquals("", lall[7]);
        assertEquals("", lall[8]);
        assertEquals("yes", lall[9]);
        assertEquals("not allowed", lall[10]);
        String[] lahh = rows.get(1 + set.indexOf("LAHH"));
        assertEquals("", lahh[6]);
        assertEquals("X", lahh[7]);
        String[] lal = rows.get(1 + set.indexOf("LAL"));
        assertEquals("alarm", lal[1]);
        assertEquals("no", lal[9]);
    }

    @Test
    void theTextTableHasAlignedColumns() throws ConfigException {
        String text = InterlockFile.load(DEFAULT_FILE).causeEffectText();
        String[] lines = text.split("\n");
        assertEquals(2 + 6, lines.length);                    // heading, rule, six interlocks
        assertTrue(lines[0].startsWith("tag "), lines[0]);
        assertTrue(lines[1].startsWith("----"), lines[1]);
        int bar = lines[0].indexOf('|');
        for (String l : lines) {
            assertEquals(bar, l.indexOf('|'), "first column separator aligned: " + l);
        }
    }
}
