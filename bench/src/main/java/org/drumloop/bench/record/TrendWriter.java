package org.drumloop.bench.record;

import java.io.IOException;
import java.io.Writer;
import java.util.List;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;

/**
 * {@code trend.csv}: header row, first column {@code t[s]}, then every {@link Channel} in its
 * engineering unit, then one {@code bool} column per interlock. Rows are formatted into a
 * preallocated buffer: no allocation per row.
 */
public final class TrendWriter {
    private final Writer out;
    private final char[] row;
    private final int interlocks;

    public TrendWriter(Writer out, List<String> interlockTags) throws IOException {
        this.out = out;
        this.interlocks = interlockTags.size();
        this.row = new char[32 * (Channel.count() + interlocks + 1)];
        StringBuilder h = new StringBuilder("t[s]");
        for (int i = 0; i < Channel.count(); i++) {
            h.append(',').append(Channel.of(i).header());
        }
        for (String t : interlockTags) {
            h.append(',').append(t).append("[bool]");
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
        for (int i = 0; i < interlocks; i++) {
            row[p++] = ',';
            row[p++] = f.interlockActive[i] ? '1' : '0';
        }
        row[p++] = '\n';
        out.write(row, 0, p);
    }
}
