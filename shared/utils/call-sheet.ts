// The call sheet of a shoot day: when and where the crew meets, who is on it and how to reach them,
// the run order with planned start times, the kitchen equipment the plan uses, the allergens on set,
// the safety notes, and the nearest hospital. Pure: built from plain data the server gathers
// (server/utils/call-sheet.ts), so the page, the mail and the tests read the same sheet.
//
// Planned start times: the first segment starts at the call time; each next one after the planned
// length of every segment before it (the show's planned times, server/utils/show.ts: reading time at
// the presenter's pace plus a recipe's share of the cook plan), rounded to the minute for the sheet.
// Our own rule: no standard times a shoot day.
import { EU_ALLERGENS, US_ALLERGENS, type IngredientAllergens } from './allergens'
import { cautionsFor, countryOfLocale, isCautionId, type CautionId } from './cautions'
import type { KitchenProfile } from './plan-types'
import { STUDIO_ROLE_LABELS, isStudioRole } from './roles'
import { SEGMENT_WORDS, type SegmentKind } from './show-segments'
import { zonedTimeToUtc } from './time-zone'

/** What the producer writes on the call sheet; everything else comes from the episode. */
export interface CallSheetDetails {
  /** Local time of day, "08:30", in the studio's time zone; null until set. */
  callTime: string | null
  place: string | null
  /** The nearest hospital with emergency care, as the producer writes it; null leaves a line to fill by hand. */
  hospital: string | null
  /** Crew members called at another time than the call time. */
  crewCalls: { userId: number; callTime: string }[]
}

export interface CallSheetInput {
  episode: { id: number; title: string; shootDate: string | null }
  studio: { name: string; locale: string; timeZone: string; units: 'metric' | 'us'; kitchen: KitchenProfile }
  details: CallSheetDetails
  crew: { userId: number; name: string; email: string; role: string }[]
  /** The run order with each segment's planned length (the show's totalMs). */
  segments: { id: string; kind: SegmentKind; title: string; plannedMs: number }[]
  /** Every step of the episode's recipes: its station and cautions. */
  steps: { station: string | null; cautions: readonly string[] }[]
  /** Every ingredient of the episode's recipes, with its allergens. */
  ingredients: { item: string; allergens: IngredientAllergens; allergenState?: string }[]
  /** The most of each station the cook plan uses at once; null when the planner refused the episode. */
  peak: { burner: number; oven: number } | null
}

export interface CallSheetRow {
  id: string
  title: string
  kind: string
  /** Minutes after the call time that the segment is planned to start. */
  startMin: number
  /** "08:30", or null without a call time. */
  start: string | null
  plannedMs: number
}

export interface CallSheet {
  title: string
  studioName: string
  shootDate: string | null
  /** "Thursday, 10 December 2026", or null without a shoot date. */
  dateText: string | null
  callTime: string | null
  timeZone: string
  place: string | null
  hospital: string | null
  crew: { userId: number; name: string; role: string; email: string; callTime: string | null }[]
  runOrder: CallSheetRow[]
  /** Planned length of the whole run order, ms. */
  plannedMs: number
  /** "10:05": when the run order is planned to end, or null without a call time. */
  wrap: string | null
  /** The call as a moment (ISO, UTC) and the planned end, when the date and call time are set. */
  startsAt: string | null
  endsAt: string | null
  equipment: string[]
  allergens: { eu: string[]; us: string[] | null; unchecked: number }
  safety: { id: string; label: string; text: string }[]
}

const TIME = /^([01]\d|2[0-3]):([0-5]\d)$/

export function isCallTime(value: unknown): value is string {
  return typeof value === 'string' && TIME.test(value)
}

/** "08:30" plus `minutes`, on a 24-hour clock ("23:50" + 20 → "00:10", the next day). */
export function addMinutes(time: string, minutes: number): string {
  const [h, m] = time.split(':').map(Number) as [number, number]
  const total = (((h * 60 + m + minutes) % 1440) + 1440) % 1440
  return `${String(Math.floor(total / 60)).padStart(2, '0')}:${String(total % 60).padStart(2, '0')}`
}

