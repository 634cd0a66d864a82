/**
 * Drum-level alarms and trips of the firmware: LAL, LAH, LALL, LAHH (ISA-5.1 letters), low feed
 * temperature (TAL) and transmitter deviation (LDAH), read from a {@code .interlocks} file
 * ({@link org.drumloop.core.safety.InterlockFile}) and evaluated once per scan
 * ({@link org.drumloop.core.safety.InterlockSet}).
 *
 * <p>Per interlock: each channel compared with its setpoint with hysteresis; MooN voting in which
 * an unusable channel votes tripped unless configured otherwise; an on-delay exact to one scan;
 * trips that latch until the condition has cleared and a reset is applied; acknowledgement;
 * first-out; bypass only with a reason and for a limited time; every change written to the
 * sequence-of-events log in the scan it happens. Actions (fuel cut-off, feed pumps stop, feed valve
 * close) are named outputs that the firmware applies. The cause-and-effect matrix is printed from
 * the same data ({@link org.drumloop.core.safety.InterlockConfig#causeEffectText()}).
 *
 * <p>This is a test bench, not a safety system: it shows how such logic behaves and lets a
 * controller under test be checked against it. Interlock settings on a real boiler come from the
 * boiler maker, the classification rules and the local codes, and a real boiler keeps its own
 * independent protection.
 */
package org.drumloop.core.safety;
