// The take log over the built server: a recording driven through the commands route (rolling,
// marks, step changes, a second roll), cameras set and markers tidied by the producer after the
// shoot ended, and the exports read back by independent parsers: WebVTT by webvtt-parser (a W3C
// WebVTT parser from the npm registry, not Hobline's code) and CSV by papaparse (RFC 4180). Cue
// times must equal the markers' recording times to the millisecond. Timecode labels are checked
// against hand arithmetic at 25 fps (frames = ⌊ms × 25 / 1000⌋, SMPTE ST 12-1 HH:MM:SS:FF) and, at
// 29.97 drop-frame, against the FFmpeg-checked timecode.ts (tests/unit/timecode*.test.ts).
import { beforeAll, describe, expect, it } from 'vitest'
import Papa from 'papaparse'
import { WebVTTParser } from 'webvtt-parser'
import type { ShootState } from '../../shared/types/shoot'
import { timecodeAfter } from '../../shared/utils/timecode'
import { useBuiltApp } from '../support/app'
import { demo, signedIn, type Client } from '../support/client'

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms))

/** 25 fps non-drop by hand: the frame on screen, then HH:MM:SS:FF after a start of 01:00:00:00. */
function at25(ms: number): string {
  const frames = Math.floor((ms * 25) / 1000) + 3600 * 25
  const p = (n: number) => String(n).padStart(2, '0')
  return `${p(Math.floor(frames / 90_000))}:${p(Math.floor(frames / 1500) % 60)}:${p(Math.floor(frames / 25) % 60)}:${p(frames % 25)}`
}

/** The cues of a WebVTT file, as webvtt-parser reads them (in chapters mode, its chapter rules apply too). */
function parseVtt(text: string, mode: 'metadata' | 'chapters') {
  const parsed = new WebVTTParser().parse(text, mode)
  expect(parsed.errors).toEqual([])
  return parsed.cues
}

