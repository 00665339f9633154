// The shoots of an episode or of a studio, as the lists show them: read through the shoot store's
// one way into the shoots table (summaries: the clock, times and marker counts by SQLite's JSON
// functions, never the whole state), dated in the studio's time zone.
import type { ShootMarker, ShootMode, ShootStatus } from '../../shared/types/shoot'
import { SHOOT_MARKER_KINDS } from '../../shared/types/shoot'
import { openPickups } from '../../shared/utils/take-log'
import { shootClockAt } from '../../shared/utils/shoot-clock'
import { MODE_WORDS, STATUS_WORDS } from '../../shared/utils/shoot-words'
import { dateTimeInZone } from '../../shared/utils/time-zone'
import type { ShootSummaryRow } from '../shoot/store'
import { shootServerNow } from '../shoot/clock'

export interface ShootListRow {
  id: number
  title: string
  episodeId: number | null
  mode: ShootMode
  modeText: string
  status: ShootStatus
  statusText: string
  /** When it started (else when it was made), ISO, and in words in the studio's time zone. */
  at: string
  dateText: string
  started: boolean
  /** Kitchen time on the shoot clock (runs at the rehearsal's speed), and real time, start to end (or now). */
  lengthMs: number
  realMs: number
  /** Hand markers by kind (chapters apart: the shoot marks those itself). */
  markers: Record<(typeof SHOOT_MARKER_KINDS)[number], number>
  chapters: number
  pickupsOpen: number
  links: { desk: string; takes: string; report: string | null }
}

export function shootListRow(r: ShootSummaryRow, zone: { locale: string; timeZone: string }, nowMs: number): ShootListRow {
  const started = r.startedAtServerMs !== null
  const when = new Date(r.startedAtServerMs ?? Date.parse(r.createdAt))
  const end = r.endedAtServerMs ?? nowMs
  const markers = Object.fromEntries(SHOOT_MARKER_KINDS.map((k) => [k, r.markerCounts[k] ?? 0])) as ShootListRow['markers']
  const status = r.status as ShootStatus
  return {
    id: r.id, title: r.title, episodeId: r.episodeId, mode: r.mode, modeText: MODE_WORDS[r.mode]?.label ?? r.mode,
    status, statusText: STATUS_WORDS[status]?.label ?? r.status,
    at: when.toISOString(), dateText: dateTimeInZone(when, zone.locale, zone.timeZone), started,
    lengthMs: started && r.clock ? Math.round(shootClockAt(r.clock, end)) : 0,
    realMs: started ? Math.max(0, end - r.startedAtServerMs!) : 0,
    markers, chapters: r.markerCounts.chapter ?? 0,
    pickupsOpen: openPickups(r.pickupsAndGoods as unknown as ShootMarker[]).length,
    links: { desk: `/shoots/${r.id}/desk`, takes: `/shoots/${r.id}/takes`, report: r.mode === 'rehearsal' ? `/shoots/${r.id}/report` : null },
  }
}

export async function listShoots(where: { episodeId: number } | { studioId: number }, studioId: number) {
  const settings = await studioSettings(studioId)
  const rows = await useShoot().store.summaries(where)
  const now = shootServerNow()
  return { timeZone: settings.timeZone, shoots: rows.map((r) => shootListRow(r, settings, now)) }
}
