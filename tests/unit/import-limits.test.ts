// Recipe import against hostile input (shared/utils/schemaorg-read.ts, html-read.ts, quantity.ts):
// real pages still read as before, the caps hold, and the worst inputs each reader admits take
// time in proportion to their size (tests/support/timing.ts: doubling the input must not come
// near quadrupling the time). HTML is read as the WHATWG HTML Living Standard says: a script's
// text is raw text (§13.1.2.1, no character references decoded), a comment hides what is in it
// (§13.1.6), and named character references follow the standard's table (§13.5).
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
import { importSchemaOrgRecipe } from '../../shared/utils/schemaorg-import'
import {
  IMPORT_MAX_CHARS, MAX_PROBLEMS, MAX_RECIPE_ITEMS, RecipeImportError, TEXT_MAX_CHARS, cleanSchemaText, extractJsonLdFromHtml,
} from '../../shared/utils/schemaorg-read'
import { QUANTITY_LINE_MAX, parseQuantity } from '../../shared/utils/quantity'
import { readStepTime } from '../../shared/utils/step-time-read'
import { doublingRatio } from '../support/timing'

const fixture = JSON.parse(readFileSync(resolve(import.meta.dirname, '../fixtures/recipe-fennel-orzo.jsonld'), 'utf8'))
const recipe = (extra: object) => JSON.stringify({ '@context': 'https://schema.org', '@type': 'Recipe', name: 'Limits', recipeYield: '2', ...extra })

describe('real pages still read', () => {
  it('finds the recipe in a page with scripts, comments, entities, a breadcrumb and a commented-out block', () => {
    const page = `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><title>Fennel &amp; lemon orzo | Brackenford Test Kitchen</title>
<meta property="og:title" content="Fennel &amp; lemon orzo">
<script>window.dataLayer = []; document.write('<script type="application/ld+json">{"no": "json"}<\\/script>'); if (1 < 2 && 3 > 2) {}</script>
<!-- an old block left in a comment: <script type="application/ld+json">{"@type": "Recipe", "name": "Stale"}</script> -->
<script type="application/ld+json">{"@context":"https://schema.org","@type":"BreadcrumbList","itemListElement":[{"@type":"ListItem","position":1,"name":"Pasta &amp; rice"}]}</script>
<script type="Application/LD+JSON; charset=utf-8">
${JSON.stringify({ ...fixture, description: 'A quick one-pan orzo for weeknights &amp; Sundays.<br>Serves&nbsp;4.' })}
</script>
<style>body > p { color: #222 }</style></head>
<body><div class="recipe"><h1>Fennel &amp; lemon orzo</h1><p>Jump to recipe &rarr;<ul><li>300 g orzo<li>1 fennel bulb</ul></div></body></html>`
    const r = importSchemaOrgRecipe(page)
    expect(r.recipe.title).toBe('Fennel and lemon orzo')
    expect(r.recipe.summary).toBe('A quick one-pan orzo for weeknights & Sundays. Serves 4.')
    expect(r.recipe.ingredients.map((i) => i.item)).toEqual(['orzo', 'fennel bulb', 'olive oil', 'vegetable stock', 'lemon', 'parmesan', 'salt'])
    expect(r.recipe.ingredients.find((i) => i.item === 'parmesan')).toMatchObject({ min: 30, unit: 'g', prep: 'grated', optional: true })
    expect(r.problems.filter((p) => p.field.startsWith('script'))).toEqual([])
  })
  it('reads a script\'s text raw and leaves a commented-out block unread (HTML §13.1.2.1, §13.1.6)', () => {
    const { blocks, problems } = extractJsonLdFromHtml('<!-- <script type="application/ld+json">{"a":1}</script> --><script type="application/ld+json">{"b":"&amp;"}</script>')
    expect(blocks).toEqual([{ b: '&amp;' }])
    expect(problems).toEqual([])
  })
  it('keeps the line breaks of <br>, </p> and </li> and decodes named and numeric references (HTML §13.5)', () => {
    expect(cleanSchemaText('<p>Heat the oven to 180&deg;C&nbsp;&amp; oil a tin.</p><ol><li>Mix&hellip;</li><li>Bake &#8211; 20&#x2009;min</li></ol>', true))
      .toBe('Heat the oven to 180°C & oil a tin.\nMix…\nBake – 20 min')
    expect(cleanSchemaText('5 < 6 and R&D &bogus; stay as written')).toBe('5 < 6 and R&D &bogus; stay as written')
  })
})

