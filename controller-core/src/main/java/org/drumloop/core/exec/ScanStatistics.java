package org.drumloop.core.exec;

/**
 * Timing statistics of a scan executive: scans run, overruns (scans whose work ended after the
 * next scan's deadline), skipped scan slots, body failures, and histograms of execution time
 * (read + body + write) and start jitter (actual start minus deadline). Filled on the scan thread;
 * read it between scans or from the scan listener.
 */
public final class ScanStatistics {
    private final LatencyHistogram execNs = new LatencyHistogram();
    private final LatencyHistogram jitterNs = new LatencyHistogram();
    private long scans;
    private long overruns;
    private long skippedSlots;
    private long failures;
    private int consecutiveOverruns;
    private int maxConsecutiveOverruns;

    /** Record one scan. Allocates nothing. */
    void record(long execNanos, long jitterNanos, boolean overrun, boolean failed) {
        scans++;
        execNs.record(execNanos);
        jitterNs.record(jitterNanos);
        if (overrun) {
            overruns++;
            consecutiveOverruns++;
            if (consecutiveOverruns > maxConsecutiveOverruns) {
                maxConsecutiveOverruns = consecutiveOverruns;
            }
        } else {
            consecutiveOverruns = 0;
        }
        if (failed) {
            failures++;
        }
    }

    void skipped(long slots) { skippedSlots += slots; }

    public long scans() { return scans; }

    public long overruns() { return overruns; }

    /** Scan slots left out because an overrun ran past them (the schedule keeps its phase). */
    public long skippedSlots() { return skippedSlots; }

    /** Scans whose body threw. */
    public long failures() { return failures; }

    public int maxConsecutiveOverruns() { return maxConsecutiveOverruns; }

    /** Execution-time histogram [ns]. */
    public LatencyHistogram execution() { return execNs; }

    /** Start-jitter histogram [ns]. */
    public LatencyHistogram jitter() { return jitterNs; }

    public double execP50S() { return execNs.percentile(50) * 1e-9; }

    public double execP99S() { return execNs.percentile(99) * 1e-9; }

    public double execMaxS() { return execNs.max() * 1e-9; }

    public double jitterP50S() { return jitterNs.percentile(50) * 1e-9; }

    public double jitterP99S() { return jitterNs.percentile(99) * 1e-9; }

    public double jitterMaxS() { return jitterNs.max() * 1e-9; }

    /** One line for logs and reports (allocates; not for the scan). */
    public String summary() {
        return String.format(java.util.Locale.ROOT,
                "scans %d, overruns %d (max %d in a row), skipped slots %d, failures %d; "
                        + "execution p50 %.1f us, p99 %.1f us, max %.1f us; start jitter p50 %.1f us, p99 %.1f us, max %.1f us",
                scans, overruns, maxConsecutiveOverruns, skippedSlots, failures,
                execP50S() * 1e6, execP99S() * 1e6, execMaxS() * 1e6,
                jitterP50S() * 1e6, jitterP99S() * 1e6, jitterMaxS() * 1e6);
    }

    public void reset() {
        execNs.reset();
        jitterNs.reset();
        scans = 0;
        overruns = 0;
        skippedSlots = 0;
        failures = 0;
        consecutiveOverruns = 0;
        maxConsecutiveOverruns = 0;
    }
}
