// An episode's call sheet: gathers the plain data (episode, studio, crew, the show's planned times,
// steps, ingredients, the cook plan's busiest moment) for buildCallSheet (shared/utils/call-sheet.ts),
// saves what the producer writes over the version they read, and sends the sheet to every crew member
// with its iCalendar event, keeping a log of each send and the snapshot later sends are compared to.
import { createHash } from 'node:crypto'
import { CallSheet, CallSheetSend, RecipeIngredient } from '../db/models'
import { buildCallSheet, callSheetChanges, callSheetSnapshot, peakUse, type CallSheetSnapshot } from '../../shared/utils/call-sheet'
import type { CallSheetBody } from '../../shared/utils/call-sheet-schema'
import { DomainError } from '../../shared/utils/domain-error'
import { dateTimeInZone } from '../../shared/utils/time-zone'
import { planCook } from '../../shared/utils/plan'
import { PlanError } from '../../shared/utils/plan-types'
import { callSheetEvent, callSheetMail } from '../mail/call-sheet-mail'
import { episodePlanSteps } from './cook-plan'
import { listMembers } from './crew'
import { loadEpisodeRunOrder } from './episodes'
import { studioSettings } from './recipes'
import { episodeShow } from './show'

type RunOrder = Awaited<ReturnType<typeof loadEpisodeRunOrder>>

/** The most burners and oven dishes the cook plan holds at once; null when the planner refuses the episode. */
function planPeak(episode: RunOrder, kitchen: Awaited<ReturnType<typeof studioSettings>>['kitchen']) {
  const { input } = episodePlanSteps(episode)
  try {
    const plan = planCook({ steps: input, kitchen })
    const station = new Map(input.map((s) => [s.id, s.station ?? null]))
    const on = (name: string) => plan.steps.filter((p) => station.get(p.id) === name)
    return { burner: peakUse(on('burner')), oven: peakUse(on('oven')) }
  } catch (error) {
    if (error instanceof PlanError) return null
    throw error
  }
}

async function detailsOf(episodeId: number) {
  const row = await CallSheet.findByPk(episodeId)
  return {
    version: row?.version ?? 0,
    callTime: row?.callTime ?? null, place: row?.place ?? null, hospital: row?.hospital ?? null,
    crewCalls: row?.crewCalls ?? [],
  }
}

export function snapshotHash(snapshot: CallSheetSnapshot): string {
  return createHash('sha256').update(JSON.stringify(snapshot)).digest('hex')
}

/** The sheet as it is now, what the producer wrote on it, and what changed since the last send. */
export async function loadCallSheet(episodeId: number) {
  await useDb()
  const episode = await loadEpisodeRunOrder(episodeId)
  const [settings, crew, show, details] = await Promise.all([
    studioSettings(episode.studioId), listMembers(episode.studioId), episodeShow(episodeId), detailsOf(episodeId),
  ])
  const recipeIds = episode.segments.flatMap((s) => (s.recipeId ? [s.recipeId] : []))
  const ingredients = recipeIds.length ? await RecipeIngredient.findAll({ where: { recipeId: recipeIds } }) : []
  const planned = new Map(show.segments.map((s) => [s.id, s.totalMs]))
  const sheet = buildCallSheet({
    episode: { id: episode.id, title: episode.title, shootDate: episode.shootDate },
    studio: { name: settings.name, locale: settings.locale, timeZone: settings.timeZone, units: show.units, kitchen: settings.kitchen },
    details,
    crew: crew.map((c) => ({ userId: c.userId, name: c.name, email: c.email, role: c.role })),
    segments: episode.segments.map((s) => ({ id: s.id, kind: s.kind, title: s.title, plannedMs: planned.get(s.id) ?? 0 })),
    steps: episode.segments.flatMap((s) => s.steps.map((st) => ({ station: st.station, cautions: st.cautions }))),
    ingredients: ingredients.map((i) => ({ item: i.item, allergens: i.allergens as never, allergenState: i.allergenState })),
    peak: planPeak(episode, settings.kitchen),
  })
  const snapshot = callSheetSnapshot(sheet)
  const sends = await CallSheetSend.findAll({ where: { episodeId }, order: [['sentAt', 'DESC'], ['id', 'DESC']], limit: 20 })
  const last = sends[0]
  return {
    episodeId, studioId: episode.studioId, sheet, details, snapshot,
    hash: snapshotHash(snapshot),
    /** What changed since the last send, one line each; [] when never sent or unchanged. */
    changes: last ? callSheetChanges(last.snapshot, snapshot) : [],
    sends: sends.map((s) => ({
      id: s.id, sentAt: s.sentAt.toISOString(), sentText: dateTimeInZone(s.sentAt, settings.locale, settings.timeZone),
      sentByName: s.sentByName, recipients: s.recipients, changes: s.changes, hash: s.hash,
    })),
  }
}

