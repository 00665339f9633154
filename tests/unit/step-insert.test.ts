// The step editor's "Insert amount" and its preview (shared/utils/step-insert.ts, writeStepToken in
// step-text.ts, stepPreview in step-render.ts). Conversions by NIST Handbook 44 Appendix C
// (1 US tbsp = 14.78676478125 mL); kitchen rounding as in scale.ts (common practice: 5 mL steps under 100 mL).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { studioKitchenDisplay } from '../../shared/utils/scale'
import { AMOUNT_FORMS, AMOUNT_SHARES, amountChoices, insertAtCursor, stepAmountProblemText } from '../../shared/utils/step-insert'
import { renderStepText, stepPreview } from '../../shared/utils/step-render'
import { findStepTokens, stepTokenProblems, writeStepToken } from '../../shared/utils/step-text'

const ingredients = [
  { key: 'olive-oil', min: 2, max: 2, unit: 'tbsp' as const, item: 'olive oil', toTaste: false },
  { key: 'flour', min: 200, max: 200, unit: 'g' as const, item: 'plain flour', toTaste: false },
  { key: 'salt', min: null, max: null, unit: null, item: 'salt', toTaste: true },
]

describe('writeStepToken', () => {
  it('writes each form the grammar reads, and reads back as written', () => {
    expect(writeStepToken('olive-oil')).toBe('{{olive-oil}}')
    expect(writeStepToken('olive-oil', { withItem: true })).toBe('{{olive-oil|item}}')
    expect(writeStepToken('olive-oil', { share: '1/2' })).toBe('{{olive-oil*1/2}}')
    expect(writeStepToken('sea_salt', { withItem: true, share: '2/3' })).toBe('{{sea_salt*2/3|item}}')
    const [t] = findStepTokens(writeStepToken('flour', { withItem: true, share: '3/4' }))
    expect(t).toMatchObject({ key: 'flour', factor: 0.75, withItem: true })
  })
  it('refuses a key the grammar cannot read and a share of none', () => {
    expect(() => writeStepToken('two words')).toThrow(/letters, digits/)
    expect(() => writeStepToken('')).toThrow(RangeError)
    expect(() => writeStepToken('flour', { share: '0' })).toThrow(/above zero/)
    expect(() => writeStepToken('flour', { share: '1/0' })).toThrow(/above zero/)
    expect(() => writeStepToken('flour', { share: 'half' })).toThrow(/above zero/)
  })
  it('every choice the picker offers writes a token that reads back with its share', () => {
    for (const f of AMOUNT_FORMS) {
      for (const s of AMOUNT_SHARES) {
        const [n, d = '1'] = s.share.split('/')
        const [t] = findStepTokens(writeStepToken('olive-oil', { withItem: f.withItem, share: s.share }))
        expect(t!.factor).toBeCloseTo(Number(n) / Number(d), 12)
        expect(t!.withItem).toBe(f.withItem)
      }
    }
  })
})

describe('insertAtCursor', () => {
  it('puts the amount at the cursor and the cursor just after it', () => {
    expect(insertAtCursor('Warm  in a pan.', 5, 5, '{{olive-oil|item}}')).toEqual({ text: 'Warm {{olive-oil|item}} in a pan.', cursor: 23 })
  })
  it('puts a space between the amount and a word it would touch, none before punctuation', () => {
    expect(insertAtCursor('Warm', 4, 4, '{{oil}}')).toEqual({ text: 'Warm {{oil}}', cursor: 12 })
    expect(insertAtCursor('Warmin a pan', 4, 4, '{{oil}}')).toEqual({ text: 'Warm {{oil}} in a pan', cursor: 12 })
    expect(insertAtCursor('Add .', 4, 4, '{{oil}}')).toEqual({ text: 'Add {{oil}}.', cursor: 11 })
    expect(insertAtCursor('(', 1, 1, '{{oil}}').text).toBe('({{oil}}')
  })
  it('replaces a selection, in either direction, and inserts into empty text', () => {
    expect(insertAtCursor('Add the oil now', 4, 11, '{{oil|item}}')).toEqual({ text: 'Add {{oil|item}} now', cursor: 16 })
    expect(insertAtCursor('Add the oil now', 11, 4, '{{oil|item}}').text).toBe('Add {{oil|item}} now')
    expect(insertAtCursor('', 0, 0, '{{oil}}')).toEqual({ text: '{{oil}}', cursor: 7 })
  })
  it('keeps a cursor outside the text inside it (the end when unknown)', () => {
    expect(insertAtCursor('Stir', 99, 99, '{{oil}}').text).toBe('Stir {{oil}}')
    expect(insertAtCursor('Stir', -3, -3, '{{oil}}').text).toBe('{{oil}} Stir')
    expect(insertAtCursor('Stir', Number.NaN, Number.NaN, '{{oil}}').text).toBe('Stir {{oil}}')
  })
  it('keeps every character typed around the cursor, in order (property)', () => {
    fc.assert(fc.property(fc.string(), fc.nat(), fc.nat(), (text, a, b) => {
      const { text: out, cursor } = insertAtCursor(text, a, b, '{{oil}}')
      const [from, to] = [Math.min(a, b, text.length), Math.min(Math.max(a, b), text.length)]
      expect(out.slice(0, cursor).endsWith('{{oil}}')).toBe(true)
      expect(out.replace('{{oil}}', '').replace(/ /g, '')).toBe((text.slice(0, from) + text.slice(to)).replace(/ /g, ''))
    }))
  })
})