describe('caps', () => {
  it('refuses more than 512 KB with a message that says what to paste instead', () => {
    expect(() => importSchemaOrgRecipe(' '.repeat(IMPORT_MAX_CHARS + 1))).toThrow(RecipeImportError)
    expect(() => importSchemaOrgRecipe(' '.repeat(IMPORT_MAX_CHARS + 1))).toThrow(/larger than 512 KB\. Paste only the recipe's JSON-LD/)
  })
  it('reads at most 16 KB of one text value and 500 characters of one ingredient line', () => {
    expect(cleanSchemaText('word '.repeat(10_000)).length).toBeLessThanOrEqual(TEXT_MAX_CHARS)
    const long = `2 cups ${'flour '.repeat(100)}`
    const p = parseQuantity(long)
    expect(long.length).toBeGreaterThan(QUANTITY_LINE_MAX)
    expect(p).toMatchObject({ min: null, unit: null, item: long.trim() })
    expect(p.warnings[0]).toMatch(/longer than 500; kept whole as the item/)
  })
  it('reads at most 200 ingredients and 200 steps, 30 tags and lists at most 50 problems', () => {
    const r = importSchemaOrgRecipe(recipe({
      recipeIngredient: Array.from({ length: 300 }, (_, i) => `${i + 1} g flour`),
      recipeInstructions: Array.from({ length: 300 }, (_, i) => ({ '@type': 'HowToStep', text: `Stir ${i + 1}.` })),
      keywords: Array.from({ length: 500 }, (_, i) => `tag${i}`).join(','),
    }))
    expect(r.recipe.ingredients).toHaveLength(MAX_RECIPE_ITEMS)
    expect(r.recipe.steps).toHaveLength(MAX_RECIPE_ITEMS)
    expect(r.recipe.tags).toHaveLength(30)
    expect(r.problems).toEqual(expect.arrayContaining([
      { field: 'recipeIngredient', reason: 'lists 300 lines; Hobline keeps at most 200 ingredients, so the lines after the first 200 were not read' },
      { field: 'recipeInstructions[200]', reason: 'Hobline keeps at most 200 steps; this and the instructions after it were not read' },
    ]))
    const noisy = importSchemaOrgRecipe(recipe({ recipeInstructions: Array.from({ length: 120 }, () => 42) }))
    expect(noisy.problems).toHaveLength(MAX_PROBLEMS + 1)
    expect(noisy.problems.at(-1)!.reason).toMatch(/^and \d+ more problems like these$/)
  })
  it('reads the first 100 JSON-LD blocks of a page and says how many there were', () => {
    const page = `${'<script type="application/ld+json">{}</script>'.repeat(150)}<script type="application/ld+json">${recipe({})}</script>`
    const { blocks, problems } = extractJsonLdFromHtml(page)
    expect(blocks).toHaveLength(100)
    expect(problems).toEqual([{ field: 'script[101]', reason: 'the page has 151 JSON-LD blocks; read the first 100' }])
  })
  it('follows nested instructions 12 levels deep, no further, without overflowing the stack', () => {
    const depth = 50_000
    const r = importSchemaOrgRecipe(`{"@type":"Recipe","name":"Deep","recipeInstructions":${'['.repeat(depth)}"Stir."${']'.repeat(depth)}}`)
    expect(r.recipe.steps).toEqual([])
    expect(r.problems.some((p) => /nested more than 12 levels deep/.test(p.reason))).toBe(true)
  })
})

describe('time in proportion to the input (ratio of 2n to n under 3; quadratic would be about 4)', { timeout: 60_000 }, () => {
  const unclosed = (kb: number) => '<script type=application/ld+json>'.repeat(Math.floor((kb * 1024) / 33))
  // Both sizes above V8's 128 KB limit for a string in the regular heap, so both are allocated alike.
  it('repeated unclosed <script type=application/ld+json>: 200 KB and 400 KB', () => {
    const t = doublingRatio(unclosed, (page) => expect(() => importSchemaOrgRecipe(page)).toThrow(/No schema.org Recipe/), 200, { reps: 2, rounds: 9 })
    expect(t.ratio, JSON.stringify(t)).toBeLessThan(3)
  })
  it('deeply nested unclosed tags, the case an element stack is quadratic in: 120 KB and 240 KB', () => {
    const t = doublingRatio((kb) => '<a><b>'.repeat((kb * 1024) / 6), (page) => extractJsonLdFromHtml(page), 120, { reps: 3, rounds: 7 })
    expect(t.ratio, JSON.stringify(t)).toBeLessThan(3)
  })
  it('a text value of unclosed "<a" and one of entities, within the 16 KB cap: 6 KB and 12 KB', () => {
    const tags = doublingRatio((kb) => '<a'.repeat(kb * 512), (v) => cleanSchemaText(v), 6, { reps: 50, rounds: 9 })
    expect(tags.ratio, JSON.stringify(tags)).toBeLessThan(3)
    const refs = doublingRatio((kb) => '&amp;<br>&#8211;'.repeat(kb * 64), (v) => cleanSchemaText(v, true), 6, { reps: 50, rounds: 9 })
    expect(refs.ratio, JSON.stringify(refs)).toBeLessThan(3)
  })
  it('a whole recipe of 200 ingredient lines and 200 steps, each as long as read: 100 and 200 of each', () => {
    const make = (n: number) => recipe({
      recipeIngredient: Array.from({ length: n }, (_, i) => `1 1/2 item${i} ${'1'.repeat(240)} ${',  '.repeat(80)}`),
      recipeInstructions: Array.from({ length: n }, () => `<p>${'Stir, '.repeat(300)}`),
    })
    const t = doublingRatio(make, (text) => importSchemaOrgRecipe(text), 100, { rounds: 11 })
    expect(t.ratio, JSON.stringify(t)).toBeLessThan(3)
  })
})

describe('ingredient lines in time in proportion to their length (up to the 500-character cap)', { timeout: 60_000 }, () => {
  const lines: Record<string, (n: number) => string> = {
    'digits': (n) => '1'.repeat(n),
    'spaces after an amount': (n) => `2 ${' '.repeat(n)}x`,
    'fractions': (n) => '1/2 '.repeat(n / 4),
    'commas and spaces': (n) => `1 cup flour${' ,'.repeat(n / 2)}x`,
    'open parentheses': (n) => `1 cup (${' '.repeat(n)}`,
    'trailing punctuation': (n) => `1 cup flour${',;:'.repeat(n / 3)}`,
    // the stated equivalent (quantity.ts readStated): slashes and fractions in a parenthesis, one unclosed
    'slashes in a stated parenthesis': (n) => `1 cup (${' / '.repeat(n / 3)}) flour`,
    'fractions in an unclosed parenthesis': (n) => `1 cup (${'1/'.repeat(n / 2)}`,
    'measures in a stated parenthesis': (n) => `1 cup (${'1 g / '.repeat(n / 5)}1 g) flour`,
    'a slash after the unit': (n) => `1 cup /${' /'.repeat(n / 2)}`,
    '"x" after an amount': (n) => `2 ${'x '.repeat(n / 2)}`,
    '"each" after a unit': (n) => `1 tsp ${'each '.repeat(n / 5)}salt`,
  }
  for (const [name, make] of Object.entries(lines)) {
    it(`${name}: 240 and 480 characters`, () => {
      const t = doublingRatio(make, (line) => parseQuantity(line), 240, { reps: 300, rounds: 7 })
      expect(t.ratio, JSON.stringify(t)).toBeLessThan(3)
    })
  }
})

describe('step texts read for their times in time in proportion to their length (steps hold up to 4,000 characters)', { timeout: 60_000 }, () => {
  // step-time-read.ts: one global tokenising pass, then a bounded look ahead and back from each token
  const texts: Record<string, (n: number) => string> = {
    'numbers and units': (n) => '1 2 minutes '.repeat(n / 12),
    'ranges that never end': (n) => '20 to '.repeat(n / 6),
    'qualifiers': (n) => 'for about at least up to '.repeat(n / 25),
    'hyphenated words': (n) => `${'a-'.repeat(n / 2)}`,
    'fractions': (n) => '1/'.repeat(n / 2),
    'cooking words and no time': (n) => 'bake simmer rest '.repeat(n / 17),
    'dutch ovens': (n) => 'dutch oven '.repeat(n / 11),
    'times in parts and alternatives': (n) => 'bake 5 minutes or 6 minutes per side, '.repeat(n / 38),
  }
  for (const [name, make] of Object.entries(texts)) {
    it(`${name}: 2,000 and 4,000 characters`, () => {
      const t = doublingRatio(make, (text) => readStepTime(text), 2000, { reps: 20, rounds: 7 })
      expect(t.ratio, JSON.stringify(t)).toBeLessThan(3)
    })
  }
})
