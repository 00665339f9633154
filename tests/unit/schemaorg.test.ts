// schema.org Recipe JSON-LD import and export (shared/utils/schemaorg-*.ts), checked against the
// schema.org definitions of Recipe (recipeIngredient, recipeInstructions, recipeYield, prepTime,
// cookTime, totalTime, keywords), HowToStep, HowToSection, HowToDirection (performTime, prepTime,
// totalTime) and HowToTip; W3C JSON-LD 1.1 (@graph, @type as an array, embedding in HTML through
// <script type="application/ld+json">); ISO 8601 durations. Recipes are Brackenford Test
// Kitchen's (invented).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { importSchemaOrgRecipe } from '../../shared/utils/schemaorg-import'
import { exportSchemaOrgRecipe } from '../../shared/utils/schemaorg-export'
import { RecipeImportError, cleanSchemaText, extractJsonLdFromHtml, findRecipeNodes } from '../../shared/utils/schemaorg-read'
import { HOBLINE_LD_NAMESPACE } from '../../shared/utils/schemaorg-steps'
import { CAUTION_IDS } from '../../shared/utils/cautions'
import { EU_ALLERGENS, US_ALLERGENS } from '../../shared/utils/allergens'
import { UNIT_IDS, unitKind } from '../../shared/utils/units'
import type { RecipeDraft } from '../../shared/types/recipe'

const soup = {
  '@context': 'https://schema.org',
  '@type': 'Recipe',
  name: 'Brackenford Leek and Potato Soup',
  description: 'A smooth soup for a cold studio.',
  recipeYield: '4 servings',
  prepTime: 'PT15M',
  cookTime: 'PT35M',
  totalTime: 'PT50M',
  keywords: 'soup, winter, budget',
  recipeIngredient: ['2 leeks, thinly sliced', '500 g floury potatoes, peeled and diced', '1 l vegetable stock', '2 tbsp butter', 'salt, to taste', 'snipped chives (optional)'],
  recipeInstructions: [
    { '@type': 'HowToStep', text: 'Melt the butter and soften the leeks.', itemListElement: [{ '@type': 'HowToDirection', text: 'Soften gently.', performTime: 'PT8M' }] },
    { '@type': 'HowToStep', text: 'Add the potatoes and stock; simmer until tender.', itemListElement: [{ '@type': 'HowToDirection', text: 'Simmer.', performTime: 'PT20M', prepTime: 'PT2M' }] },
    { '@type': 'HowToStep', text: 'Blend the hot soup until smooth.' },
  ],
  image: ['https://example.invalid/soup.jpg', { '@type': 'ImageObject', url: 'https://example.invalid/soup-2.jpg' }],
}

