// A step's short name and "starts together with the step before": the schema.org import's reading
// of them (schema.org HowToStep `name` and `text`, https://schema.org/HowToStep), the export, and
// the editor's one checkbox over the start-start link (plan-types.ts PlanLink kinds). Recipe texts
// are Brackenford Test Kitchen's (invented).
import { describe, expect, it } from 'vitest'
import { importSchemaOrgRecipe } from '../../shared/utils/schemaorg-import'
import { exportSchemaOrgRecipe } from '../../shared/utils/schemaorg-export'
import { readsAsAlongside, setStartsWithStepBefore, startsWithStepBefore, type EditorStepLinks } from '../../shared/utils/step-links'
import { cleanStepName, importedStepName, stepNameProblem } from '../../shared/utils/step-name'
import { recipeCreateSchema } from '../../shared/utils/recipe-schemas'
import { fieldLabel } from '../../shared/utils/field-labels'

const recipe = (recipeInstructions: unknown) => ({
  '@context': 'https://schema.org', '@type': 'Recipe', name: 'Brackenford weeknight rigatoni', recipeYield: '4 servings',
  recipeIngredient: ['400 g rigatoni', '1 onion', '2 tbsp olive oil'], recipeInstructions,
})
const stepsOf = (instructions: unknown) => importSchemaOrgRecipe(recipe(instructions)).recipe.steps

describe('import: "While …", "Meanwhile" and the like start a step together with the one before', () => {
  const instructions = [
    { '@type': 'HowToStep', text: 'Peel and finely chop the onion.' },
    { '@type': 'HowToStep', text: 'Meanwhile, bring a large pot of salted water to the boil (about 10 minutes).' },
    { '@type': 'HowToStep', text: 'Warm the oil in a wide pan and soften the onion for 8 minutes.' },
    { '@type': 'HowToStep', text: 'While the onion softens, grate the parmesan.' },
    { '@type': 'HowToStep', text: 'Cook the rigatoni for 11 minutes, then drain, keeping a mugful of the water.' },
    { '@type': 'HowToStep', text: 'In the meantime, warm the bowls in a low oven.' },
    { '@type': 'HowToStep', text: 'At the same time, toast the breadcrumbs in a dry pan until golden.' },
    { '@type': 'HowToStep', text: 'Toss the pasta with the sauce, loosening it with the cooking water a splash at a time.' },
  ]
  it('links each such step to the step before with a start-start link and no lag; the others follow by default', () => {
    const steps = stepsOf(instructions)
    expect(steps.map((s) => s.links ?? [])).toEqual([
      [], [{ step: 1, kind: 'start-start', lag: 0 }], [], [{ step: 3, kind: 'start-start', lag: 0 }],
      [], [{ step: 5, kind: 'start-start', lag: 0 }], [{ step: 6, kind: 'start-start', lag: 0 }], [],
    ])
    expect(steps.every((s) => s.after.length === 0)).toBe(true)
  })
  it('not for the first step, and only at the start of the text', () => {
    const steps = stepsOf([
      'Meanwhile, heat the oven to 200 °C.',
      'Stir the sauce while it bubbles.',
      'Cook the pasta; meanwhile warm the plates.',
    ])
    expect(steps.map((s) => s.links)).toEqual([undefined, undefined, undefined])
  })
  it('reads plain Text instructions too, one step a line', () => {
    const steps = stepsOf('1. Put the rigatoni water on to boil.\n2. Whilst it heats, slice the onion.')
    expect(steps[1]!.links).toEqual([{ step: 1, kind: 'start-start', lag: 0 }])
  })
  it('the openings it knows, and words that only look like them', () => {
    for (const t of ['While the water heats, chop the onion.', 'Meanwhile make the dressing.', '“Meanwhile,” she says, “stir.”', 'In the meantime, whisk the eggs.',
      'At the same time, warm the milk.', 'whilst the dough proves, make the filling']) expect(readsAsAlongside(t), t).toBe(true)
    for (const t of ['Whisk the eggs while the butter melts.', 'Meanwhilst', 'At the end, season.', 'Wholemeal flour goes in next.', 'Time the rest: 20 minutes.']) {
      expect(readsAsAlongside(t), t).toBe(false)
    }
  })
  it('a Hobline export says its own links: the text is not read again, and a start-together link comes back', () => {
    const steps = stepsOf(instructions)
    const draft = { ...importSchemaOrgRecipe(recipe(instructions)).recipe, steps: steps.map((s, i) => (i === 1 ? { ...s, links: [] } : s)) }
    const back = importSchemaOrgRecipe(JSON.stringify(exportSchemaOrgRecipe(draft))).recipe.steps
    expect(back[1]!.links).toBeUndefined()
    expect(back[3]!.links).toEqual([{ step: 3, kind: 'start-start', lag: 0 }])
  })
  it('the imported recipe passes the same checks as a save', () => {
    expect(recipeCreateSchema.safeParse(importSchemaOrgRecipe(recipe(instructions)).recipe).success).toBe(true)
  })
})

