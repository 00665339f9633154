// The take log: cameras and marker changes as shoot commands (shared/utils/take-log-apply.ts through
// the reducer), the entries at a camera's timecode, grouping, pickups, and the WebVTT and CSV rows
// (shared/utils/take-log-export.ts). Times are worked by hand below; timecode labels follow SMPTE
// ST 12-1 (checked against FFmpeg's libavutil/timecode.c in timecode*.test.ts); the WebVTT
// timestamp form HH:MM:SS.mmm is W3C WebVTT §4.1 ("WebVTT timestamp"). The episode is invented.
import { describe, expect, it } from 'vitest'
import type { ShootActor, ShootCommand, ShootRole, ShootSegment, ShootState } from '../../shared/types/shoot'
import { createShootState } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { groupTakeLog, openPickups, takeChapters, takeLogEntries } from '../../shared/utils/take-log'
import { takeLogChapterCues, takeLogCsvRows, takeLogMarkerCues, takeLogVtt, vttTimestamp } from '../../shared/utils/take-log-export'
import { parseShootCommand } from '../../shared/utils/shoot-schema'
import { takeLogQuerySchema } from '../../shared/utils/take-log-schemas'

const RUN_ORDER: ShootSegment[] = [
  { id: 'intro', title: 'Welcome', stepIds: [] },
  { id: 'orzo', title: 'Lemon orzo', stepIds: ['boil', 'cook'] },
]
const T0 = 1_760_000_000_000
const ACTORS: Record<ShootRole, ShootActor> = {
  producer: { role: 'producer', id: 'user:1', name: 'Ines Varga' },
  host: { role: 'host', id: 'user:2', name: 'Tomasz Reede' },
  camera: { role: 'camera', id: 'device:7', name: 'Camera device' },
  viewer: { role: 'viewer', id: 'user:4', name: 'Editor' },
}
let n = 0
function step(s: ShootState, command: unknown, at: number, role: ShootRole = 'producer'): ShootState {
  const r = applyShootCommand(s, command, { nowServerMs: at, actor: ACTORS[role], newId: () => `id-${++n}` })
  if (!r.ok) throw new Error(`${JSON.stringify(command)}: ${r.error.code} ${r.error.message}`)
  return r.state
}
function refused(s: ShootState, command: unknown, at: number, role: ShootRole = 'producer') {
  const r = applyShootCommand(s, command, { nowServerMs: at, actor: ACTORS[role], newId: () => `id-${++n}` })
  if (r.ok) throw new Error(`${JSON.stringify(command)} applied`)
  return r.error
}

/**
 * Start at T0; roll at +10 s (chapter at intro, recording 0); next step at +12.5 s (chapter at orzo/boil,
 * recording 2500); flub at +15.321 s (recording 5321); cut at +20 s (roll 1 = 10 000 ms); roll again
 * at +60 s (a new take opens on a chapter at orzo/boil, recording 10 000); good take at +62.04 s
 * (recording 12 040); next at +70 s (chapter orzo/cook, recording 20 000);
 * pickup at +71 s (21 000); end at +80 s (recorded 30 000 ms in all).
 */
function recorded(): ShootState {
  let s = createShootState({ id: 'shoot-1', mode: 'take', runOrder: RUN_ORDER })
  s = step(s, { type: 'shoot.start' }, T0)
  s = step(s, { type: 'rolling.set', rolling: true }, T0 + 10_000, 'camera')
  s = step(s, { type: 'step.next' }, T0 + 12_500, 'host')
  s = step(s, { type: 'marker.add', markerId: 'flub-1', kind: 'flub', text: 'dropped the zest' }, T0 + 15_321, 'camera')
  s = step(s, { type: 'rolling.set', rolling: false }, T0 + 20_000, 'camera')
  s = step(s, { type: 'rolling.set', rolling: true }, T0 + 60_000, 'camera')
  s = step(s, { type: 'marker.add', markerId: 'good-1', kind: 'good' }, T0 + 62_040, 'camera')
  s = step(s, { type: 'step.next' }, T0 + 70_000, 'host')
  s = step(s, { type: 'marker.add', markerId: 'pick-1', kind: 'pickup', text: 'steam shot' }, T0 + 71_000, 'camera')
  s = step(s, { type: 'shoot.end', cancelTimers: true }, T0 + 80_000)
  return s
}
const CAM25 = { id: 'a', name: 'Camera A', fps: 25 as const, drop: false, start: '01:00:00:00' }
const CAM2997DF = { id: 'b', name: 'Camera B', fps: 29.97 as const, drop: true, start: '01:00:00;00' }

