package org.drumloop.bench.record;

import java.io.IOException;
import java.io.Writer;
import java.util.List;
import java.util.Locale;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;
import org.drumloop.core.io.Quality;

/**
 * {@code trend.csv}: header row, first column {@code t[s]}, then every {@link Channel} in its
 * engineering unit, then the quality of each level transmitter ({@code good}, {@code uncertain},
 * {@code bad}), one {@code bool} column per interlock (active), the first-out trip's tag (empty when
 * none), one {@code bool} column per interlock (bypassed), then the columns of any
 * {@link Columns} given (e.g. a Modbus link's state). Rows are formatted into a preallocated buffer:
 * no allocation per row.
 */
public final class TrendWriter {
    /** Further columns a kind of run adds to the trend (written after the standard ones). */
    public interface Columns {
        /** Column headings, with the unit in brackets where there is one. */
        List<String> headers();

        /** Most characters {@link #append} writes for one row (all columns, commas included). */
        int maxChars();

        /** Write this row's cells, each preceded by a comma, into {@code row} from {@code p}; return the new end. */
        int append(char[] row, int p, Frame f);
    }

    private static final char[][] QUALITY = new char[Quality.values().length][];

    static {
        for (Quality q : Quality.values()) {
            QUALITY[q.ordinal()] = q.name().toLowerCase(Locale.ROOT).toCharArray();
        }
    }

    private final Writer out;
    private final char[] row;
    private final int interlocks;
    private final char[][] tags;
    private final Columns[] extra;

    public TrendWriter(Writer out, List<String> interlockTags, Columns... extra) throws IOException {
        this.out = out;
        this.interlocks = interlockTags.size();
        this.extra = extra.clone();
        this.tags = new char[interlocks][];
        int tagChars = 0;
        for (int i = 0; i < interlocks; i++) {
            tags[i] = interlockTags.get(i).toCharArray();
            tagChars = Math.max(tagChars, tags[i].length);
        }
        int extraChars = 0;
        for (Columns c : extra) {
            extraChars += c.maxChars();
        }
        this.row = new char[32 * (Channel.count() + 1) + 12 * Channel.LEVEL_TX.length + 4 * interlocks + tagChars + 2
                + extraChars];
        StringBuilder h = new StringBuilder("t[s]");
        for (int i = 0; i < Channel.count(); i++) {
            h.append(',').append(Channel.of(i).header());
        }
        for (Channel c : Channel.LEVEL_TX) {
            h.append(',').append(c.tag()).append("_quality");
        }
        for (String t : interlockTags) {
            h.append(',').append(t).append("[bool]");
        }
        h.append(",first_out");
        for (String t : interlockTags) {
            h.append(',').append(t).append("_bypassed[bool]");
        }
        for (Columns c : extra) {
            for (String s : c.headers()) {
                h.append(',').append(s);
            }
        }
        h.append('\n');
        out.write(h.toString());
    }

    public void write(Frame f) throws IOException {
        int p = FixedFormat.append(row, 0, f.tS, 2);
        for (int i = 0; i < Channel.count(); i++) {
            Channel c = Channel.of(i);
            row[p++] = ',';
            p = FixedFormat.append(row, p, c.unit().fromSi(f.value[i]), c.decimals());
        }
        for (int i = 0; i < Channel.LEVEL_TX.length; i++) {
            row[p++] = ',';
            p = put(QUALITY[f.levelTxQuality[i].ordinal()], p);
        }
        for (int i = 0; i < interlocks; i++) {
            row[p++] = ',';
            row[p++] = f.interlockActive[i] ? '1' : '0';
        }
        row[p++] = ',';
        if (f.firstOut >= 0 && f.firstOut < interlocks) {
            p = put(tags[f.firstOut], p);
        }
        for (int i = 0; i < interlocks; i++) {
            row[p++] = ',';
            row[p++] = f.interlockBypassed[i] ? '1' : '0';
        }
        for (Columns c : extra) {
            p = c.append(row, p, f);
        }
        row[p++] = '\n';
        out.write(row, 0, p);
    }

    private int put(char[] s, int p) {
        System.arraycopy(s, 0, row, p, s.length);
        return p + s.length;
    }
}
