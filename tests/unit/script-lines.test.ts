// The prompter's lines of a show script: sentences, fields kept whole.
import { describe, expect, it } from 'vitest'
import { lineText, scriptLines } from '../../shared/utils/script-lines'

describe('scriptLines', () => {
  it('cuts at the end of each sentence and keeps a live field inside its sentence', () => {
    const lines = scriptLines({ parts: [
      { text: 'Welcome. Tonight: three dinners for ' },
      { text: '4', field: { kind: 'servings' } },
      { text: ', each under £1.50 a serving! Ready? Let’s cook.' },
    ] })
    expect(lines.map(lineText)).toEqual(['Welcome.', 'Tonight: three dinners for 4, each under £1.50 a serving!', 'Ready?', 'Let’s cook.'])
    expect(lines[1]!.find((p) => p.field)?.text).toBe('4')
  })

  it('does not cut inside a figure or after a field that ends in a full stop', () => {
    const lines = scriptLines({ parts: [{ text: 'It costs ' }, { text: '£0.92', field: { kind: 'cost', recipeId: 1, withOptional: false } }, { text: ' a serving.' }] })
    expect(lines.map(lineText)).toEqual(['It costs £0.92 a serving.'])
  })

  it('cuts after a closing quote and drops empty lines', () => {
    expect(scriptLines({ parts: [{ text: 'She said “go.” Then we went.   ' }] }).map(lineText)).toEqual(['She said “go.”', 'Then we went.'])
    expect(scriptLines({ parts: [] })).toEqual([])
  })
})