describe('amountChoices', () => {
  it('lists the ingredients by their items as written, in recipe order, leaving out rows with nothing typed', () => {
    expect(amountChoices([{ key: 'olive-oil', item: 'Olive oil' }, { key: '', item: '' }, { key: 'flour', item: ' plain flour ' }])).toEqual([
      { key: 'olive-oil', label: 'Olive oil' }, { key: 'flour', label: 'plain flour' },
    ])
  })
  it('tells two of the same item apart by their prep notes, else by their place', () => {
    expect(amountChoices([
      { key: 'onion', item: 'onion', prep: 'finely chopped' }, { key: 'onion-2', item: 'Onion', prep: 'sliced' },
      { key: 'salt', item: 'salt', prep: null }, { key: 'salt-2', item: 'salt' }, { key: 'salt-3', item: 'salt', prep: '' },
    ]).map((c) => c.label)).toEqual(['onion, finely chopped', 'Onion, sliced', 'salt (1st)', 'salt (2nd)', 'salt (3rd)'])
  })
  it('names a row with a key and no item by its key in words', () => {
    expect(amountChoices([{ key: 'red-onion', item: '' }])).toEqual([{ key: 'red-onion', label: 'red onion' }])
  })
})

describe('stepPreview (what the prompter reads, for the editor)', () => {
  const opts = (system: 'metric' | 'us') => ({ system, ingredients, fromServings: 4, toServings: 4 })
  it('reads amounts as the prompter\'s renderer does: 2 tbsp in US units, 29.57 mL → 30 mL in metric', () => {
    const text = 'Warm {{olive-oil|item}} and add {{flour*1/2}}.'
    for (const system of ['us', 'metric'] as const) {
      const p = stepPreview(text, opts(system))
      expect(p.parts.map((x) => x.text).join('')).toBe(renderStepText(text, opts(system)).text)
    }
    expect(stepPreview(text, opts('us')).parts).toEqual([
      { text: 'Warm ' }, { text: '2 tbsp olive oil', amount: true, exactText: 'exactly 2 tbsp' }, { text: ' and add ' },
      // half of 200 g is 100 g = 3.527 oz (oz = 28.349523125 g), to the nearest ¼ oz under 4 oz
      { text: '3½ oz', amount: true, exactText: 'exactly 3.527 oz; converted from 100 g' }, { text: '.' },
    ])
    expect(stepPreview(text, opts('metric')).parts[1]).toMatchObject({ text: '30 mL olive oil', amount: true, exactText: expect.stringContaining('29.57 mL') })
  })
  it('shows an amount that names no ingredient as the ingredient\'s words, marked, never as written', () => {
    const p = stepPreview('Fold in {{red-onion|item}} and {{flour*0}}.', opts('metric'))
    expect(p.parts).toEqual([{ text: 'Fold in ' }, { text: 'red onion', unread: true }, { text: ' and ' }, { text: 'flour', unread: true }, { text: '.' }])
    expect(p.parts.some((x) => x.text.includes('{{'))).toBe(false)
    expect(p.problems.map((x) => [x.key, x.kind])).toEqual([['red-onion', 'missing'], ['flour', 'share']])
  })
})

describe('stepAmountProblemText', () => {
  it('says in plain words what is wrong and how to fix it, naming no notation', () => {
    const [missing, share] = stepTokenProblems('{{red-onion|item}} {{flour*0}}', ['flour'])
    expect(stepAmountProblemText(missing!)).toBe('This step mentions an ingredient that is not in the list: “red onion”; pick it again from Insert amount.')
    expect(stepAmountProblemText(share!)).toBe('This step uses none of the “flour”; pick it again from Insert amount.')
    for (const p of [missing!, share!]) expect(stepAmountProblemText(p)).not.toMatch(/\{|\}|key|token/i)
  })
})

describe('studioKitchenDisplay', () => {
  it('reads the studio settings as the prompter does, a chosen system first', () => {
    const settings = { unitSystem: 'metric', cupUnit: 'metric-cup', fluidMeasure: 'imperial' as const }
    expect(studioKitchenDisplay(settings)).toEqual({ system: 'metric', metricCups: true, fluid: 'imperial' })
    expect(studioKitchenDisplay({ ...settings, unitSystem: 'us', cupUnit: 'cup' })).toEqual({ system: 'us', metricCups: false, fluid: 'imperial' })
    expect(studioKitchenDisplay(settings, 'us').system).toBe('us')
  })
})