describe('reading the input', () => {
  it('imports a JSON-LD object and the same as text', () => {
    const a = importSchemaOrgRecipe(soup)
    const b = importSchemaOrgRecipe(JSON.stringify(soup))
    expect(a).toEqual(b)
    expect(a.recipe.title).toBe('Brackenford Leek and Potato Soup')
    expect(a.problems).toEqual([])
    expect(a.images).toEqual(['https://example.invalid/soup.jpg', 'https://example.invalid/soup-2.jpg'])
  })
  it('finds the recipe in HTML, inside @graph, with @type as an array (JSON-LD 1.1)', () => {
    const graph = { '@context': 'https://schema.org', '@graph': [{ '@type': 'WebPage', name: 'Soup page' }, { ...soup, '@type': ['Recipe'] }] }
    const html = `<!doctype html><html><head><title>x</title>
      <script type="application/ld+json">{"@context":"https://schema.org","@type":"Organization","name":"Brackenford"}</script>
      <script type='application/ld+json'>//<![CDATA[
      ${JSON.stringify(graph)}
      //]]></script></head><body><p>Soup</p></body></html>`
    const r = importSchemaOrgRecipe(html)
    expect(r.recipe.title).toBe('Brackenford Leek and Potato Soup')
    expect(r.recipe.ingredients).toHaveLength(6)
  })
  it('finds recipes in arrays, under a WebPage mainEntity, and with prefixed or full-IRI types', () => {
    expect(findRecipeNodes([{ '@type': 'Person' }, { '@type': 'schema:Recipe', name: 'a' }])).toHaveLength(1)
    expect(findRecipeNodes({ '@type': 'WebPage', mainEntity: { '@type': 'https://schema.org/Recipe', name: 'b' } })).toHaveLength(1)
  })
  it('lists a broken JSON-LD block as a problem and still imports the good one', () => {
    const html = `<script type="application/ld+json">{ not json }</script><script type="application/ld+json">${JSON.stringify(soup)}</script>`
    expect(extractJsonLdFromHtml(html).problems[0]!.field).toBe('script[1]')
    const r = importSchemaOrgRecipe(html)
    expect(r.problems[0]).toMatchObject({ field: 'script[1]' })
    expect(r.problems[0]!.reason).toMatch(/not valid JSON/)
  })
  it('says clearly when there is nothing to import', () => {
    expect(() => importSchemaOrgRecipe('')).toThrow(/Nothing to import/)
    expect(() => importSchemaOrgRecipe('just some words')).toThrow(/neither JSON-LD nor HTML/)
    expect(() => importSchemaOrgRecipe('{"@type": "Recipe",')).toThrow(/not valid JSON/)
    expect(() => importSchemaOrgRecipe('<html><body>no data</body></html>')).toThrow(/no <script type="application\/ld\+json"> block/)
    expect(() => importSchemaOrgRecipe({ '@type': 'Person', name: 'x' })).toThrow(RecipeImportError)
    expect(() => importSchemaOrgRecipe({ '@type': 'Person', name: 'x' })).toThrow(/no node with "@type": "Recipe"/)
    expect(() => importSchemaOrgRecipe(42)).toThrow(/Nothing to import/)
  })
  it('imports the first of several recipes and says so', () => {
    const r = importSchemaOrgRecipe([soup, { ...soup, name: 'Second' }])
    expect(r.recipe.title).toBe('Brackenford Leek and Potato Soup')
    expect(r.problems[0]!.reason).toMatch(/holds 2 recipes; imported the first/)
  })
  it('cleans HTML tags and entities that sites leave in JSON-LD text', () => {
    expect(cleanSchemaText('<p>Leek &amp; potato&nbsp;soup &#8211; 180&deg;C &#x2F;</p>')).toBe('Leek & potato soup – 180°C /')
    expect(cleanSchemaText('Mix.<br>Bake.<br/>Cool.', true)).toBe('Mix.\nBake.\nCool.')
    expect(cleanSchemaText('cook < 5 min')).toBe('cook < 5 min')
  })
})

