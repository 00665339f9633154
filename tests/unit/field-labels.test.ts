// The label table and the instructions of a refusal (shared/utils/field-labels.ts, input-words.ts),
// and the check of a refusal's wording the server tests use (tests/support/refusal-words.ts). The
// labels are the words of the forms: RecipeStepCard ("What to do", "Short name", "Duration in
// minutes … from – to"), RecipeIngredientTable, PriceFields, PlanKitchenForm, the sign-up and
// studio settings pages.
import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { fieldLabel, plainWords } from '../../shared/utils/field-labels'
import { checkInput, instructionFor } from '../../shared/utils/input-words'
import { inviteBodySchema, signupBodySchema } from '../../shared/utils/account-schemas'
import { EPISODE_LABELS, priceBodySchema, recipeCreateSchema, STUDIO_SETTINGS_LABELS, studioSettingsSchema } from '../../shared/utils/recipe-schemas'
import { wordsProblem } from '../support/refusal-words'

describe('fieldLabel: a request path in the form\'s words, entries counted from 1', () => {
  it.each([
    [['steps', 2, 'durationMin'], 'Step 3, shortest time'],
    [['steps', 2, 'durationMax'], 'Step 3, longest time'],
    [['steps', 0, 'text'], 'Step 1, what to do'],
    [['steps', 4, 'name'], 'Step 5, short name'],
    [['steps', 2, 'script', 1], 'Step 3, script line 2'],
    [['steps', 1, 'links', 0, 'lag'], 'Step 2, link 1, time after it'],
    [['ingredients', 0, 'item'], 'Ingredient 1, item'],
    [['ingredients', 2, 'min'], 'Ingredient 3, amount'],
    [['ingredients', 0, 'allergens', 'eu', 1], 'Ingredient 1, allergens, EU allergen 2'],
    [['packageSize'], 'Package size'],
    [['priceMinor'], 'Price'],
    [['boughtOn'], 'Date seen'],
    [['email'], 'E-mail address'],
    [['studioName'], 'Studio name'],
    [['times', 'prep'], 'Prep time'],
    [['callTime'], 'Call time'],
    [['hospital'], 'Nearest hospital'],
    [['crewCalls', 1, 'callTime'], 'Crew call 2, call time'],
    [['kitchen', 'racksPerOven'], 'Dishes per oven'],
    [['recipeIds', 4], 'Recipe 5'],
    [['tags', 0], 'Tag 1'],
    [[], 'The request'],
  ] as [PropertyKey[], string][])('%j → %s', (path, label) => {
    expect(fieldLabel(path)).toBe(label)
  })

  it('reads the dotted keys `field` carries, and a form\'s own words', () => {
    expect(fieldLabel('steps.2.durationMin')).toBe('Step 3, shortest time')
    expect(fieldLabel('ingredients.0.priceId')).toBe('Ingredient 1, price')
    expect(fieldLabel('name')).toBe('Your name')
    expect(fieldLabel('name', STUDIO_SETTINGS_LABELS)).toBe('Studio name')
    expect(fieldLabel('title', EPISODE_LABELS)).toBe('Episode title')
  })

  it('an unknown key falls back to plain words, never the key as written', () => {
    expect(fieldLabel(['fooBarBaz'])).toBe('Foo bar baz')
    expect(fieldLabel(['steps', 0, 'newThing'])).toBe('Step 1, new thing')
    expect(fieldLabel('cooking_time.max')).toBe('Cooking time, max')
    expect(plainWords('')).toBe('This field')
    for (const key of ['fooBarBaz', 'a_b_c', 'steps.0.newThing', 'x.y.zAb']) expect(wordsProblem(`${fieldLabel(key)}: fill it in.`)).toBeNull()
  })
})

