// npm run bench — run every benchmark, print a table of figures, baselines and ratios, and exit
// non-zero if any figure is over its bound. `npm run bench -- NAME` runs those whose name contains NAME
// or whose group is NAME (database, plan, shoot, screens).
import { benchmarks } from './index'
import type { BenchResult } from './types'

const filter = process.argv[2]
const inGroup = benchmarks.filter((b) => b.group === filter)
const selected = inGroup.length ? inGroup : benchmarks.filter((b) => !filter || b.name.includes(filter))
const rows: { name: string; result?: BenchResult; error?: string; pass: boolean }[] = []

for (const bench of selected) {
  try {
    const result = await bench.run()
    const ratio = result.baseline ? result.figure / result.baseline : undefined
    const pass = (result.bound === undefined || result.figure <= result.bound)
      && (result.minimum === undefined || result.figure >= result.minimum)
      && (result.ratioBound === undefined || ratio === undefined || ratio <= result.ratioBound)
    rows.push({ name: bench.name, result, pass })
  } catch (error) {
    rows.push({ name: bench.name, error: (error as Error).message, pass: false })
  }
}

const fmt = (n: number | undefined, unit = '') => (n === undefined ? '—' : `${n < 10 ? n.toFixed(3) : n.toFixed(1)}${unit ? ` ${unit}` : ''}`)
const table = rows.map(({ name, result, error, pass }) => ({
  benchmark: name,
  figure: result ? fmt(result.figure, result.unit) : `error: ${error}`,
  baseline: result ? fmt(result.baseline, result.unit) : '—',
  ratio: result?.baseline ? `${(result.figure / result.baseline).toFixed(2)}×` : '—',
  bound: result ? [result.bound !== undefined ? `≤ ${result.bound} ${result.unit}` : '', result.minimum !== undefined ? `≥ ${result.minimum} ${result.unit}` : '', result.ratioBound !== undefined ? `≤ ${result.ratioBound}×` : ''].filter(Boolean).join(', ') || '—' : '—',
  result: pass ? 'pass' : 'FAIL',
  note: result?.note ?? '',
}))
if (table.length) console.table(table)
else console.log('No benchmarks selected.')
const failed = rows.filter((r) => !r.pass)
console.log(`${rows.length - failed.length} passed, ${failed.length} failed`)
process.exit(failed.length ? 1 : 0)
