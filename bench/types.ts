// A benchmark measures a figure and, where it has one, a baseline in the same run; it passes when the
// figure stays within its bound and its ratio to the baseline within the ratio bound.
export interface BenchResult {
  figure: number
  unit: string
  baseline?: number
  /** Largest acceptable figure (same unit). */
  bound?: number
  /** Smallest acceptable figure, for figures where more is better (throughput). */
  minimum?: number
  /** Largest acceptable figure ÷ baseline. */
  ratioBound?: number
  note?: string
}

export interface Benchmark {
  name: string
  /** The file it comes from (`npm run bench -- screens`). */
  group?: string
  run: () => Promise<BenchResult>
}

export function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b)
  const index = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))
  return sorted[index] ?? NaN
}