describe('recipe fields', () => {
  const r = importSchemaOrgRecipe(soup)
  it('reads name, description, keywords as tags, and ISO 8601 times in seconds', () => {
    expect(r.recipe.summary).toBe('A smooth soup for a cold studio.')
    expect(r.recipe.tags).toEqual(['soup', 'winter', 'budget'])
    expect(r.recipe.times).toEqual({ prep: 900, cook: 2100, total: 3000 })
  })
  it('reads recipeYield as a number, as text, as a list, and as a QuantitativeValue', () => {
    const y = (recipeYield: unknown) => { const x = importSchemaOrgRecipe({ ...soup, recipeYield }).recipe; return [x.servings, x.yieldText] }
    expect(y(6)).toEqual([6, null])
    expect(y('4 servings')).toEqual([4, null])
    expect(y('Serves 6')).toEqual([6, null])
    expect(y(['4', '4 servings'])).toEqual([4, null])
    expect(y(['12', '12 cookies'])).toEqual([12, '12 cookies'])
    expect(y('1 loaf')).toEqual([1, '1 loaf'])
    expect(y({ '@type': 'QuantitativeValue', value: 8 })).toEqual([8, null])
  })
  it('lists a missing or unreadable yield and assumes 4 servings, saying so', () => {
    const missing = importSchemaOrgRecipe({ ...soup, recipeYield: undefined })
    expect(missing.recipe.servings).toBe(4)
    expect(missing.problems).toContainEqual({ field: 'recipeYield', reason: 'missing; assumed 4 servings, check it' })
    expect(importSchemaOrgRecipe({ ...soup, recipeYield: 'a few' }).problems[0]!.reason).toMatch(/gives no number of servings/)
  })
  it('adds recipeCategory and recipeCuisine to the tags without duplicates', () => {
    const t = importSchemaOrgRecipe({ ...soup, keywords: ['Soup', 'Vegetarian'], recipeCategory: 'soup', recipeCuisine: ['British'] }).recipe.tags
    expect(t).toEqual(['Soup', 'Vegetarian', 'British'])
  })
  it('lists a bad duration with the field and keeps the rest', () => {
    const r2 = importSchemaOrgRecipe({ ...soup, cookTime: '35 minutes' })
    expect(r2.recipe.times.cook).toBeNull()
    expect(r2.problems).toEqual([{ field: 'cookTime', reason: expect.stringMatching(/not an ISO 8601 duration such as PT20M/) }])
  })
  it('names a recipe without a name "Untitled recipe" and says so', () => {
    const r2 = importSchemaOrgRecipe({ ...soup, name: undefined })
    expect(r2.recipe.title).toBe('Untitled recipe')
    expect(r2.problems[0]!.field).toBe('name')
  })
})

describe('recipeIngredient lines, through parseQuantity', () => {
  const ings = importSchemaOrgRecipe(soup).recipe.ingredients
  it('reads amount, unit, item, prep, optional and to taste', () => {
    expect(ings.map((i) => [i.key, i.position, i.min, i.unit, i.item, i.prep, i.optional, i.toTaste])).toEqual([
      ['leeks', 1, 2, null, 'leeks', 'thinly sliced', false, false],
      ['floury-potatoes', 2, 500, 'g', 'floury potatoes', 'peeled and diced', false, false],
      ['vegetable-stock', 3, 1, 'l', 'vegetable stock', null, false, false],
      ['butter', 4, 2, 'tbsp', 'butter', null, false, false],
      ['salt', 5, null, null, 'salt', null, false, true],
      ['snipped-chives', 6, null, null, 'snipped chives', null, true, false],
    ])
  })
  it('suggests allergens for the user to confirm (butter → milk)', () => {
    expect(ings[3]!.allergens).toEqual({ eu: ['milk'], us: ['milk'] })
  })
  it('turns "For the sauce:" lines into ingredient groups', () => {
    const r = importSchemaOrgRecipe({ ...soup, recipeIngredient: ['200 g pasta', 'For the sauce:', '2 tbsp olive oil', '1 garlic clove'] })
    expect(r.recipe.ingredients.map((i) => [i.item, i.group])).toEqual([['pasta', null], ['olive oil', 'For the sauce'], ['garlic clove', 'For the sauce']])
  })
  it('lists lines it could not read, with their index', () => {
    const r = importSchemaOrgRecipe({ ...soup, recipeIngredient: ['2 cups', { text: 'object' }, '6-5 eggs'] })
    expect(r.problems).toEqual([
      { field: 'recipeIngredient[0]', reason: '"2 cups" names no ingredient' },
      { field: 'recipeIngredient[1]', reason: 'not a line of text; skipped' },
      { field: 'recipeIngredient[2]', reason: expect.stringMatching(/runs downwards/) },
    ])
  })
  it('reads the legacy "ingredients" property and a single text of lines', () => {
    const r = importSchemaOrgRecipe({ ...soup, recipeIngredient: undefined, ingredients: '1 onion\n2 carrots' })
    expect(r.recipe.ingredients.map((i) => i.item)).toEqual(['onion', 'carrots'])
  })
})

