// The rehearsal report of a shoot (shared/utils/rehearsal-report.ts over the stored state), the
// suggested ranges from every rehearsal of the same recipes, and "adopt the actuals": the suggested
// ranges written as the steps' planned ranges (recipe_steps duration_min/duration_max) in one
// transaction over the recipe versions the report showed, kept in range_adoptions (migration 0017)
// so the producer can undo it while nobody has saved those recipes since.
import { QueryTypes } from 'sequelize'
import { Recipe, RecipeStep } from '../db/models'
import { DomainError } from '../../shared/utils/domain-error'
import { rehearsalReport, stepActuals, suggestedRanges } from '../../shared/utils/rehearsal-report'
import { STATUS_WORDS } from '../../shared/utils/shoot-words'
import { dateTimeInZone } from '../../shared/utils/time-zone'
import { shootServerNow } from '../shoot/clock'

export const SUGGESTED_RANGE_RULE = 'Suggested range: the shortest to the longest time the step took across the studio\'s rehearsals of its recipe, '
  + 'in kitchen time, rounded outward to the whole minute (to 5 seconds under a minute). A wait is timed by its timer, from its start to Done; '
  + 'any other step by the time the script stayed on it.'

interface Range { min: number | null; max: number | null }
interface Change { recipeId: number; stepId: number; before: Range; after: Range }
type AdoptionRow = { id: number; changes: string; versions: string; by_name: string | null; at: number; undone_at: number | null }

async function latestAdoption(shootId: number) {
  const db = await useDb()
  const [row] = await db.query<AdoptionRow>(
    'SELECT id, changes, versions, by_name, at, undone_at FROM range_adoptions WHERE shoot_id = ? ORDER BY id DESC LIMIT 1',
    { replacements: [shootId], type: QueryTypes.SELECT },
  )
  if (!row || row.undone_at !== null) return null
  const changes = JSON.parse(row.changes) as Change[]
  return { id: row.id, byName: row.by_name, at: new Date(Number(row.at)).toISOString(), steps: changes.length }
}

/** The report of a rehearsal, with each step's current range and the range all rehearsals suggest. */
export async function loadRehearsalReport(shootId: number) {
  const { store } = useShoot()
  const row = await store.read(shootId)
  if (!row) throw new DomainError('not-found', 'There is no such shoot.')
  if (row.mode !== 'rehearsal') {
    throw new DomainError('not-found', 'A recording has no rehearsal report; open its take log from the list of shoots.')
  }
  const settings = await studioSettings(row.studioId)
  const now = shootServerNow()
  const state = row.state
  const report = rehearsalReport(state, now)
  const recipeIds = [...new Set(report.steps.map((s) => s.recipeId).filter((x): x is string => !!x))]
  const timings = recipeIds.length ? await store.rehearsalTimings(row.studioId, recipeIds) : []
  const measured = timings.map((t) => stepActuals({ ...t, plan: { steps: t.planSteps } }, now)).filter((m) => m.size > 0)
  const suggested = suggestedRanges(measured)
  const numericSteps = report.steps.map((s) => Number(s.stepId)).filter((n) => Number.isInteger(n) && n > 0)
  const numericRecipes = recipeIds.map(Number).filter((n) => Number.isInteger(n) && n > 0)
  const [steps, recipes] = await Promise.all([
    RecipeStep.findAll({ where: { id: numericSteps }, attributes: ['id', 'recipeId', 'durationMin', 'durationMax'] }),
    Recipe.findAll({ where: { id: numericRecipes, studioId: row.studioId }, attributes: ['id', 'title', 'version', 'updatedAt'] }),
  ])
  const recipeById = new Map(recipes.map((r) => [String(r.id), r]))
  const stepById = new Map(steps.filter((s) => recipeById.has(String(s.recipeId))).map((s) => [String(s.id), s]))
  const started = state.startedAtServerMs ?? now
  return {
    shoot: {
      id: Number(row.id), studioId: row.studioId, title: row.title, episodeId: row.episodeId,
      status: state.status, statusText: STATUS_WORDS[state.status].label,
      speed: state.clock.speed, started: state.startedAtServerMs !== null,
      dateText: dateTimeInZone(new Date(started), settings.locale, settings.timeZone),
    },
    rule: SUGGESTED_RANGE_RULE,
    steps: report.steps.map((s) => {
      const stored = stepById.get(s.stepId)
      return {
        ...s,
        current: stored ? { min: stored.durationMin, max: stored.durationMax } : null,
        suggested: stored ? suggested.get(s.stepId) ?? null : null,
      }
    }),
    segments: report.segments,
    overruns: report.overruns,
    plannedMakespanMs: report.plannedMakespanMs,
    actualLengthMs: report.actualLengthMs,
    rehearsals: measured.length,
    recipes: recipes.map((r) => ({ id: r.id, title: r.title, version: r.version, updatedAt: new Date(r.updatedAt).toISOString() })),
    adoption: await latestAdoption(shootId),
  }
}

