/**
 * Sequence-of-events log: a preallocated ring ({@link org.drumloop.core.soe.SoeLog}) that the scan
 * writes without allocating (alarm, clear, trip, reset, acknowledgement, bypass, mode change,
 * fault), each with its scan time and scan number, and that the caller drains after every scan
 * ({@link org.drumloop.core.soe.SoeSink}), before the next one begins. Text and CSV rendering for
 * the drain side: {@link org.drumloop.core.soe.SoeText}.
 */
package org.drumloop.core.soe;