describe('recipeInstructions: Text, HowToStep, HowToSection, HowToDirection, HowToTip', () => {
  const steps = (recipeInstructions: unknown) => importSchemaOrgRecipe({ ...soup, recipeInstructions })
  it('takes a HowToDirection performTime (+ prepTime) as the step duration', () => {
    const s = importSchemaOrgRecipe(soup).recipe.steps
    expect(s.map((x) => [x.position, x.durationMin, x.durationMax])).toEqual([[1, 480, 480], [2, 1320, 1320], [3, null, null]])
  })
  it('prefers a direction\'s totalTime, and reads times put on a HowToStep itself', () => {
    const s = steps([
      { '@type': 'HowToStep', text: 'Rest the dough.', itemListElement: { '@type': 'HowToDirection', text: 'Rest.', performTime: 'PT10M', totalTime: 'PT1H' } },
      { '@type': 'HowToStep', text: 'Bake.', performTime: 'PT25M' },
    ]).recipe.steps
    expect(s.map((x) => x.durationMin)).toEqual([3600, 1500])
  })
  it('keeps the HowToSection name as the step group', () => {
    const s = steps([
      { '@type': 'HowToSection', name: 'Make the soup', itemListElement: [{ '@type': 'HowToStep', text: 'Soften the leeks.' }, { '@type': 'HowToStep', text: 'Simmer.' }] },
      { '@type': 'HowToSection', name: 'To serve', itemListElement: [{ '@type': 'ListItem', item: { '@type': 'HowToStep', text: 'Ladle into bowls.' } }] },
    ]).recipe.steps
    expect(s.map((x) => [x.position, x.text, x.group])).toEqual([[1, 'Soften the leeks.', 'Make the soup'], [2, 'Simmer.', 'Make the soup'], [3, 'Ladle into bowls.', 'To serve']])
  })
  it('splits Text into steps by line, dropping list numbers', () => {
    expect(steps('1. Chop the leeks.\n2) Melt the butter.\nStep 3: Simmer.').recipe.steps.map((x) => x.text)).toEqual(['Chop the leeks.', 'Melt the butter.', 'Simmer.'])
    expect(steps(['Chop.', 'Simmer.']).recipe.steps.map((x) => x.text)).toEqual(['Chop.', 'Simmer.'])
    expect(steps('<ol><li>Chop.</li><li>Stir.</li></ol>').recipe.steps.map((x) => x.text)).toEqual(['Chop.', 'Stir.'])
  })
  it('uses the directions\' text when a HowToStep has none, and HowToTip text goes to the notes', () => {
    const r = steps([{ '@type': 'HowToStep', itemListElement: [{ '@type': 'HowToDirection', text: 'Whisk the eggs.' }, { '@type': 'HowToTip', text: 'Use cold eggs.' }] }, { '@type': 'HowToTip', text: 'Freezes well.' }])
    expect(r.recipe.steps.map((x) => x.text)).toEqual(['Whisk the eggs.'])
    expect(r.recipe.notes).toBe('Tip: Use cold eggs.\nTip: Freezes well.')
  })
  it('suggests cautions from the step text (the user confirms them)', () => {
    expect(importSchemaOrgRecipe(soup).recipe.steps[2]!.cautions).toEqual(['blending-hot'])
  })
  it('lists what is not a step, and a step without text', () => {
    const r = steps([{ '@type': 'Person', name: 'x' }, { '@type': 'HowToStep' }, 42])
    expect(r.problems.map((p) => p.field)).toEqual(['recipeInstructions[0]', 'recipeInstructions[1]', 'recipeInstructions[2]'])
    expect(r.problems[1]!.reason).toBe('the step has no text; skipped')
    expect(importSchemaOrgRecipe({ ...soup, recipeInstructions: undefined }).problems).toContainEqual({ field: 'recipeInstructions', reason: 'missing; the recipe has no steps yet' })
  })
})