describe('recording times and timecode of each marker', () => {
  const s = recorded()
  it('counts recording time across rolls, worked by hand', () => {
    expect(s.recordedMs).toBe(30_000)
    const at = Object.fromEntries(s.markers.map((m) => [m.id, m.recordingMs]))
    expect(at).toMatchObject({ 'flub-1': 5321, 'good-1': 12_040, 'pick-1': 21_000 })
    expect(takeChapters(s.markers, s.runOrder).map((c) => [c.segmentId, c.stepId, c.recordingMs]))
      .toEqual([['intro', null, 0], ['orzo', 'boil', 2500], ['orzo', 'boil', 10_000], ['orzo', 'cook', 20_000]])
  })
  it('labels each marker at the camera: 25 fps and 29.97 drop-frame from 01:00:00', () => {
    // 25 fps: 5.321 s → frame 133 = 5 s + 8 → 01:00:05:08; 12.04 s → frame 301 = 12 s + 1; 21 s → 01:00:21:00.
    const at25 = takeLogEntries(s, CAM25).filter((e) => e.kind !== 'chapter').map((e) => e.timecode)
    expect(at25).toEqual(['01:00:05:08', '01:00:12:01', '01:00:21:00'])
    // 29.97: 5.321 s × 30000/1001 = 159.47 → frame 159 = 5 s + 9 → 01:00:05;09; 12.04 s → 360.84 → 360 = 12 s + 0;
    // 21 s → 629.37 → 629 = 20 s + 29 → 01:00:20;29 (frames count 29.97 a second, labels 30).
    const atDf = takeLogEntries(s, CAM2997DF).filter((e) => e.kind !== 'chapter').map((e) => e.timecode)
    expect(atDf).toEqual(['01:00:05;09', '01:00:12;00', '01:00:20;29'])
  })
  it('groups by segment and step in run order and flags the open pickup', () => {
    const groups = groupTakeLog(takeLogEntries(s, CAM25), s.runOrder)
    expect(groups.map((g) => [g.segmentTitle, g.steps.map((x) => [x.stepLabel, x.entries.map((e) => e.kind)])])).toEqual([
      ['Welcome', [[null, ['chapter']]]],
      ['Lemon orzo', [['Step 1', ['chapter', 'flub', 'chapter', 'good']], ['Step 2', ['chapter', 'pickup']]]],
    ])
    expect(takeLogEntries(s, CAM25).filter((e) => e.openPickup).map((e) => e.marker.id)).toEqual(['pick-1'])
  })
})