export type CallSheetView = Awaited<ReturnType<typeof loadCallSheet>>

/** Saves the call time, place, hospital and crew call times over the version the producer read (0: none saved yet). */
export async function saveCallSheet(episodeId: number, studioId: number, body: CallSheetBody) {
  const sequelize = await useDb()
  if (body.crewCalls?.length) {
    const crew = new Set((await listMembers(studioId)).map((m) => m.userId))
    const i = body.crewCalls.findIndex((c) => !crew.has(c.userId))
    if (i >= 0) throw new DomainError('invalid', `Crew call ${i + 1}, crew member: choose someone from the studio's crew list.`, { field: `crewCalls.${i}.userId` })
  }
  const fields = {
    ...(body.callTime !== undefined ? { callTime: body.callTime || null } : {}),
    ...(body.place !== undefined ? { place: body.place || null } : {}),
    ...(body.hospital !== undefined ? { hospital: body.hospital || null } : {}),
    ...(body.crewCalls !== undefined ? { crewCalls: body.crewCalls } : {}),
  }
  await sequelize.transaction(async () => {
    const row = await CallSheet.findByPk(episodeId)
    const current = row?.version ?? 0
    if (current !== body.version) {
      throw new DomainError('conflict', `Someone else saved this call sheet while you were editing (now version ${current}). Your changes are still on the page: compare, then save again.`, {
        data: { current: await detailsOf(episodeId) },
      })
    }
    if (row) await row.update({ ...fields, version: current + 1 })
    else await CallSheet.create({ episodeId, callTime: null, place: null, hospital: null, ...fields, version: 1 })
  })
  return loadCallSheet(episodeId)
}

/**
 * Sends the sheet to every crew member (HTML, text and the iCalendar event), then logs the send.
 * `hash` is the sheet the producer read: a sheet changed since is refused, so what is sent is what
 * they saw, and its changes are the ones the page showed.
 */
export async function sendCallSheet(episodeId: number, sender: { id: number; name: string }, hash: string, site: string) {
  const view = await loadCallSheet(episodeId)
  const { sheet } = view
  if (view.hash !== hash) {
    throw new DomainError('conflict', 'The call sheet changed since you opened it. Read it again (the page shows the new one), then send.', { data: { hash: view.hash } })
  }
  if (!sheet.shootDate) throw new DomainError('invalid', 'Shoot date: choose the day of the shoot on the episode page before sending the call sheet.', { field: 'shootDate' })
  if (!sheet.callTime) throw new DomainError('invalid', 'Call time: write the time the crew is called, such as 08:30, before sending the call sheet.', { field: 'callTime' })
  const recipients = sheet.crew.filter((c) => c.email)
  if (!recipients.length) throw new DomainError('invalid', 'The crew list is empty: invite the crew before sending the call sheet.')
  const link = `${site}/episodes/${episodeId}/call-sheet`
  const sequence = await CallSheetSend.count({ where: { episodeId } })
  const event = callSheetEvent(sheet, { uid: `call-sheet-${episodeId}@${new URL(site).hostname}`, sequence, link })
  const sent: typeof recipients = []
  const log = () => CallSheetSend.create({
    episodeId, sentBy: sender.id, sentByName: sender.name, sentAt: new Date(),
    recipients: sent.map((r) => ({ name: r.name, email: r.email })), changes: view.changes, snapshot: view.snapshot, hash: view.hash,
  })
  for (const person of recipients) {
    const mail = callSheetMail(sheet, { changes: view.changes, link, recipient: person.name })
    try {
      await sendMail({
        to: `"${person.name.replace(/["\\]/g, '')}" <${person.email}>`, ...mail, kind: 'call-sheet', studioId: view.studioId,
        attachments: [{ filename: 'shoot.ics', content: event, contentType: 'text/calendar; charset=utf-8; method=PUBLISH' }],
      })
    } catch (error) {
      // Those who already have it are logged, so the next send says what changed for them too.
      if (sent.length) await log()
      throw error
    }
    sent.push(person)
  }
  await log()
  return loadCallSheet(episodeId)
}
