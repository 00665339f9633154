// Puts the demo dishes and prices into the demo studio, through the app's own parser and
// allergen suggestions, so the seed shows what a cook would get by typing the same lines.
import { parseQuantity } from '../../shared/utils/quantity'
import { suggestAllergens } from '../../shared/utils/allergens'
import { makeIngredientKey, stepTokenProblems } from '../../shared/utils/step-text'
import { demoEpisode, demoPrices, demoRecipes, type DemoRecipe } from './demo-recipes'
import { demoCallSheet, demoShow, demoShowSettings } from './demo-show'
import { CallSheet, Episode, EpisodeSegment, Price, Recipe, RecipeIngredient, RecipeStep } from './models'

/** The demo dishes, prices and episode; `hostId` presents the episode. */
export async function seedDemoRecipes(studioId: number, currency: string, hostId: number | null = null) {
  const priceIds = new Map<string, number>()
  for (const [item, packageSize, packageUnit, priceMinor, shop] of demoPrices) {
    const row = await Price.create({ studioId, item, packageSize, packageUnit, priceMinor, currency, shop, boughtOn: '2026-11-24' })
    priceIds.set(item, row.id)
  }
  const recipes: { recipe: Recipe; photo: DemoRecipe['photo'] }[] = []
  for (const demo of demoRecipes) {
    const recipe = await Recipe.create({
      studioId, title: demo.title, summary: demo.summary, servings: demo.servings, yieldText: null, tags: demo.tags, notes: null,
      times: { prep: null, cook: null, total: demo.totalMinutes * 60 },
    })
    const keys: string[] = []
    for (const [position, [line, price]] of demo.lines.entries()) {
      const q = parseQuantity(line)
      const key = makeIngredientKey(q.item, keys)
      keys.push(key)
      const { eu, us } = suggestAllergens(q.item)
      await RecipeIngredient.create({
        recipeId: recipe.id, position: position + 1, key, min: q.min, max: q.max, unit: q.unit, item: q.item, prep: q.prep,
        optional: q.optional, toTaste: q.toTaste, group: null, allergens: { eu, us }, priceId: priceIds.get(price)!, stated: q.stated,
      })
    }
    for (const [position, step] of demo.steps.entries()) {
      const problems = stepTokenProblems(step.text, keys)
      if (problems.length) throw new Error(`Demo recipe "${demo.title}", step ${position + 1}: ${problems.map((p) => p.reason).join('; ')}`)
      await RecipeStep.create({
        recipeId: recipe.id, position: position + 1, name: step.name ?? null, text: step.text, script: step.script ?? [], handsOn: step.handsOn,
        durationMin: step.minutes ? step.minutes[0] * 60 : null, durationMax: step.minutes ? step.minutes[1] * 60 : null,
        station: step.station ?? null, after: step.after ?? [], links: step.links ?? [],
        cameraShot: step.shot ?? null, cameraNote: step.note ?? null, cautions: step.cautions ?? [], group: null,
      })
    }
    recipes.push({ recipe, photo: demo.photo })
  }
  const episode = await Episode.create({ studioId, title: demoEpisode.title, ...demoShowSettings, hostId })
  const show = demoShow(recipes.map((r) => r.recipe.id))
  await EpisodeSegment.bulkCreate(show.map((s, i) => ({
    episodeId: episode.id, segKey: s.id, position: i + 1, kind: s.kind, recipeId: s.recipeId ?? null, title: s.kind === 'recipe' ? null : s.title,
    script: s.script, closing: s.closing ?? [],
  })))
  await CallSheet.create({ episodeId: episode.id, ...demoCallSheet })
  return recipes
}
