// The step editor's "Insert amount": the ingredients it offers by the names the cook wrote, the ways
// an amount can read (the forms step-text.ts parses, in plain words), the text with the amount put in
// at the cursor, and what to say about an amount that names no ingredient. Stored text keeps the
// grammar of step-text.ts; the screen never shows it as such.
import { ingredientKeyWords, type StepTokenProblem } from './step-text'

/** How an inserted amount reads: "2 tbsp olive oil" or "2 tbsp". */
export const AMOUNT_FORMS = [
  { id: 'item', label: 'Amount and item', withItem: true },
  { id: 'amount', label: 'Amount only', withItem: false },
] as const
export type AmountForm = (typeof AMOUNT_FORMS)[number]['id']

/** How much of the ingredient the step uses, as the share the grammar writes ("1": all of it). */
export const AMOUNT_SHARES = [
  { share: '1', label: 'All of it' },
  { share: '3/4', label: 'Three quarters' },
  { share: '2/3', label: 'Two thirds' },
  { share: '1/2', label: 'Half' },
  { share: '1/3', label: 'A third' },
  { share: '1/4', label: 'A quarter' },
] as const

export interface AmountChoice {
  key: string
  label: string
}

/**
 * The recipe's ingredients as the picker lists them, in recipe order: by the item as written; two
 * with the same item are told apart by their prep note, else by their place ("salt (2nd)").
 * Rows with no key yet (nothing typed) are left out.
 */
export function amountChoices(ingredients: ReadonlyArray<{ key: string; item: string; prep?: string | null }>): AmountChoice[] {
  const rows = ingredients.filter((i) => i.key)
  const base = rows.map((i) => i.item.trim() || ingredientKeyWords(i.key))
  const count = (list: string[], s: string) => list.filter((x) => x.toLowerCase() === s.toLowerCase()).length
  const withPrep = base.map((b, n) => (count(base, b) > 1 && rows[n]!.prep?.trim() ? `${b}, ${rows[n]!.prep!.trim()}` : b))
  const seen = new Map<string, number>()
  return rows.map((r, n) => {
    const label = withPrep[n]!
    if (count(withPrep, label) === 1) return { key: r.key, label }
    const nth = (seen.get(label.toLowerCase()) ?? 0) + 1
    seen.set(label.toLowerCase(), nth)
    return { key: r.key, label: `${label} (${ordinal(nth)})` }
  })
}

function ordinal(n: number): string {
  const tens = n % 100
  const suffix = tens >= 11 && tens <= 13 ? 'th' : ({ 1: 'st', 2: 'nd', 3: 'rd' } as Record<number, string>)[n % 10] ?? 'th'
  return `${n}${suffix}`
}

/**
 * `text` with `insert` in place of the selection start–end (a cursor when equal), a space put between
 * it and a word it would touch; `cursor` is just after the inserted amount.
 */
export function insertAtCursor(text: string, start: number, end: number, insert: string): { text: string; cursor: number } {
  const clamp = (n: number) => Math.min(Math.max(Number.isFinite(n) ? Math.trunc(n) : text.length, 0), text.length)
  const [from, to] = [clamp(start), clamp(end)].sort((a, b) => a - b) as [number, number]
  const before = text.slice(0, from)
  const after = text.slice(to)
  const spaceBefore = before !== '' && !/[\s([{"“‘'/-]$/.test(before) ? ' ' : ''
  const spaceAfter = after !== '' && !/^[\s)\]},.;:!?"”’'/-]/.test(after) ? ' ' : ''
  const head = before + spaceBefore + insert
  return { text: head + spaceAfter + after, cursor: head.length }
}

/** What the editor says, in plain words, about an amount in a step that it cannot read. */
export function stepAmountProblemText(problem: Pick<StepTokenProblem, 'key' | 'kind'>): string {
  const words = ingredientKeyWords(problem.key)
  return problem.kind === 'missing'
    ? `This step mentions an ingredient that is not in the list: “${words}”; pick it again from Insert amount.`
    : `This step uses none of the “${words}”; pick it again from Insert amount.`
}
