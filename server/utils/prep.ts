// The episode's prep list (shared/utils/prep-list.ts) over stored recipes and the cook plan for the
// studio's kitchen (planCook through planEpisode). When the plan cannot be made, the list keeps
// recipe order and says why.
import { DomainError } from '../../shared/utils/domain-error'
import { buildPrepList, type PrepRecipe } from '../../shared/utils/prep-list'

export async function episodePrep(episodeId: number, studioId: number) {
  const episode = await loadEpisodeRunOrder(episodeId)
  const recipes: PrepRecipe[] = []
  for (const s of episode.segments) {
    if (!s.recipeId) continue
    const r = await loadRecipe(s.recipeId)
    if (!r) continue
    recipes.push({
      recipeId: r.id, title: r.title,
      ingredients: r.ingredients.map((i) => ({ key: i.key, item: i.item, prep: i.prep, allergens: i.allergens })),
      steps: s.steps.map((st) => ({ id: st.id, position: st.position, text: st.text })),
    })
  }
  const kitchen = (await studioSettings(studioId)).kitchen
  let starts = new Map<number, number>()
  let planProblem: string | null = null
  try {
    const plan = await planEpisode(episodeId, kitchen)
    starts = new Map(plan.steps.map((p) => [p.stepId, p.start]))
  } catch (e) {
    if (!(e instanceof DomainError)) throw e
    planProblem = `The cook plan could not be made (${e.message}), so the prep keeps the recipes' order.`
  }
  return {
    episode: { id: episode.id, title: episode.title, servings: episode.servings },
    planProblem,
    tasks: buildPrepList(recipes, starts),
  }
}