describe('export', () => {
  const draft = importSchemaOrgRecipe(soup).recipe
  const ld = exportSchemaOrgRecipe(draft)
  it('writes a schema.org Recipe with the Hobline prefix declared in the @context', () => {
    expect(ld['@context']).toEqual(['https://schema.org', { hobline: HOBLINE_LD_NAMESPACE }])
    expect(ld['@type']).toBe('Recipe')
    expect(ld.recipeYield).toEqual(['4', '4 servings'])
    expect(ld.prepTime).toBe('PT15M')
    expect(ld.totalTime).toBe('PT50M')
    expect(ld.keywords).toBe('soup, winter, budget')
    expect(ld.recipeIngredient).toEqual(['2 leeks, thinly sliced', '500 g floury potatoes, peeled and diced', '1 L vegetable stock', '2 tbsp butter', 'salt, to taste', 'snipped chives (optional)'])
  })
  it('writes steps as HowToStep with the duration on a HowToDirection (HowToStep has no times), groups as HowToSection', () => {
    const grouped = exportSchemaOrgRecipe({ ...draft, steps: draft.steps.map((s, i) => ({ ...s, group: i < 2 ? 'Soup' : null })) })
    const ins = grouped.recipeInstructions as Array<Record<string, unknown>>
    expect(ins.map((x) => x['@type'])).toEqual(['HowToSection', 'HowToStep'])
    const first = (ins[0]!.itemListElement as Array<Record<string, unknown>>)[0]!
    expect(first.performTime).toBeUndefined()
    expect(first.itemListElement).toEqual([{ '@type': 'HowToDirection', text: 'Melt the butter and soften the leeks.', performTime: 'PT8M' }])
  })
  it('re-imports to the same recipe', () => {
    const back = importSchemaOrgRecipe(JSON.stringify(ld))
    expect(back.problems).toEqual([])
    expect(back.recipe).toEqual(draft)
  })
})

