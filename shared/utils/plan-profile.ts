// Usage of one resource (a cook's hands, the burners, the oven places, the counters) over time, for the
// serial schedule-generation scheme: where a step fits, and what it then holds.

/** Usage of one resource over time: segment k is [t[k], t[k+1]) at level u[k]; the last runs on. */
export class PlanProfile {
  t: number[] = [0]
  u: number[] = [0]
  constructor(readonly cap: number) {}

  private find(x: number): number {
    let lo = 0
    let hi = this.t.length - 1
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1
      if (this.t[mid]! <= x) lo = mid
      else hi = mid - 1
    }
    return lo
  }

  /** Earliest y ≥ x with a free unit throughout [y, y + d). */
  fit(x: number, d: number): number {
    const { t, u, cap } = this
    let y = x
    let k = this.find(x)
    scan: for (;;) {
      const end = y + d
      for (let j = k; j < t.length && t[j]! < end; j++) {
        if (u[j]! >= cap) {
          y = t[j + 1]!
          k = j + 1
          continue scan
        }
      }
      return y
    }
  }

  private split(x: number): number {
    const k = this.find(x)
    if (this.t[k] === x) return k
    this.t.splice(k + 1, 0, x)
    this.u.splice(k + 1, 0, this.u[k]!)
    return k + 1
  }

  /** Adds q units over [s, e), then merges equal neighbours so a busy stretch stays one segment. */
  add(s: number, e: number, q: number) {
    const a = this.split(s)
    const b = this.split(e)
    const { t, u } = this
    for (let k = a; k < b; k++) u[k]! += q
    if (u[b] === u[b - 1]) {
      t.splice(b, 1)
      u.splice(b, 1)
    }
    if (a > 0 && u[a] === u[a - 1]) {
      t.splice(a, 1)
      u.splice(a, 1)
    }
  }
}
