// The server clock of a shoot: it reads like the wall clock (ms since 1970, so deadlines, logs and
// screens' clock sync keep their meaning) but it advances only with the monotonic clock. A step of
// the wall clock (an NTP correction, a clock set by hand) then neither rings a kitchen timer a
// minute early nor holds it a minute late: a 10-minute timer rings after 10 real minutes.
// The W3C High Resolution Time spec builds its timestamps the same way: a time origin read once
// from the wall clock, plus a monotonic clock (https://www.w3.org/TR/hr-time-3/#sec-monotonic-clock).
// The price: a step of the wall clock is not followed until the process starts again (then the
// new anchor is the corrected wall time). Plain TypeScript; the server passes the real clocks.

/**
 * A clock anchored on `wall()` at the moment it is made, moving on by `monotonic()` alone; whole
 * ms (rounded down), never backwards.
 */
export function steadyClock(wall: () => number, monotonic: () => number): () => number {
  const wallAtStart = wall()
  const monotonicAtStart = monotonic()
  return () => Math.floor(wallAtStart + (monotonic() - monotonicAtStart))
}
