/**
 * How far a time the app wrote may lie outside the test's own readings of the wall clock around it. Date.now() is
 * not monotonic: a machine's time service may step it, and CI once saw a time written 8 ms before the test read
 * the clock ahead of it. A bound this loose still fails a time that was never set (a day or a year out).
 */
export const CLOCK_SLACK_MS = 5_000;