describe('the producer changes and deletes markers afterwards, logged', () => {
  it('edits kind and text after the shoot ended, keeping who, when, before and after', () => {
    let s = recorded()
    s = step(s, { type: 'marker.edit', markerId: 'flub-1', kind: 'note', text: 'zest fell: keep, it reads well' }, T0 + 90_000)
    const m = s.markers.find((x) => x.id === 'flub-1')!
    expect(m).toMatchObject({ kind: 'note', text: 'zest fell: keep, it reads well', recordingMs: 5321 })
    expect(m.changes).toEqual([{ by: ACTORS.producer, atServerMs: T0 + 90_000, before: { kind: 'flub', text: 'dropped the zest' }, after: { kind: 'note', text: 'zest fell: keep, it reads well' } }])
  })
  it('a deleted marker stays with a deleted flag and its change, out of the take log, chapters and pickups', () => {
    let s = recorded()
    s = step(s, { type: 'marker.delete', markerId: 'pick-1' }, T0 + 90_000)
    const m = s.markers.find((x) => x.id === 'pick-1')!
    expect(m.deleted).toBe(true)
    expect(m.changes?.[0]).toMatchObject({ after: null, before: { kind: 'pickup', text: 'steam shot' } })
    expect(takeLogEntries(s, CAM25).map((e) => e.marker.id)).not.toContain('pick-1')
    expect(openPickups(s.markers)).toEqual([])
    const chapter = s.markers.find((x) => x.kind === 'chapter' && x.recordingMs === 20_000)!
    s = step(s, { type: 'marker.delete', markerId: chapter.id }, T0 + 91_000)
    expect(takeChapters(s.markers, s.runOrder).map((c) => c.recordingMs)).toEqual([0, 2500, 10_000])
    expect(takeLogMarkerCues(s, CAM25, 30_000).map((c) => c.id)).toEqual(['flub-1', 'good-1'])
    expect(refused(s, { type: 'marker.edit', markerId: 'pick-1', text: 'again' }, T0 + 92_000)).toMatchObject({ code: 'marker-deleted' })
  })
  it('refuses others than the producer, and says what is wrong', () => {
    const s = recorded()
    for (const role of ['host', 'camera', 'viewer'] as const) {
      expect(refused(s, { type: 'marker.edit', markerId: 'flub-1', text: 'x' }, T0 + 90_000, role)).toMatchObject({ code: 'forbidden', message: expect.stringMatching(/the producer may/) })
      expect(refused(s, { type: 'marker.delete', markerId: 'flub-1' }, T0 + 90_000, role)).toMatchObject({ code: 'forbidden' })
    }
    expect(refused(s, { type: 'marker.edit', markerId: 'nope', text: 'x' }, T0 + 90_000)).toMatchObject({ code: 'unknown-marker', field: 'markerId' })
    expect(refused(s, { type: 'marker.edit', markerId: 'flub-1' }, T0 + 90_000)).toMatchObject({ code: 'invalid', message: expect.stringMatching(/new kind of marker, its text, or both/) })
    expect(refused(s, { type: 'marker.edit', markerId: 'good-1', kind: 'note' }, T0 + 90_000)).toMatchObject({ code: 'invalid', field: 'text' })
    const chapter = s.markers.find((x) => x.kind === 'chapter')!
    expect(refused(s, { type: 'marker.edit', markerId: chapter.id, kind: 'good' }, T0 + 90_000)).toMatchObject({ field: 'kind', message: expect.stringMatching(/stays a chapter/) })
    // Everything else still refuses an ended shoot.
    expect(refused(s, { type: 'marker.add', kind: 'good' }, T0 + 90_000)).toMatchObject({ code: 'shoot-ended' })
  })
})

describe('cameras of a shoot', () => {
  it('adds, changes and removes cameras; the start defaults to 01:00:00:00 at the rate', () => {
    let s = recorded()
    s = step(s, { type: 'camera.set', cameraId: 'cam-a', name: 'Camera A', rate: '25' }, T0 + 90_000)
    s = step(s, { type: 'camera.set', name: 'Jib', rate: '29.97df', start: '10:00:00;00' }, T0 + 90_000)
    expect(s.cameras).toEqual([
      { id: 'cam-a', name: 'Camera A', fps: 25, drop: false, start: '01:00:00:00' },
      { id: expect.any(String), name: 'Jib', fps: 29.97, drop: true, start: '10:00:00;00' },
    ])
    s = step(s, { type: 'camera.set', cameraId: 'cam-a', name: 'Camera A', rate: '29.97df' }, T0 + 91_000)
    expect(s.cameras![0]).toEqual({ id: 'cam-a', name: 'Camera A', fps: 29.97, drop: true, start: '01:00:00;00' })
    s = step(s, { type: 'camera.remove', cameraId: 'cam-a' }, T0 + 92_000)
    expect(s.cameras!.map((c) => c.name)).toEqual(['Jib'])
    expect(refused(s, { type: 'camera.remove', cameraId: 'cam-a' }, T0 + 93_000)).toMatchObject({ code: 'unknown-camera' })
    expect(refused(s, { type: 'camera.set', name: 'B', rate: '25' }, T0 + 93_000, 'host')).toMatchObject({ code: 'forbidden' })
  })
  it('refuses rates and starts that do not exist, saying what to write', () => {
    const s = recorded()
    expect(refused(s, { type: 'camera.set', name: 'A', rate: '48' }, T0)).toMatchObject({ field: 'rate', message: expect.stringMatching(/^Frame rate: write one of 23.976, 24, 25, 29.97, 30, 50, 59.94, 60/) })
    expect(refused(s, { type: 'camera.set', name: 'A', rate: '25df' }, T0)).toMatchObject({ field: 'rate' })
    expect(refused(s, { type: 'camera.set', name: 'A', rate: '29.97df', start: '01:01:00;00' }, T0))
      .toMatchObject({ field: 'start', message: expect.stringMatching(/^Start timecode: .*next label is 01:01:00;02/) })
    expect(refused(s, { type: 'camera.set', name: '', rate: '25' }, T0)).toMatchObject({ field: 'name', message: expect.stringMatching(/^Camera name: name the camera/) })
  })
})

