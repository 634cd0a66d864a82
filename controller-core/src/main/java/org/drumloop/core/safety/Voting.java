package org.drumloop.core.safety;

/**
 * M-out-of-N voting (IEC 61511 notation, common practice): the function acts when at least M of
 * its N channels are in the tripped state. A channel whose input is unusable (BAD, or UNCERTAIN
 * unless configured usable) votes "tripped" when the interlock says bad counts as tripped, and
 * "healthy" otherwise.
 */
public enum Voting {
    ONE_OO_ONE("1oo1", 1, 1),
    ONE_OO_TWO("1oo2", 1, 2),
    TWO_OO_TWO("2oo2", 2, 2),
    TWO_OO_THREE("2oo3", 2, 3);

    private final String text;
    private final int m;
    private final int n;

    Voting(String text, int m, int n) {
        this.text = text;
        this.m = m;
        this.n = n;
    }

    /** Spelling in files and tables, e.g. "2oo3". */
    public String text() { return text; }

    /** Channels that must be tripped. */
    public int required() { return m; }

    /** Channels voted over. */
    public int channels() { return n; }

    /** Is the vote met with {@code tripped} channels tripped? */
    public boolean met(int tripped) { return tripped >= m; }

    /** Look a spelling up, or null. */
    public static Voting byText(String s) {
        for (Voting v : values()) {
            if (v.text.equals(s)) {
                return v;
            }
        }
        return null;
    }
}
