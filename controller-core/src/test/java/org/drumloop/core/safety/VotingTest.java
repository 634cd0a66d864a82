package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.List;
import org.drumloop.core.io.Quality;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * MooN voting truth tables, written out by hand from the definition of MooN in IEC 61511-1 (M out
 * of N channels must demand the function) and the common-practice fail-safe rule that an unusable
 * channel (BAD, or UNCERTAIN unless accepted) votes "tripped" when so configured.
 *
 * <p>Channel codes: N = normal level (0 mm, GOOD); L = below the low-low setpoint (-300 mm, GOOD);
 * B = BAD; U = UNCERTAIN at a normal level; W = UNCERTAIN below the setpoint.
 */
class VotingTest {

    private static boolean conditionFor(String voting, String channelCodes, boolean badTrips, boolean uncertainUsable) {
        List<String> lines = Fixtures.block("LALL",
                "kind trip", "variable level", "voting " + voting, "direction low", "setpoint -200 mm",
                "hysteresis 10 mm", "on_delay 0 s", "bad_counts_as_tripped " + (badTrips ? "yes" : "no"),
                "uncertain_usable " + (uncertainUsable ? "yes" : "no"), "actions fuel_cutoff");
        if (voting.equals("1oo1")) {
            lines.add("channels a");
        }
        Fixtures.Rig r = new Fixtures.Rig(lines);
        Arrays.fill(r.in.levelQuality, Quality.GOOD);
        for (int i = 0; i < channelCodes.length(); i++) {
            char c = channelCodes.charAt(i);
            r.in.levelM[i] = (c == 'L' || c == 'W') ? -0.300 : 0.0;
            r.in.levelQuality[i] = switch (c) {
                case 'B' -> Quality.BAD;
                case 'U', 'W' -> Quality.UNCERTAIN;
                default -> Quality.GOOD;
            };
        }
        r.step();
        return r.set.conditionPresent(0);
    }

    @ParameterizedTest(name = "{0} {1} bad-trips={2} uncertain-usable={3} -> {4}")
    @CsvSource({
        // voting, channels, bad_counts_as_tripped, uncertain_usable, condition present
        "1oo1, N,   yes, no,  false",
        "1oo1, L,   yes, no,  true",
        "1oo1, B,   yes, no,  true",
        "1oo1, B,   no,  no,  false",
        "1oo1, U,   yes, no,  true",
        "1oo1, U,   no,  no,  false",
        "1oo1, U,   yes, yes, false",
        "1oo1, W,   no,  yes, true",
        "1oo2, NN,  yes, no,  false",
        "1oo2, LN,  yes, no,  true",
        "1oo2, NL,  yes, no,  true",
        "1oo2, LL,  yes, no,  true",
        "1oo2, BN,  yes, no,  true",
        "1oo2, BN,  no,  no,  false",
        "1oo2, BB,  no,  no,  false",
        "1oo2, BL,  no,  no,  true",
        "2oo2, LN,  yes, no,  false",
        "2oo2, LL,  yes, no,  true",
        "2oo2, LB,  yes, no,  true",
        "2oo2, LB,  no,  no,  false",
        "2oo3, NNN, yes, no,  false",
        "2oo3, LNN, yes, no,  false",
        "2oo3, NLN, yes, no,  false",
        "2oo3, NNL, yes, no,  false",
        "2oo3, LLN, yes, no,  true",
        "2oo3, LNL, yes, no,  true",
        "2oo3, NLL, yes, no,  true",
        "2oo3, LLL, yes, no,  true",
        "2oo3, BNN, yes, no,  false",
        "2oo3, BLN, yes, no,  true",
        "2oo3, BBN, yes, no,  true",
        "2oo3, BBN, no,  no,  false",
        "2oo3, BBL, no,  no,  false",
        "2oo3, BLL, no,  no,  true",
        "2oo3, BBB, yes, no,  true",
        "2oo3, BBB, no,  no,  false",
        "2oo3, ULN, yes, no,  true",
        "2oo3, ULN, yes, yes, false",
        "2oo3, WLN, no,  yes, true",
        "2oo3, WLN, no,  no,  false",
    })
    void theVotedConditionFollowsTheTruthTable(String voting, String channels, String badTrips, String uncertainUsable,
            boolean expected) {
        assertEquals(expected, conditionFor(voting, channels, badTrips.equals("yes"), uncertainUsable.equals("yes")));
    }

    @ParameterizedTest(name = "1oo1 on the selected level: {0} -> {1}")
    @CsvSource({"GOOD, -0.3, true", "GOOD, 0.0, false", "BAD, 0.0, true", "UNCERTAIN, 0.0, true"})
    void oneOutOfOneWatchesTheSelectedLevelByDefault(Quality q, double selectedM, boolean expected) {
        Fixtures.Rig r = new Fixtures.Rig(Fixtures.block("LAL",
                "kind alarm", "variable level", "voting 1oo1", "direction low", "setpoint -75 mm",
                "hysteresis 10 mm", "on_delay 0 s", "bad_counts_as_tripped yes", "actions none"));
        Arrays.fill(r.in.levelM, 0.0);     // the transmitters themselves are normal
        r.in.levelSelectedM = selectedM;
        r.in.levelSelectedQuality = q;
        r.step();
        assertEquals(expected, r.set.conditionPresent(0));
    }

    @ParameterizedTest(name = "a non-finite GOOD value is unusable: {0}")
    @CsvSource({"NaN", "Infinity", "-Infinity"})
    void aNonFiniteValueCountsAsBad(double x) {
        Fixtures.Rig r = new Fixtures.Rig(Fixtures.block("LALL",
                "kind trip", "variable level", "voting 2oo3", "direction low", "setpoint -200 mm",
                "hysteresis 10 mm", "on_delay 0 s", "bad_counts_as_tripped yes", "actions fuel_cutoff"));
        r.level(0.0);
        r.in.levelM[0] = x;
        r.in.levelM[1] = x;
        r.step();
        assertEquals(true, r.set.conditionPresent(0));
    }
}