describe('instructions: what to write, not what zod expected', () => {
  const words = (schema: z.ZodType, input: unknown) => {
    const r = checkInput(schema, input)
    return r.ok ? null : r.message
  }
  it('says what to write for each kind of problem', () => {
    expect(words(z.object({ n: z.number() }), { n: 'x' })).toBe('N: write a number, such as 4.')
    expect(words(z.object({ n: z.number().int() }), { n: 1.5 })).toBe('N: write a whole number, such as 4.')
    expect(words(z.object({ title: z.string().max(120) }), { title: 'x'.repeat(121) })).toBe('Title: write at most 120 characters.')
    expect(words(z.object({ title: z.string() }), {})).toBe('Title: fill it in.')
    expect(words(z.object({ email: z.email() }), { email: 'chef' })).toBe('E-mail address: write an e-mail address such as name@example.com.')
    expect(words(z.object({ station: z.enum(['burner', 'oven']) }), { station: 'grill' })).toBe('Station: choose one of: burner, oven.')
    expect(words(z.object({ tags: z.array(z.string()).max(2) }), { tags: ['a', 'b', 'c'] })).toBe('Tags: keep it to at most 2 entries.')
    expect(words(z.object({ n: z.number().min(1) }), { n: 0 })).toBe('N: write a number of at least 1.')
    expect(words(z.object({ ok: z.boolean() }), { ok: 'yes' })).toBe('Ok: choose yes or no (true or false).')
    expect(words(z.object({}), 'soup')).toBe('Send its fields as a group here.')
    expect(instructionFor({ code: 'custom', input: 1, message: 'choose an earlier step.' } as never)).toBe('choose an earlier step.')
  })

  it('the schemas\' own messages follow the label and name no key', () => {
    expect(words(recipeCreateSchema, { title: 'Soup', servings: 2, steps: [{ text: 'a' }, { text: 'b' }, { text: 'Simmer', durationMin: 'ten' }] }))
      .toBe('Step 3, shortest time: write a whole number of seconds, such as 900 for 15 minutes, or leave it empty.')
    expect(words(recipeCreateSchema, { title: 'Soup', servings: 2, ingredients: [{ key: 'salt', min: null, max: null, unit: null, item: '' }] }))
      .toBe('Ingredient 1, item: name the ingredient, such as "plain flour".')
    expect(words(priceBodySchema, { item: 'Salt', packageSize: 0, packageUnit: 'kg', priceMinor: 65, currency: 'GBP' }))
      .toBe('Package size: write a number above 0, such as 500.')
    expect(words(priceBodySchema, { item: 'Salt', packageSize: 1, packageUnit: 'kg', priceMinor: 2.49, currency: 'GBP' }))
      .toBe('Price: write the price in whole pence or cents, such as 249 for 2.49.')
    expect(words(signupBodySchema, { name: 'Ada', email: 'ada', password: 'long enough password', studioName: 'Ada Kitchen' }))
      .toBe('E-mail address: write an e-mail address such as name@example.com.')
    expect(words(inviteBodySchema, { email: 'a@example.com', role: 'director' })).toBe('Role: choose one of: producer, host, camera, viewer.')
    const settings = checkInput(studioSettingsSchema, { name: '' }, STUDIO_SETTINGS_LABELS)
    expect(settings.ok ? null : settings.message).toBe('Studio name: give the studio a name.')
    // The key stays for programs, beside the words for people.
    const step = checkInput(recipeCreateSchema, { title: 'Soup', servings: 2, steps: [{ text: 'a' }, { text: 'b' }, { text: 'c', durationMin: -1 }] })
    expect(step.ok ? null : { field: step.field, issues: step.issues }).toEqual({
      field: 'steps.2.durationMin',
      issues: [{ field: 'steps.2.durationMin', message: 'Step 3, shortest time: write a whole number of seconds, such as 900 for 15 minutes, or leave it empty.' }],
    })
  })
})

describe('wordsProblem: the check the server tests put every refusal to', () => {
  it('fails the old messages (the check can fail)', () => {
    expect(wordsProblem('steps.2.durationMin: durationMin must be a number of seconds or null.')).toMatch(/request key "steps.2.durationMin"/)
    expect(wordsProblem('packageSize: packageSize must be a number.')).toMatch(/request key "packageSize"/)
    expect(wordsProblem('body: send a JSON object.')).toMatch(/request key "body"/)
    expect(wordsProblem('studioId: must be a positive whole number, got "abc".')).toMatch(/request key/)
    expect(wordsProblem('The recipe was read, but ingredients.0.item: Name the ingredient (item).')).toMatch(/dotted path "ingredients.0.item"/)
    expect(wordsProblem('Servings: Invalid input: expected number, received string')).toMatch(/internal word/)
    expect(wordsProblem('Your name: send it as toTaste.')).toMatch(/identifier "toTaste"/)
    expect(wordsProblem('Kind: readFromText lists duration.')).toMatch(/identifier "readFromText"/)
    expect(wordsProblem('Problem: invalid_type')).toMatch(/identifier "invalid_type"/)
    expect(wordsProblem('No Hobline address /api/x answers GET; check the id in it.')).toBeNull()
  })
  it('passes the words people are meant to read: quotes of their text, addresses, standards', () => {
    expect(wordsProblem('Package size: write a number above 0, such as 500.')).toBeNull()
    expect(wordsProblem('Too many sign-in attempts for ada.lovelace@example.com. Try again in 5 minutes.')).toBeNull()
    expect(wordsProblem('Ingredient 1, name in the steps: another ingredient is also called "plainFlour.x" in the steps.')).toBeNull()
    expect(wordsProblem('No schema.org Recipe was found: paste a schema.org Recipe as JSON-LD (.json or .html).')).toBeNull()
    expect(wordsProblem('This address reads JSON only: send it with Content-Type: application/json (this was "text/plain").')).toBeNull()
    expect(wordsProblem('What a bare “cup” means: choose cup (US, 236.6 mL) or metric-cup (250 mL).')).toBeNull()
    expect(wordsProblem('This request was refused because it came from https://evil.example.net, not from this site.')).toBeNull()
  })
})
