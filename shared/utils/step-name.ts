// A step's short name ("Pasta water", "Dough rest"): what its timer and its cues are called instead
// of the whole step text cut off. Optional, trimmed, at most STEP_NAME_MAX characters.

export const STEP_NAME_MAX = 40

const words = (s: string) => s.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? []

/**
 * The short name an imported step keeps from a schema.org HowToStep `name`. Many sites fill `name`
 * with the step text again, its first words (often cut off mid-word with "…"), or "Step 3"; none
 * of those is a name, so they give null, as does a name too long to be short.
 */
export function importedStepName(name: string | null | undefined, text: string): string | null {
  const trimmed = name?.replace(/\s+/g, ' ').trim() ?? ''
  if (!trimmed || trimmed.length > STEP_NAME_MAX) return null
  const n = words(trimmed.replace(/(?:…|\.{3})$/, ''))
  if (!n.length || /^step\s*\d+\W*$/i.test(trimmed) || n.every((w) => /^\d+$/.test(w))) return null
  const t = words(text)
  const cut = /(?:…|\.{3})$/.test(trimmed)
  const copiesText = n.length <= t.length && n.every((w, i) => w === t[i] || (cut && i === n.length - 1 && t[i]!.startsWith(w)))
  return copiesText ? null : trimmed
}

/** A short name as typed: spaces collapsed and trimmed; empty is none (null). */
export function cleanStepName(name: string | null | undefined): string | null {
  return name?.replace(/\s+/g, ' ').trim() || null
}

/** What to fix in a short name as typed, in the editor's words ("Step 3, short name: …"), or null when it is fine. */
export function stepNameProblem(name: string | null | undefined, position: number): string | null {
  const n = cleanStepName(name)?.length ?? 0
  return n > STEP_NAME_MAX ? `Step ${position}, short name: keep it to ${STEP_NAME_MAX} characters (it has ${n}).` : null
}
