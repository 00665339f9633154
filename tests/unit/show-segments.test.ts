// The episode as a show: segments, their order and the schema of a run order (shared/utils/show-segments.ts).
// Refusals are checked through checkInput (input-words.ts): instructions that name no field key.
import { describe, expect, it } from 'vitest'
import { checkInput } from '../../shared/utils/input-words'
import {
  defaultSegmentTitle, moveSegment, scriptPlainText, SEGMENT_KINDS, SEGMENT_WORDS, type ShowSegment,
} from '../../shared/utils/show-segments'
import { showSegmentSchema, showSegmentsSchema } from '../../shared/utils/show-segment-schemas'

const seg = (id: string, kind: ShowSegment['kind'] = 'free', extra: Partial<ShowSegment> = {}): ShowSegment =>
  ({ id, kind, title: SEGMENT_WORDS[kind].defaultTitle, script: [], ...extra })

describe('moveSegment', () => {
  const list = [seg('a', 'intro'), seg('b'), seg('c'), seg('d', 'outro')]
  it('moves a segment to a position, leaving the list it was given alone', () => {
    expect(moveSegment(list, 'd', 0).map((s) => s.id)).toEqual(['d', 'a', 'b', 'c'])
    expect(moveSegment(list, 'a', 2).map((s) => s.id)).toEqual(['b', 'c', 'a', 'd'])
    expect(moveSegment(list, 'b', 99).map((s) => s.id)).toEqual(['a', 'c', 'd', 'b'])
    expect(moveSegment(list, 'c', -3).map((s) => s.id)).toEqual(['c', 'a', 'b', 'd'])
    expect(list.map((s) => s.id)).toEqual(['a', 'b', 'c', 'd'])
  })
  it('refuses an id the run order does not have', () => {
    expect(() => moveSegment(list, 'zz', 0)).toThrow(/No segment has the id "zz"/)
  })
})

describe('default titles', () => {
  it('one per kind, a recipe segment takes its recipe\'s title', () => {
    expect(SEGMENT_KINDS.map((k) => defaultSegmentTitle(k))).toEqual(['Welcome', 'Recipe', 'A word from our sponsor', 'Sign-off', 'Segment'])
    expect(defaultSegmentTitle('recipe', ' Lentil soup ')).toBe('Lentil soup')
    expect(defaultSegmentTitle('intro', 'Lentil soup')).toBe('Welcome')
  })
})

describe('scriptPlainText', () => {
  it('joins the words and leaves the live fields out', () => {
    expect(scriptPlainText([{ text: 'Serves ' }, { field: { kind: 'servings' } }, { text: ', under £2 a serving.' }])).toBe('Serves , under £2 a serving.')
  })
})

describe('showSegmentsSchema', () => {
  const ok = [
    seg('intro-1', 'intro', { script: [{ text: 'Three dinners, each for ' }, { field: { kind: 'servings' } }] }),
    seg('r-1', 'recipe', { recipeId: 12, script: [{ field: { kind: 'cost', recipeId: 12, withOptional: true } }, { field: { kind: 'oven', celsius: 200 } }] }),
    seg('s-1', 'sponsor'), seg('o-1', 'outro', { script: [{ field: { kind: 'amount', recipeId: 12, ingredientKey: 'red-onion' } }, { field: { kind: 'total-time', recipeId: 12 } }] }),
  ]
  it('takes a run order of every kind with words and every kind of live field', () => {
    expect(checkInput(showSegmentsSchema, ok)).toMatchObject({ ok: true })
    expect(checkInput(showSegmentSchema, seg('x', 'free', { script: [{ field: { kind: 'budget' } }] }))).toMatchObject({ ok: true })
  })
  const refused = (input: unknown) => {
    const r = checkInput(showSegmentsSchema, input)
    if (r.ok) throw new Error('expected a refusal')
    return r.issues.map((i) => i.message.replace(/^.*?: /, ''))
  }
  it('refuses what does not fit, with instructions that name no key', () => {
    expect(refused([seg('a', 'recipe')])).toEqual(['choose the recipe this segment cooks.'])
    expect(refused([seg('a', 'intro', { recipeId: 3 })])).toEqual(['leave it out: only a recipe segment cooks a recipe.'])
    expect(refused([seg('a'), seg('a')])).toEqual(['give each segment its own id; this one is used twice.'])
    expect(refused([{ ...seg('a'), kind: 'advert' }])).toEqual(['choose one of: intro, recipe, sponsor, outro, free.'])
    expect(refused([seg('a', 'free', { script: [{ text: 'x'.repeat(2001) }] })])).toEqual(['write at most 2000 characters.'])
    expect(refused([seg('a', 'free', { script: [{ field: { kind: 'oven', celsius: 900 } }] })])).toEqual(['write at most 300 °C.'])
    expect(refused([seg('a', 'free', { title: ' ' })])).toEqual(['give the segment a title.'])
    expect(refused([seg('a', 'free', { script: [{ field: { kind: 'amount', recipeId: 1, ingredientKey: '{{x}}' } }] })])).toEqual(['choose an ingredient from the list.'])
    expect(refused(Array.from({ length: 61 }, (_, i) => seg(`s${i}`)))).toEqual(['Keep it to at most 60 segments.'])
    for (const m of refused([seg('a', 'free', { script: [{ field: { kind: 'cook' } as never }] })])) expect(m).not.toMatch(/kind|recipeId|withOptional/)
  })
})

describe('refusals inside a run order name the segment and the field by their labels', () => {
  it('"Segment 1, script line 2, live field, with the optional ingredients: …"', () => {
    const r = checkInput(showSegmentsSchema, [seg('a', 'free', { script: [{ text: 'Only ' }, { field: { kind: 'cost', recipeId: 1 } as never }] })])
    expect(r.ok).toBe(false)
    const wrapped = checkInput(showSegmentSchema.array(), [seg('a', 'free', { script: [{ text: 'a', field: { kind: 'servings' } } as never] })])
    expect(wrapped.ok).toBe(false)
    if (!wrapped.ok) expect(wrapped.message).toMatch(/send either words or one live field chosen from the list\.$/)
  })
  it('in an episode body the path reads in the editor\'s words', async () => {
    const { z } = await import('zod')
    const body = z.object({ segments: showSegmentsSchema })
    const r = checkInput(body, { segments: [seg('a'), seg('b', 'free', { script: [{ text: 'Only ' }, { field: { kind: 'cost', recipeId: 1 } as never }] })] })
    expect(r).toMatchObject({ ok: false, field: 'segments.1.script.1.field.withOptional' })
    if (!r.ok) expect(r.message).toBe('Segment 2, script line 2, live field, with the optional ingredients: choose with or without the optional ingredients.')
    const kind = checkInput(body, { segments: [{ ...seg('a'), kind: 'advert' }] })
    if (!kind.ok) expect(kind.message).toBe('Segment 1, kind of segment: choose one of: intro, recipe, sponsor, outro, free.')
    expect(kind.ok).toBe(false)
  })
})
