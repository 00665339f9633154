// The editor's form keeps what an import read: an ingredient's stated equivalent while its amount
// is unchanged, and a step's readings from its text until they are confirmed or changed.
import { beforeAll, describe, expect, it, vi } from 'vitest'
import { formatAmountExact, normaliseAmountText, readAmountAt } from '../../shared/utils/amount-text'
import { suggestAllergens } from '../../shared/utils/allergens'
import { parseQuantity } from '../../shared/utils/quantity'
import { cleanStepName, stepNameProblem } from '../../shared/utils/step-name'
import { makeIngredientKey } from '../../shared/utils/step-text'
import type { LoadedRecipe } from '../../types/api'

// recipe-form.ts relies on Nuxt's auto-imports; here they are the same shared functions, as globals.
const globals = { formatAmountExact, normaliseAmountText, readAmountAt, suggestAllergens, parseQuantity, cleanStepName, stepNameProblem, makeIngredientKey }
let form: typeof import('../../composables/recipe-form')
beforeAll(async () => {
  for (const [name, fn] of Object.entries(globals)) vi.stubGlobal(name, fn)
  form = await import('../../composables/recipe-form')
})

const loaded = {
  id: 1, title: 'Lemon drizzle', summary: null, servings: 8, yieldText: null, tags: [], notes: null, times: { prep: null, cook: null, total: null },
  ingredients: [{
    id: 10, key: 'flour', position: 1, min: 1.5, max: 1.5, unit: 'cup', item: 'self-raising flour', prep: null, optional: false, toTaste: false, group: null,
    allergens: { eu: [], us: [] }, priceId: null, stated: { min: 190, max: 190, unit: 'g' },
  }],
  steps: [{
    id: 20, position: 1, name: null, text: 'Bake for 40 to 45 minutes.', script: [], handsOn: false, durationMin: 2400, durationMax: 2700, station: 'oven',
    after: [], links: [], cameraShot: null, cameraNote: null, cautions: [], group: null, readFromText: ['duration', 'handsOn', 'station'], photo: null,
  }],
} as unknown as LoadedRecipe

describe('recipe form', () => {
  it('sends back the stated equivalent and the readings as loaded', () => {
    const { body } = form.bodyFromForm(form.formFromRecipe(loaded))
    expect(body.ingredients).toEqual([expect.objectContaining({ min: 1.5, unit: 'cup', stated: { min: 190, max: 190, unit: 'g' } })])
    expect(body.steps).toEqual([expect.objectContaining({ durationMin: 2400, durationMax: 2700, readFromText: ['duration', 'handsOn', 'station'] })])
  })
  it('drops the stated equivalent once the amount or unit is changed, and keeps it when changed back', () => {
    const f = form.formFromRecipe(loaded)
    f.ingredients[0]!.min = '2'
    expect((form.bodyFromForm(f).body.ingredients as { stated: unknown }[])[0]!.stated).toBeNull()
    f.ingredients[0]!.min = '1½'
    expect((form.bodyFromForm(f).body.ingredients as { stated: unknown }[])[0]!.stated).toEqual({ min: 190, max: 190, unit: 'g' })
    f.ingredients[0]!.unit = 'tbsp'
    expect((form.bodyFromForm(f).body.ingredients as { stated: unknown }[])[0]!.stated).toBeNull()
  })
  it('counts a changed field as confirmed, and Confirm clears the rest', () => {
    const f = form.formFromRecipe(loaded)
    f.steps[0]!.durationMax = '50'
    f.steps[0]!.station = 'burner'
    expect(form.stepStillRead(f.steps[0]!)).toEqual(['handsOn'])
    f.steps[0]!.readFromText = []
    expect((form.bodyFromForm(f).body.steps as { readFromText: string[] }[])[0]!.readFromText).toEqual([])
  })
  it('a line typed into quick entry keeps its stated equivalent', () => {
    const { row } = form.ingredientFromLine('½ cup (100g) caster sugar', [])
    expect(form.statedStillHolds(row)).toEqual({ min: 100, max: 100, unit: 'g' })
  })
})
