// Telling linear from quadratic time on a shared machine: time the same work at size n and 2n,
// several times each, interleaved, and compare the fastest runs. Doubling the input doubles a
// linear computation's time and quadruples a quadratic one's (Cormen et al., Introduction to
// Algorithms, 3rd ed., §3.1), so a ratio under 3 separates them with room for noise, whatever the
// machine's absolute speed. The time is this process's CPU time (process.cpuUsage: user + system),
// not the wall clock, so waiting for a core that other work holds does not count.

const cpuMs = () => {
  const { user, system } = process.cpuUsage()
  return (user + system) / 1000
}

/** The fastest of `rounds` timings of `reps` calls of `run(make(size))` for n and 2n; their ratio. */
export function doublingRatio<T>(make: (size: number) => T, run: (input: T) => unknown, n: number, { reps = 1, rounds = 7 } = {}) {
  const inputs = [make(n), make(2 * n)]
  const best = [Infinity, Infinity]
  run(inputs[0]!) // warm the code up before timing it
  run(inputs[1]!)
  for (let round = 0; round < rounds; round++) {
    for (const i of [0, 1]) {
      const start = cpuMs()
      for (let r = 0; r < reps; r++) run(inputs[i]!)
      best[i] = Math.min(best[i]!, cpuMs() - start)
    }
  }
  return { n: best[0]!, twice: best[1]!, ratio: best[1]! / Math.max(best[0]!, 1e-3) }
}
