package org.drumloop.core.soe;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** Text and CSV rendering of events; CSV quoting per RFC 4180 §2 (fields with commas, quotes or line breaks are quoted, quotes doubled). */
class SoeTextTest {

    @Test
    void aLineShowsTimeScanTagKindAndMessage() {
        assertEquals("   12.300 s  #123  LALL  TRIP  trip: level 2oo3 <= -200 mm",
                SoeText.line(12.3, 123, "LALL", EventKind.TRIP, "trip: level 2oo3 <= -200 mm"));
    }

    @Test
    void csvQuotesOnlyWhatNeedsIt() {
        assertEquals("1.500,15,LAH,BYPASS,bypass: check",
                SoeText.csv(1.5, 15, "LAH", EventKind.BYPASS, "bypass: check"));
        assertEquals("1.500,15,LAH,BYPASS,\"bypass: transmitter B, \"\"cal\"\"\"",
                SoeText.csv(1.5, 15, "LAH", EventKind.BYPASS, "bypass: transmitter B, \"cal\""));
    }
}