describe('export → import round trip (property)', () => {
  const word = fc.constantFrom('leek', 'potato', 'soup', 'quick', 'winter', 'Brackenford', 'studio', 'golden', 'crisp', 'stew', 'stir', 'the', 'pan', 'gently', 'until', 'soft', 'and', 'add', 'simmer', 'season')
  const words = (min: number, max: number) => fc.array(word, { minLength: min, maxLength: max }).map((w) => w.join(' '))
  const items = ['onions', 'plain flour', 'olive oil', 'garlic', 'carrots', 'chopped tomatoes', 'butter', 'basmati rice', 'eggs', 'caster sugar', 'flat-leaf parsley', 'chicken thighs', 'lemon']
  const preps = [null, 'thinly sliced', 'finely chopped', 'at room temperature', 'peeled and diced']
  const nice = fc.oneof(
    fc.integer({ min: 1, max: 40 }),
    fc.integer({ min: 1, max: 80 }).map((n) => n / 8),
    fc.integer({ min: 1, max: 30 }).map((n) => n / 3),
    fc.integer({ min: 1, max: 999 }).map((n) => n / 100),
  )
  const ingredient = fc.record({
    amount: fc.option(fc.tuple(nice, nice), { nil: null }),
    unit: fc.option(fc.constantFrom(...UNIT_IDS), { nil: null }),
    item: fc.constantFrom(...items),
    prep: fc.constantFrom(...preps),
    optional: fc.boolean(),
    toTaste: fc.boolean(),
    group: fc.option(fc.constantFrom('For the sauce', 'To serve'), { nil: null }),
    eu: fc.subarray(EU_ALLERGENS.map((a) => a.id)),
    us: fc.subarray(US_ALLERGENS.map((a) => a.id)),
    stated: fc.option(fc.record({ a: nice, b: nice, unit: fc.constantFrom('g' as const, 'ml' as const, 'oz' as const, 'cup' as const) }), { nil: null }),
  })
  const step = fc.record({
    name: fc.constantFrom(null, 'Pasta water', 'Dough rest', 'Sauce simmer'),
    together: fc.boolean(),
    text: words(1, 8).map((t) => `${t}.`),
    script: fc.array(fc.string(), { maxLength: 3 }),
    handsOn: fc.boolean(),
    duration: fc.option(fc.tuple(fc.integer({ min: 0, max: 7200 }), fc.integer({ min: 0, max: 600 })), { nil: null }),
    station: fc.constantFrom(null, 'burner' as const, 'oven' as const, 'counter' as const),
    afterSeed: fc.array(fc.nat(), { maxLength: 3 }),
    cameraShot: fc.option(fc.string(), { nil: null }),
    cameraNote: fc.option(fc.string(), { nil: null }),
    cautions: fc.subarray([...CAUTION_IDS]),
    group: fc.option(fc.constantFrom('Make the soup', 'To serve'), { nil: null }),
    readFromText: fc.subarray(['duration' as const, 'handsOn' as const, 'station' as const]),
  })
  const draft: fc.Arbitrary<RecipeDraft> = fc.record({
    title: words(1, 5),
    summary: fc.option(words(1, 12), { nil: null }),
    servings: fc.integer({ min: 1, max: 24 }),
    yieldText: fc.constantFrom(null, '1 loaf', '12 cookies', 'one 23 cm tart'),
    tags: fc.uniqueArray(fc.constantFrom('soup', 'Winter', 'quick, easy', 'vegetarian', 'budget'), { maxLength: 4 }),
    notes: fc.option(fc.string({ minLength: 1 }), { nil: null }),
    times: fc.record({
      prep: fc.option(fc.integer({ min: 0, max: 36000 }), { nil: null }),
      cook: fc.option(fc.integer({ min: 0, max: 36000 }), { nil: null }),
      total: fc.option(fc.integer({ min: 0, max: 90000 }), { nil: null }),
    }),
    ingredients: fc.array(ingredient, { maxLength: 8 }),
    steps: fc.array(step, { maxLength: 6 }),
  }).map((d) => ({
    ...d,
    ingredients: d.ingredients.map((i, n) => {
      const [a, b] = i.amount ?? [null, null]
      const min = a === null ? null : Math.min(a, b!)
      const max = a === null ? null : Math.max(a, b!)
      return {
        key: `ing-${n + 1}`, position: n + 1, min, max, unit: min === null ? null : i.unit, item: i.item, prep: i.prep, optional: i.optional,
        toTaste: min === null && i.toTaste, group: i.group, allergens: { eu: i.eu, us: i.us },
        stated: min === null || i.unit === null || unitKind(i.unit) === 'count' || !i.stated || i.stated.unit === i.unit ? null
          : { min: Math.min(i.stated.a, i.stated.b), max: Math.max(i.stated.a, i.stated.b), unit: i.stated.unit },
      }
    }),
    steps: d.steps.map((s, n) => ({
      position: n + 1, name: s.name, text: s.text,
      ...(s.together && n > 0 ? { links: [{ step: n, kind: 'start-start' as const, lag: 0 }] } : {}), script: s.script, handsOn: s.handsOn,
      durationMin: s.duration ? s.duration[0] : null, durationMax: s.duration ? s.duration[0] + s.duration[1] : null,
      station: s.station, after: n === 0 ? [] : [...new Set(s.afterSeed.map((x) => (x % n) + 1))].sort((x, y) => x - y),
      cameraShot: s.cameraShot, cameraNote: s.cameraNote, cautions: s.cautions, group: s.group, readFromText: s.readFromText,
    })),
  }))
  it('a recipe exported as JSON-LD imports back equal, with nothing reported', () => {
    fc.assert(
      fc.property(draft, (d) => {
        const back = importSchemaOrgRecipe(JSON.stringify(exportSchemaOrgRecipe(d)))
        expect(back.problems).toEqual([])
        const near = (x: number | null) => (x === null ? null : Math.round(x * 1e9) / 1e9)
        const amounts = (r: RecipeDraft) => r.ingredients.map((i) => ({
          ...i, min: near(i.min), max: near(i.max), stated: i.stated ? { ...i.stated, min: near(i.stated.min), max: near(i.stated.max) } : i.stated,
        }))
        expect(amounts(back.recipe)).toEqual(amounts(d))
        expect({ ...back.recipe, ingredients: [] }).toEqual({ ...d, ingredients: [] })
      }),
      { numRuns: 200 },
    )
  })
})