describe('the take log and its exports', async () => {
  await useBuiltApp()
  let producer: Client
  let host: Client
  let camera: Client
  let viewer: Client
  let shootId: number
  let state: ShootState
  const cameraIds: Record<string, string> = {}

  const send = async (who: Client, command: object) => {
    const res = await who.post(`/api/shoots/${shootId}/commands`, command)
    if (res.status !== 200) throw new Error(`${JSON.stringify(command)}: ${res.status} ${JSON.stringify(res.body)}`)
    return res
  }
  const marks = () => state.markers.filter((m) => !m.deleted)
  const byId = (id: string) => state.markers.find((m) => m.id === id)!

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    host = await signedIn(demo.host)
    camera = await signedIn(demo.camera)
    viewer = await signedIn(demo.viewer)
    const episodes = (await producer.get('/api/studios/1/episodes')).body.episodes as Array<{ id: number }>
    const made = await producer.post(`/api/episodes/${episodes[0]!.id}/shoots`, { mode: 'take' })
    expect(made.status).toBe(201)
    shootId = made.body.shoot.id
    await send(producer, { type: 'shoot.start' })
    await send(camera, { type: 'rolling.set', rolling: true })
    await pause(120)
    await send(host, { type: 'step.next' })
    await pause(230)
    await send(camera, { type: 'marker.add', markerId: 'tl-flub', kind: 'flub', text: 'lid, clatter' })
    await pause(150)
    await send(camera, { type: 'rolling.set', rolling: false })
    await pause(300) // not recorded: the recording time skips it
    await send(camera, { type: 'rolling.set', rolling: true })
    await pause(170)
    await send(camera, { type: 'marker.add', markerId: 'tl-good', kind: 'good' })
    await send(host, { type: 'step.next' })
    await pause(90)
    await send(camera, { type: 'marker.add', markerId: 'tl-pickup', kind: 'pickup', text: 'close-up of the "sauce", again' })
    await send(host, { type: 'marker.add', markerId: 'tl-note', kind: 'note', text: 'spare take' })
    await pause(200)
    await send(producer, { type: 'shoot.end', cancelTimers: true })
    // After the shoot: the producer sets the cameras and tidies the markers.
    await send(producer, { type: 'camera.set', cameraId: 'cam-a', name: 'Camera A', rate: '25' })
    await send(producer, { type: 'camera.set', cameraId: 'cam-b', name: 'Camera B', rate: '29.97df', start: '01:00:00;00' })
    await send(producer, { type: 'marker.edit', markerId: 'tl-flub', text: 'lid clatter at 0:05' })
    await send(producer, { type: 'marker.delete', markerId: 'tl-note' })
    state = (await producer.get(`/api/shoots/${shootId}`)).body.state as ShootState
    for (const c of state.cameras ?? []) cameraIds[c.name] = c.id
  })

  it('kept the recording times, the changes and the deletion in the shoot', () => {
    expect(state.status).toBe('ended')
    expect(Object.values(cameraIds)).toEqual(['cam-a', 'cam-b'])
    const flub = byId('tl-flub')
    expect(flub.text).toBe('lid clatter at 0:05')
    expect(flub.changes).toEqual([expect.objectContaining({ before: { kind: 'flub', text: 'lid, clatter' }, after: { kind: 'flub', text: 'lid clatter at 0:05' } })])
    expect(flub.changes![0]!.by).toMatchObject({ role: 'producer' })
    expect(byId('tl-note')).toMatchObject({ deleted: true })
    // The pause between the rolls is not recording time: the good take sits about 120+230+150+170 ms in.
    const good = byId('tl-good').recordingMs!
    expect(good).toBeGreaterThanOrEqual(670)
    expect(good).toBeLessThan(byId('tl-good').serverMs - state.startedAtServerMs! - 250)
    expect(marks().filter((m) => m.kind === 'chapter').length).toBeGreaterThanOrEqual(3)
  })

  it('CSV at camera A (25 fps): one row per marker, read back by papaparse', async () => {
    const res = await viewer.get(`/api/shoots/${shootId}/markers.csv?camera=cam-a`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="take-log-shoot-\d+-camera-a-25\.csv"/)
    const parsed = Papa.parse<Record<string, string>>(res.body as string, { header: true, skipEmptyLines: true })
    expect(parsed.errors).toEqual([])
    expect(parsed.meta.fields).toEqual(['Timecode', 'Recording time', 'Kind', 'Segment', 'Step', 'Note', 'Author'])
    expect(parsed.data).toHaveLength(marks().length)
    const rows = new Map(parsed.data.map((r, i) => [marks()[i]!.id, r]))
    for (const m of marks()) {
      const row = rows.get(m.id)!
      expect(row.Timecode, m.id).toBe(at25(m.recordingMs!))
      const [h, mi, s] = row['Recording time']!.split(':')
      expect(Math.round((Number(h) * 3600 + Number(mi) * 60 + Number(s)) * 1000), m.id).toBe(m.recordingMs)
    }
    expect(rows.get('tl-pickup')).toMatchObject({ Kind: 'Pickup', Note: 'close-up of the "sauce", again', Author: expect.any(String) })
    expect(rows.get('tl-flub')).toMatchObject({ Kind: 'Flub', Note: 'lid clatter at 0:05' })
    expect(parsed.data.some((r) => r.Note === 'spare take')).toBe(false)
  })

  it('WebVTT markers track at camera B (29.97 drop-frame): cue starts equal recording times to the millisecond', async () => {
    const res = await producer.get(`/api/shoots/${shootId}/markers.vtt?camera=cam-b&track=markers`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/vtt/)
    const cues = parseVtt(res.body as string, 'metadata')
    const people = marks().filter((m) => m.kind !== 'chapter')
    expect(cues.map((c) => c.id)).toEqual(people.map((m) => m.id))
    for (const [i, m] of people.entries()) {
      expect(Math.round(cues[i]!.startTime * 1000), m.id).toBe(m.recordingMs)
      expect(cues[i]!.text).toContain(timecodeAfter('01:00:00;00', m.recordingMs!, { fps: 29.97, drop: true }))
    }
    expect(cues.find((c) => c.id === 'tl-flub')!.text).toMatch(/^Flub · lid clatter at 0:05 · 01:00:00;\d\d on Camera B/)
  })

  it('WebVTT chapters track: one cue per step change while rolling, each until the next', async () => {
    const res = await viewer.get(`/api/shoots/${shootId}/markers.vtt?camera=cam-a&track=chapters`)
    expect(res.status).toBe(200)
    const cues = parseVtt(res.body as string, 'chapters')
    const chapters = marks().filter((m) => m.kind === 'chapter').map((m) => m.recordingMs!)
    const distinct = chapters.filter((ms, i) => chapters[i + 1] === undefined || chapters[i + 1]! > ms)
    expect(cues.map((c) => Math.round(c.startTime * 1000))).toEqual(distinct)
    for (let i = 0; i + 1 < cues.length; i++) expect(Math.round(cues[i]!.endTime * 1000)).toBe(Math.round(cues[i + 1]!.startTime * 1000))
    expect(Math.round(cues.at(-1)!.endTime * 1000)).toBe(state.recordedMs)
  })

  it('JSON, and a rate and start given outright', async () => {
    const res = await viewer.get(`/api/shoots/${shootId}/markers.json?rate=29.97df&start=10:00:00;00`)
    expect(res.status).toBe(200)
    expect(res.body.camera).toMatchObject({ rate: '29.97df', start: '10:00:00;00' })
    const good = res.body.markers.find((m: { id: string }) => m.id === 'tl-good')
    expect(good).toMatchObject({ kind: 'good', recordingMs: byId('tl-good').recordingMs })
    expect(good.timecode).toBe(timecodeAfter('10:00:00;00', byId('tl-good').recordingMs!, { fps: 29.97, drop: true }))
    expect(res.body.markers.map((m: { id: string }) => m.id)).not.toContain('tl-note')
  })

  it('refuses the host and the camera, in the one error shape', async () => {
    for (const who of [host, camera]) {
      for (const ext of ['csv', 'vtt', 'json']) {
        const res = await who.get(`/api/shoots/${shootId}/markers.${ext}?camera=cam-a`)
        expect(res.status).toBe(403)
        expect(res.body).toMatchObject({ statusCode: 403, data: { code: 'forbidden', message: expect.stringMatching(/may not download the take log/) } })
      }
    }
    expect((await new (producer.constructor as typeof Client)().get(`/api/shoots/${shootId}/markers.csv?rate=25`)).status).toBe(401)
  })

  it('bad rate or start: 400 saying what to write', async () => {
    const bad = async (q: string) => (await producer.get(`/api/shoots/${shootId}/markers.csv?${q}`)).body
    expect(await bad('rate=48')).toMatchObject({ statusCode: 400, data: { code: 'invalid', field: 'rate', message: expect.stringMatching(/^Frame rate: write one of 23.976, 24, 25, 29.97, 30, 50, 59.94, 60/) } })
    expect(await bad('rate=29.97df&start=01:01:00;00')).toMatchObject({ data: { field: 'start', message: expect.stringMatching(/^Start timecode: .*next label is 01:01:00;02/) } })
    expect(await bad('rate=25&start=1:00')).toMatchObject({ data: { field: 'start', message: expect.stringMatching(/HH:MM:SS:FF, such as 01:00:00:00/) } })
    expect(await bad('camera=nope')).toMatchObject({ data: { field: 'camera', message: expect.stringMatching(/choose one of cam-a \(Camera A\), cam-b \(Camera B\)/) } })
    expect(await bad('track=all&rate=25')).toMatchObject({ data: { field: 'track' } })
  })

  it('only the producer changes markers and cameras; the shoot\'s other commands stay refused after the end', async () => {
    const res = await host.post(`/api/shoots/${shootId}/commands`, { type: 'marker.edit', markerId: 'tl-good', text: 'x' })
    expect(res.status).toBe(403)
    expect(res.body.data).toMatchObject({ code: 'forbidden', message: 'The host may not change markers; the producer may.' })
    expect((await viewer.post(`/api/shoots/${shootId}/commands`, { type: 'camera.set', name: 'C', rate: '25' })).status).toBe(403)
    const late = await camera.post(`/api/shoots/${shootId}/commands`, { type: 'marker.add', kind: 'good' })
    expect(late.body.data).toMatchObject({ code: 'shoot-ended' })
    const gone = await producer.post(`/api/shoots/${shootId}/commands`, { type: 'marker.edit', markerId: 'tl-note', text: 'back' })
    expect(gone.body.data).toMatchObject({ code: 'marker-deleted' })
  })
})