describe('exports', () => {
  const s = recorded()
  it('WebVTT timestamps are HH:MM:SS.mmm', () => {
    expect(vttTimestamp(0)).toBe('00:00:00.000')
    expect(vttTimestamp(5321)).toBe('00:00:05.321')
    expect(vttTimestamp(3_723_045)).toBe('01:02:03.045')
  })
  it('one chapter cue per step, from its chapter to the next, the last to the end of the recording', () => {
    expect(takeLogChapterCues(s, 30_000).map((c) => [c.startMs, c.endMs, c.text])).toEqual([
      [0, 2500, 'Welcome'], [2500, 10_000, 'Lemon orzo: Step 1'], [10_000, 20_000, 'Lemon orzo: Step 1'], [20_000, 30_000, 'Lemon orzo: Step 2'],
    ])
    const vtt = takeLogVtt(s, CAM25, 'chapters', 'Episode 4 <take>', 30_000)
    expect(vtt.split('\n').slice(0, 6)).toEqual(['WEBVTT - Episode 4 &lt;take&gt;: chapters', '', 'chapter-1', '00:00:00.000 --> 00:00:02.500', 'Welcome', ''])
  })
  it('marker cues start at the recording time and last a second', () => {
    expect(takeLogMarkerCues(s, CAM25, 30_000).map((c) => [c.id, c.startMs, c.endMs])).toEqual([
      ['flub-1', 5321, 6321], ['good-1', 12_040, 13_040], ['pick-1', 21_000, 22_000],
    ])
    expect(takeLogMarkerCues(s, CAM25, 30_000)[0]!.text).toBe('Flub · dropped the zest · 01:00:05:08 on Camera A · Lemon orzo, Step 1')
  })
  it('CSV rows: timecode, recording time, kind, segment, step, note, author', () => {
    expect(takeLogCsvRows(s, CAM2997DF).filter((r) => r[2] !== 'Chapter')).toEqual([
      ['01:00:05;09', '00:00:05.321', 'Flub', 'Lemon orzo', 'Step 1', 'dropped the zest', 'Camera device'],
      ['01:00:12;00', '00:00:12.040', 'Good take', 'Lemon orzo', 'Step 1', '', 'Camera device'],
      ['01:00:20;29', '00:00:21.000', 'Pickup', 'Lemon orzo', 'Step 2', 'steam shot', 'Camera device'],
    ])
  })
  it('the export query names what to write', () => {
    const q = (query: object) => takeLogQuerySchema.safeParse(query)
    expect(q({ rate: '29.97df', start: '01:00:00;00', track: 'markers' }).success).toBe(true)
    expect(q({ rate: '29.97' }).success).toBe(true)
    expect(q({ rate: '29.97df', start: '01:01:00;01' }).error?.issues[0]?.message).toMatch(/next label is 01:01:00;02/)
    expect(q({ start: '01:00:00:00' }).error?.issues[0]?.message).toMatch(/give the frame rate/)
    expect(q({ rate: 'fast' }).error?.issues[0]?.message).toMatch(/write one of 23.976/)
  })
  it('parseShootCommand reads the take-log commands', () => {
    const cmd: ShootCommand = { type: 'marker.delete', markerId: 'm-1' }
    expect(parseShootCommand(cmd)).toEqual({ ok: true, command: cmd })
  })
})
