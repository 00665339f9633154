// Clock sync between a screen and the server, NTP style (RFC 5905, "Network Time Protocol
// Version 4"). A screen sends a ping at T1 on its own clock; the server stamps T2 when the ping
// arrives and T3 when it answers, on the server clock; the screen stamps T4 when the answer lands.
// From those four timestamps come the offset of the server clock from the screen's clock and the
// round-trip delay (RFC 5905 §8). The sample with the smallest delay is the most trustworthy,
// because its offset error is bounded by half its delay (RFC 5905 §10, the clock filter).
// Every countdown is then drawn as deadline − (local now + offset): nothing ticks, nothing drifts.

export interface ClockSample {
  /** θ: add it to the local clock to get the server clock, in ms. */
  offset: number
  /** δ: round-trip time spent on the network (server time excluded), in ms. */
  delay: number
}

/**
 * One NTP sample from the four timestamps of a ping (RFC 5905 §8, on-wire protocol):
 * offset θ = ½·[(T2 − T1) + (T3 − T4)], delay δ = (T4 − T1) − (T3 − T2).
 * t1, t4 on the local clock; t2, t3 on the server clock; all in ms.
 */
export function ntpSample(t1: number, t2: number, t3: number, t4: number): ClockSample {
  for (const [name, value] of [['t1', t1], ['t2', t2], ['t3', t3], ['t4', t4]] as const) {
    if (!Number.isFinite(value)) throw new RangeError(`${name} must be a finite time in ms (got ${value})`)
  }
  if (t4 < t1) throw new RangeError(`t4 (${t4}) is before t1 (${t1}): the answer cannot arrive before the ping left`)
  if (t3 < t2) throw new RangeError(`t3 (${t3}) is before t2 (${t2}): the server cannot answer before the ping arrived`)
  return { offset: ((t2 - t1) + (t3 - t4)) / 2, delay: (t4 - t1) - (t3 - t2) }
}

/** Whether a sample can be trusted at all: finite numbers and a delay that is not negative. */
export function clockSampleUsable(sample: ClockSample): boolean {
  return Number.isFinite(sample.offset) && Number.isFinite(sample.delay) && sample.delay >= 0
}

/**
 * The clock filter of RFC 5905 §10, reduced to its core: keep the last `size` samples (the RFC
 * keeps 8) and trust the one with the smallest delay. Returns a new array, newest last; a sample
 * that is not usable (negative or non-finite delay) is left out.
 */
export function clockFilterAdd(samples: readonly ClockSample[], sample: ClockSample, size = 8): ClockSample[] {
  if (!Number.isInteger(size) || size < 1) throw new RangeError(`the clock filter keeps at least 1 sample (size ${size})`)
  const kept = clockSampleUsable(sample) ? [...samples, sample] : [...samples]
  return kept.slice(Math.max(0, kept.length - size))
}

/** The lowest-delay sample of a window; on a tie the newest wins. Null for an empty window. */
export function clockFilterBest(samples: readonly ClockSample[]): ClockSample | null {
  let best: ClockSample | null = null
  for (const s of samples) if (clockSampleUsable(s) && (best === null || s.delay <= best.delay)) best = s
  return best
}

/** The server clock now, read from the local clock and the offset. */
export function serverNow(localNowMs: number, offset: number): number {
  return localNowMs + offset
}

/** Time left until a deadline on the server clock, in ms; negative once it has passed. */
export function countdownMs(deadlineServerMs: number, localNowMs: number, offset: number): number {
  return deadlineServerMs - serverNow(localNowMs, offset)
}