/** "Thursday, 10 December 2026": a calendar day in words (English; other locales read as en-GB). */
export function shootDateText(date: string, locale: string): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number]
  const english = /^en(-|$)/i.test(locale) && Intl.DateTimeFormat.supportedLocalesOf([locale]).length > 0
  return new Intl.DateTimeFormat(english ? locale : 'en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' })
    .format(new Date(Date.UTC(y, m - 1, d)))
}

/** The most intervals open at once: [0,10) and [5,15) → 2; [0,5) and [5,10) → 1 (an end frees the station first). */
export function peakUse(intervals: readonly { start: number; end: number }[]): number {
  const events = intervals.flatMap((i) => [[i.start, 1], [i.end, -1]] as const).sort((a, b) => a[0] - b[0] || a[1] - b[1])
  let open = 0
  let most = 0
  for (const [, change] of events) most = Math.max(most, (open += change))
  return most
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`

/** Equipment a caution brings to the set (common kitchen practice). */
const CAUTION_EQUIPMENT: Partial<Record<CautionId, string>> = {
  'knife': 'Sharp knives and boards on damp cloths',
  'hot-oil': 'A lid and a tray beside the hot oil',
  'hot-pan': 'Trivets and dry cloths for hot pans',
  'oven': 'Dry oven gloves',
  'blending-hot': 'Blender with a vented lid, and a folded towel',
  'boiling': 'Large pans for boiling, and a colander in the sink',
  'raw-meat': 'A probe thermometer and separate boards for raw meat or fish',
  'egg-dish': 'A probe thermometer',
  'reheating': 'A probe thermometer',
  'hot-holding': 'A warm place to hold food for its shot, and a probe thermometer',
}

function equipment(input: CallSheetInput, cautions: Set<CautionId>): string[] {
  const stations = new Set(input.steps.map((s) => s.station).filter(Boolean))
  const k = input.studio.kitchen
  const out: string[] = []
  if (stations.has('burner')) {
    const using = input.peak ? `, the plan uses up to ${input.peak.burner} at once` : ''
    out.push(`Hob: ${plural(k.burners, 'burner')} in the kitchen${using}`)
  }
  if (stations.has('oven')) {
    const using = input.peak ? `, the plan uses up to ${plural(input.peak.oven, 'dish', 'dishes')} at once` : ''
    out.push(`Oven: ${plural(k.ovens, 'oven')}, ${plural(k.racksPerOven, 'dish', 'dishes')} each${using}`)
  }
  if (stations.has('counter')) out.push('Counter space for prep')
  const extra = new Set<string>()
  for (const id of cautions) if (CAUTION_EQUIPMENT[id]) extra.add(CAUTION_EQUIPMENT[id]!)
  return [...out, ...extra]
}

function allergens(input: CallSheetInput) {
  const has = (pick: (a: IngredientAllergens) => readonly string[], id: string) => input.ingredients.some((i) => pick(i.allergens).includes(id))
  const eu = EU_ALLERGENS.filter((a) => has((x) => x.eu, a.id)).map((a) => a.label)
  const us = input.studio.units === 'us' ? US_ALLERGENS.filter((a) => has((x) => x.us, a.id)).map((a) => a.label) : null
  const unchecked = input.ingredients.filter((i) => i.allergenState !== 'checked' && (i.allergens.eu.length || i.allergens.us.length)).length
  return { eu, us, unchecked }
}

/** Safety notes for the cautions on set; food held warm for its shot wherever something is cooked. Each defers to local rules where it gives figures. */
function safety(input: CallSheetInput, cautions: Set<CautionId>, onSet: { eu: string[]; us: string[] | null }) {
  const texts = cautionsFor(countryOfLocale(input.studio.locale))
  const order: CautionId[] = ['hot-oil', 'hot-pan', 'oven', 'knife', 'blending-hot', 'boiling', 'raw-meat', 'egg-dish', 'reheating']
  const notes = order.filter((id) => cautions.has(id)).map((id) => ({ id, label: texts[id].label, text: texts[id].text }))
  const names = [...onSet.eu, ...(onSet.us ?? [])]
  if (names.length || cautions.has('allergen')) {
    notes.push({
      id: 'allergen', label: 'Allergens on set',
      text: `Allergens on set${names.length ? `: ${[...new Set(onSet.eu.map((n) => n.split(' (')[0]!))].join(', ')}` : ''}. Tell the crew and any tasters, keep boards and spoons apart, `
        + 'and check the labels: products change. Follow your local food-safety rules.',
    })
  }
  const cooked = input.steps.some((s) => s.station === 'burner' || s.station === 'oven')
  if (cooked || cautions.has('hot-holding')) notes.push({ id: 'hot-holding', label: texts['hot-holding'].label, text: texts['hot-holding'].text })
  return notes
}

export function buildCallSheet(input: CallSheetInput): CallSheet {
  const { details } = input
  const callTime = isCallTime(details.callTime) ? details.callTime : null
  let elapsedMs = 0
  const runOrder = input.segments.map((s) => {
    const startMin = Math.round(elapsedMs / 60_000)
    elapsedMs += Math.max(0, s.plannedMs)
    const kind = SEGMENT_WORDS[s.kind]?.label ?? s.kind
    return { id: s.id, title: s.title, kind, startMin, start: callTime ? addMinutes(callTime, startMin) : null, plannedMs: s.plannedMs }
  })
  const plannedMs = elapsedMs
  const cautions = new Set(input.steps.flatMap((s) => s.cautions).filter(isCautionId))
  const onSet = allergens(input)
  const calls = new Map(details.crewCalls.map((c) => [c.userId, c.callTime]))
  const start = input.episode.shootDate && callTime ? zonedTimeToUtc(input.episode.shootDate, callTime, input.studio.timeZone) : null
  return {
    title: input.episode.title,
    studioName: input.studio.name,
    shootDate: input.episode.shootDate,
    dateText: input.episode.shootDate ? shootDateText(input.episode.shootDate, input.studio.locale) : null,
    callTime,
    timeZone: input.studio.timeZone,
    place: details.place?.trim() || null,
    hospital: details.hospital?.trim() || null,
    crew: input.crew.map((c) => ({
      userId: c.userId, name: c.name, email: c.email,
      role: isStudioRole(c.role) ? STUDIO_ROLE_LABELS[c.role] : c.role,
      callTime: calls.get(c.userId) ?? callTime,
    })),
    runOrder,
    plannedMs,
    wrap: callTime ? addMinutes(callTime, Math.round(plannedMs / 60_000)) : null,
    startsAt: start ? start.toISOString() : null,
    endsAt: start ? new Date(start.getTime() + plannedMs).toISOString() : null,
    equipment: equipment(input, cautions),
    allergens: onSet,
    safety: safety(input, cautions, onSet),
  }
}

/** What a sent sheet is compared by: everything the crew reads, nothing that is only layout. */
export type CallSheetSnapshot = Pick<CallSheet, 'title' | 'dateText' | 'callTime' | 'place' | 'hospital' | 'wrap' | 'equipment'> & {
  crew: { userId: number; name: string; role: string; email: string; callTime: string | null }[]
  runOrder: { id: string; title: string; kind: string; start: string | null }[]
  allergens: string[]
  safety: string[]
}

export function callSheetSnapshot(sheet: CallSheet): CallSheetSnapshot {
  return {
    title: sheet.title, dateText: sheet.dateText, callTime: sheet.callTime, place: sheet.place, hospital: sheet.hospital, wrap: sheet.wrap,
    equipment: sheet.equipment,
    crew: sheet.crew.map(({ userId, name, role, email, callTime }) => ({ userId, name, role, email, callTime })),
    runOrder: sheet.runOrder.map(({ id, title, kind, start }) => ({ id, title, kind, start })),
    allergens: [...sheet.allergens.eu, ...(sheet.allergens.us ?? []).map((a) => `${a} (US)`)],
    safety: sheet.safety.map((s) => s.label),
  }
}

/**
 * The segments that moved: those outside the largest set kept in the same order (a longest increasing
 * subsequence of their old places). Among equal sets, the one that keeps the recipes in place wins,
 * so a sponsor read swapped past a recipe is what "moved".
 */
function movedSegments(before: CallSheetSnapshot['runOrder'], after: CallSheetSnapshot['runOrder']): string[] {
  const place = new Map(before.map((r, i) => [r.id, i]))
  const kept = after.filter((r) => place.has(r.id))
  const weight = (r: { kind?: string }) => 100 + (r.kind === 'Recipe' ? 1 : 0)
  const best = kept.map((r) => weight(r))
  const prev = kept.map(() => -1)
  for (let i = 0; i < kept.length; i++) {
    for (let j = 0; j < i; j++) {
      if (place.get(kept[j]!.id)! < place.get(kept[i]!.id)! && best[j]! + weight(kept[i]!) > best[i]!) {
        best[i] = best[j]! + weight(kept[i]!)
        prev[i] = j
      }
    }
  }
  const stay = new Set<string>()
  for (let i = best.indexOf(Math.max(...best, 0)); i >= 0; i = prev[i]!) stay.add(kept[i]!.id)
  return kept.filter((r) => !stay.has(r.id)).map((r) => r.id)
}

const shown = (v: string | null, empty = 'not set') => v ?? empty
const ordinal = (n: number) => `${n}${n % 10 === 1 && n % 100 !== 11 ? 'st' : n % 10 === 2 && n % 100 !== 12 ? 'nd' : n % 10 === 3 && n % 100 !== 13 ? 'rd' : 'th'}`

function listChange(label: string, before: string[], after: string[]): string[] {
  const added = after.filter((x) => !before.includes(x))
  const removed = before.filter((x) => !after.includes(x))
  if (!added.length && !removed.length) return []
  const parts = [added.length ? `added ${added.join(', ')}` : '', removed.length ? `removed ${removed.join(', ')}` : ''].filter(Boolean)
  return [`${label}: ${parts.join('; ')}`]
}

/** What changed since the sheet last sent, one line each: "Call time: 08:30 → 09:00", "Run order: Sponsor read moved (now 4th, was 3rd)". */
export function callSheetChanges(before: CallSheetSnapshot, after: CallSheetSnapshot): string[] {
  const out: string[] = []
  const field = (label: string, a: string | null, b: string | null, empty?: string) => {
    if (a !== b) out.push(`${label}: ${shown(a, empty)} → ${shown(b, empty)}`)
  }
  field('Episode', before.title, after.title)
  field('Date', before.dateText, after.dateText)
  field('Call time', before.callTime, after.callTime)
  field('Place', before.place, after.place)
  field('Nearest hospital', before.hospital, after.hospital, 'to fill in')
  // Crew: who joined or left, whose role or call time changed.
  const was = new Map(before.crew.map((c) => [c.userId, c]))
  const now = new Map(after.crew.map((c) => [c.userId, c]))
  for (const c of after.crew) {
    const old = was.get(c.userId)
    if (!old) out.push(`Crew: ${c.name} added (${c.role})`)
    else {
      if (old.role !== c.role) out.push(`Crew: ${c.name} is now ${c.role} (was ${old.role})`)
      // A call time that only followed the sheet's call time is said once, above.
      const followed = old.callTime === before.callTime && c.callTime === after.callTime
      if (old.callTime !== c.callTime && !followed) out.push(`Crew: ${c.name}'s call time ${shown(old.callTime)} → ${shown(c.callTime)}`)
    }
  }
  for (const c of before.crew) if (!now.has(c.userId)) out.push(`Crew: ${c.name} removed`)
  // Run order: segments added, removed, moved (those whose place among the segments kept changed).
  const beforeIds = before.runOrder.map((r) => r.id)
  const afterIds = after.runOrder.map((r) => r.id)
  for (const r of after.runOrder) if (!beforeIds.includes(r.id)) out.push(`Run order: ${r.title} added`)
  for (const r of before.runOrder) if (!afterIds.includes(r.id)) out.push(`Run order: ${r.title} removed`)
  for (const id of movedSegments(before.runOrder, after.runOrder)) {
    const r = after.runOrder.find((x) => x.id === id)!
    out.push(`Run order: ${r.title} moved (now ${ordinal(afterIds.indexOf(id) + 1)}, was ${ordinal(beforeIds.indexOf(id) + 1)})`)
  }
  for (const r of after.runOrder) {
    const old = before.runOrder.find((x) => x.id === r.id)
    if (old && old.title !== r.title) out.push(`Run order: ${old.title} is now called ${r.title}`)
  }
  if (before.wrap !== after.wrap && before.callTime === after.callTime) out.push(`Planned wrap: ${shown(before.wrap)} → ${shown(after.wrap)}`)
  out.push(...listChange('Equipment', before.equipment, after.equipment))
  out.push(...listChange('Allergens on set', before.allergens, after.allergens))
  out.push(...listChange('Safety notes', before.safety, after.safety))
  return out
}
