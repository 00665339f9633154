// A show's rendered script cut into the lines the prompter reads one at a time: a line ends after a
// sentence's closing mark (. ! ? …, and a closing quote or bracket after it) followed by a space. A
// live field is never cut, so "£1.50" stays whole and keeps its mark (an amount, a missing figure).
import type { RenderedPart, RenderedScript } from './live-fields'

export type ScriptLine = RenderedPart[]

const SENTENCE_END = /(?<=[.!?…]["'”’)\]]?)\s+/u

export function scriptLines(script: Pick<RenderedScript, 'parts'>): ScriptLine[] {
  const lines: ScriptLine[] = []
  let line: ScriptLine = []
  for (const part of script.parts) {
    if (part.field) {
      line.push(part)
      continue
    }
    const pieces = part.text.split(SENTENCE_END)
    pieces.forEach((text, i) => {
      if (i > 0) {
        if (line.length) lines.push(line)
        line = []
      }
      if (text) line.push({ text })
    })
  }
  if (line.length) lines.push(line)
  return lines.filter((l) => l.some((p) => p.text.trim()))
}

/** The words of a line, as the reading pace counts them. */
export function lineText(line: ScriptLine): string {
  return line.map((p) => p.text).join('')
}