describe('import: a HowToStep name becomes the short name unless it only repeats the text', () => {
  it('keeps a real name, drops the text repeated, its first words (cut off or not), "Step 3" and long ones', () => {
    const steps = stepsOf([
      { '@type': 'HowToStep', name: 'Pasta water', text: 'Bring a large pot of salted water to the boil (about 10 minutes).' },
      { '@type': 'HowToStep', name: 'Peel and finely chop the onion.', text: 'Peel and finely chop the onion.' },
      { '@type': 'HowToStep', name: 'Warm the oil in a wide…', text: 'Warm the oil in a wide pan and soften the onion.' },
      { '@type': 'HowToStep', name: 'Cook the rigatoni', text: 'Cook the rigatoni for 11 minutes, then drain.' },
      { '@type': 'HowToStep', name: 'Step 5', text: 'Toss the pasta with the sauce.' },
      { '@type': 'HowToStep', name: 'Toss everything together in the pan with a splash of water', text: 'Toss the pasta with the sauce.' },
      { '@type': 'HowToStep', name: '  Sauce  simmer ', text: 'Simmer the sauce for 15 minutes.' },
      { '@type': 'HowToStep', name: 'Grate the parmes...', text: 'Grate the parmesan.' },
    ])
    expect(steps.map((s) => s.name)).toEqual(['Pasta water', null, null, null, null, null, 'Sauce simmer', null])
  })
  it('a step that has only a name takes it as its text and has no short name', () => {
    const [s] = stepsOf([{ '@type': 'HowToStep', name: 'Rest the dough for an hour.' }])
    expect(s).toMatchObject({ text: 'Rest the dough for an hour.', name: null })
  })
  it('steps from plain Text have none', () => {
    expect(importedStepName(undefined, 'Chop.')).toBeNull()
    expect(stepsOf('Chop the onion.')[0]!.name).toBeNull()
  })
  it('exports the short name as the HowToStep name, only when there is one', () => {
    const draft = importSchemaOrgRecipe(recipe([{ '@type': 'HowToStep', name: 'Pasta water', text: 'Boil the water.' }, 'Chop the onion.'])).recipe
    const ld = exportSchemaOrgRecipe(draft)
    const [a, b] = ld.recipeInstructions as Array<Record<string, unknown>>
    expect(a!.name).toBe('Pasta water')
    expect(b).not.toHaveProperty('name')
  })
})

describe('saving a short name', () => {
  const body = (name: unknown) => ({ title: 'Rigatoni', servings: 4, steps: [{ text: 'Boil the water.', name }] })
  it('is trimmed, empty is none, and at most 40 characters', () => {
    const parse = (name: unknown) => recipeCreateSchema.parse(body(name)).steps[0]!.name
    expect(parse('  Pasta water ')).toBe('Pasta water')
    expect(parse('   ')).toBeNull()
    expect(parse(undefined)).toBeNull()
    expect(parse('x'.repeat(40))).toHaveLength(40)
    const bad = recipeCreateSchema.safeParse(body('x'.repeat(41)))
    expect(bad.success).toBe(false)
    expect(bad.error!.issues[0]).toMatchObject({ path: ['steps', 0, 'name'], message: 'keep it to 40 characters, such as "Pasta water".' })
  })
  it('the editor says what to fix, naming the field by its label', () => {
    expect(stepNameProblem('The big pot of salted water for the rigatoni', 3)).toBe('Step 3, short name: keep it to 40 characters (it has 44).')
    expect(stepNameProblem('  Pasta  water ', 3)).toBeNull()
    expect(cleanStepName('  Pasta  water ')).toBe('Pasta water')
    expect(cleanStepName('   ')).toBeNull()
    expect(fieldLabel('steps.2.name')).toBe('Step 3, short name')
    expect(fieldLabel('steps.2.text')).toBe('Step 3, what to do')
  })
})

describe('the editor\'s "Starts together with the step before"', () => {
  const row = (after: string[] = [], links: EditorStepLinks['links'] = []): EditorStepLinks => ({ after, links })
  it('ticked: a start-start link from the step before replaces following it; unticked: back to following it', () => {
    const onion = row(['water'])
    setStartsWithStepBefore(onion, 'water', true)
    expect(startsWithStepBefore(onion, 'water')).toBe(true)
    expect(onion).toEqual({ after: [], links: [{ stepUid: 'water', kind: 'start-start', lag: 0 }] })
    setStartsWithStepBefore(onion, 'water', true)
    expect(onion.links).toHaveLength(1)
    setStartsWithStepBefore(onion, 'water', false)
    expect(startsWithStepBefore(onion, 'water')).toBe(false)
    // Waits for the step before again, as the editor makes a new step (server/utils/cook-plan.ts plans it after it).
    expect(onion).toEqual({ after: ['water'], links: [] })
    // A step that waits for steps the cook chose keeps just those.
    const drain = row(['pasta'])
    setStartsWithStepBefore(drain, 'sauce', true)
    setStartsWithStepBefore(drain, 'sauce', false)
    expect(drain).toEqual({ after: ['pasta'], links: [] })
  })
  it('keeps the step\'s other links; unticked, the step waits for the step before again', () => {
    const sauce = row([], [{ stepUid: 'roast', kind: 'finish-together', lag: 300 }])
    setStartsWithStepBefore(sauce, 'lentils', true)
    expect(sauce.links).toEqual([{ stepUid: 'roast', kind: 'finish-together', lag: 300 }, { stepUid: 'lentils', kind: 'start-start', lag: 0 }])
    setStartsWithStepBefore(sauce, 'lentils', false)
    expect(sauce).toEqual({ after: ['lentils'], links: [{ stepUid: 'roast', kind: 'finish-together', lag: 300 }] })
  })
  it('means nothing for the first step, and a start-start link with a lag is not it', () => {
    const first = row()
    setStartsWithStepBefore(first, undefined, true)
    expect(first).toEqual({ after: [], links: [] })
    expect(startsWithStepBefore(first, undefined)).toBe(false)
    expect(startsWithStepBefore(row([], [{ stepUid: 'water', kind: 'start-start', lag: 120 }]), 'water')).toBe(false)
  })
})