function conflict(title: string, version: number | undefined, what: string) {
  return new DomainError('conflict', `“${title}” was saved by someone else ${what} (now version ${version ?? '?'}). Open the report again to see its ranges.`)
}

/**
 * Writes each measured step's suggested range as its planned range, in one transaction, only over
 * the recipe versions the caller read (as the recipe editor saves); a stale one is a 409 and nothing
 * is written. The ranges before are kept for undo.
 */
export async function adoptActuals(shootId: number, studioId: number, read: Array<{ id: number; version: number }>, by: { id: number; name: string }) {
  const report = await loadRehearsalReport(shootId)
  const changes: Change[] = report.steps.flatMap((s) => {
    if (!s.suggested || !s.current || !s.recipeId) return []
    if (s.current.min === s.suggested.min && s.current.max === s.suggested.max) return []
    return [{ recipeId: Number(s.recipeId), stepId: Number(s.stepId), before: { ...s.current }, after: { min: s.suggested.min, max: s.suggested.max } }]
  })
  if (!changes.length) throw new DomainError('no-change', 'Every measured step already has the range its rehearsals suggest; there is nothing to adopt.')
  const versions = new Map(read.map((r) => [r.id, r.version]))
  const titles = new Map(report.recipes.map((r) => [r.id, r]))
  const touched = [...new Set(changes.map((c) => c.recipeId))]
  const missing = touched.filter((id) => !versions.has(id))
  if (missing.length) {
    throw new DomainError('invalid', `Recipe versions: name the version of “${titles.get(missing[0]!)?.title ?? 'a recipe'}” you read in the report; open the report again.`, { field: 'recipes' })
  }
  const sequelize = await useDb()
  const saved: Record<string, number> = {}
  const id = await sequelize.transaction(async () => {
    for (const recipeId of touched) {
      const version = versions.get(recipeId)!
      const [n] = await Recipe.update({ version: version + 1 }, { where: { id: recipeId, version } })
      if (n === 0) {
        const now = await Recipe.findByPk(recipeId, { attributes: ['version', 'title'] })
        throw conflict(now?.title ?? titles.get(recipeId)?.title ?? 'A recipe', now?.version, 'since you opened this report')
      }
      saved[recipeId] = version + 1
    }
    for (const c of changes) await writeRange(c.recipeId, c.stepId, c.after)
    await sequelize.query(
      'INSERT INTO range_adoptions (studio_id, shoot_id, changes, versions, by_user, by_name, at) VALUES (?, ?, ?, ?, ?, ?, ?)',
      { replacements: [studioId, shootId, JSON.stringify(changes), JSON.stringify(saved), by.id, by.name, Date.now()] },
    )
    const [last] = await sequelize.query<{ id: number }>('SELECT max(id) AS id FROM range_adoptions WHERE shoot_id = ?', { replacements: [shootId], type: QueryTypes.SELECT })
    return Number(last!.id)
  })
  useShoot().scriptsMayHaveChanged()
  return { adopted: changes.length, adoptionId: id }
}

/** A step's planned range, its time no longer "read from the text" (a person chose it). */
async function writeRange(recipeId: number, stepId: number, range: Range) {
  const step = await RecipeStep.findOne({ where: { id: stepId, recipeId } })
  if (!step) return
  const readFromText = (step.readFromText ?? []).filter((f) => f !== 'duration')
  await step.update({ durationMin: range.min, durationMax: range.max, readFromText })
}

/** Puts back the ranges an adoption replaced, if nobody has saved those recipes since. */
export async function undoAdoption(shootId: number, adoptionId: number) {
  const db = await useDb()
  const [row] = await db.query<AdoptionRow>(
    'SELECT id, changes, versions, by_name, at, undone_at FROM range_adoptions WHERE id = ? AND shoot_id = ?',
    { replacements: [adoptionId, shootId], type: QueryTypes.SELECT },
  )
  if (!row) throw new DomainError('not-found', 'This rehearsal has no such adoption of its actuals to undo; open the report again.')
  if (row.undone_at !== null) throw new DomainError('conflict', 'These ranges were already put back.')
  const changes = JSON.parse(row.changes) as Change[]
  const saved = JSON.parse(row.versions) as Record<string, number>
  await db.transaction(async () => {
    for (const [recipeId, version] of Object.entries(saved)) {
      const [n] = await Recipe.update({ version: version + 1 }, { where: { id: Number(recipeId), version } })
      if (n === 0) {
        const now = await Recipe.findByPk(Number(recipeId), { attributes: ['version', 'title'] })
        if (!now) continue // the recipe was deleted: nothing of it to put back
        throw conflict(now.title, now.version, 'after the actuals were adopted, so undo would overwrite that save; set its ranges in the recipe editor')
      }
    }
    for (const c of changes) await writeRange(c.recipeId, c.stepId, c.before)
    await db.query('UPDATE range_adoptions SET undone_at = ? WHERE id = ?', { replacements: [Date.now(), adoptionId] })
  })
  useShoot().scriptsMayHaveChanged()
  return { restored: changes.length }
}
