// The producer's commands on the take log, applied by the shoot reducer (shoot-apply.ts): set and
// remove the shoot's cameras, change or delete a marker afterwards. They are the only commands a
// shoot takes after it has ended (SHOOT_AFTER_END_COMMANDS). A marker is never removed: a change
// or a deletion is written into the marker's own `changes` (who, when, before and after), and a
// deleted marker keeps its place with `deleted` set, left out of the take log and its exports.
import {
  SHOOT_CAMERA_LIMIT, type ShootActor, type ShootCamera, type ShootCommandError, type ShootCommandOf, type ShootErrorCode,
  type ShootEvent, type ShootMarker, type ShootMarkerWords, type ShootState,
} from '../types/shoot'
import { defaultStartTimecode, parseTimecodeRate, timecodeToFrames, type TimecodeRate } from './timecode'
import { MARKER_WORDS } from './shoot-words'
import type { TakeLogCommands } from './shoot-apply'

type Failure = { ok: false; error: ShootCommandError }
type Outcome = { state: ShootState; events: ShootEvent[] } | Failure

const fail = (code: ShootErrorCode, message: string, field?: string): Failure =>
  ({ ok: false, error: field ? { code, message, field } : { code, message } })

function findMarker(s: ShootState, markerId: string): ShootMarker | Failure {
  const m = s.markers.find((x) => x.id === markerId)
  if (!m) return fail('unknown-marker', 'This shoot has no such marker; reload the take log to see the markers as they are.', 'markerId')
  if (m.deleted) return fail('marker-deleted', `That ${MARKER_WORDS[m.kind].label.toLowerCase()} marker was deleted; it stays in the log only.`, 'markerId')
  return m
}

function changed(s: ShootState, marker: ShootMarker, after: ShootMarkerWords | null, by: ShootActor, now: number): Outcome {
  const change = { by, atServerMs: now, before: { kind: marker.kind, text: marker.text }, after }
  const next: ShootMarker = {
    ...marker, ...(after ?? {}), ...(after ? {} : { deleted: true }), changes: [...(marker.changes ?? []), change],
  }
  return {
    state: { ...s, markers: s.markers.map((m) => (m.id === marker.id ? next : m)) },
    events: [{ type: 'marker.changed', markerId: marker.id, deleted: !after }],
  }
}

export function editMarker(s: ShootState, cmd: ShootCommandOf<'marker.edit'>, by: ShootActor, now: number): Outcome {
  const m = findMarker(s, cmd.markerId)
  if ('ok' in m) return m
  if (m.kind === 'chapter' && cmd.kind !== undefined) {
    return fail('invalid', 'A chapter marks a step change and stays a chapter; change its text, or delete it.', 'kind')
  }
  const kind = cmd.kind ?? m.kind
  const text = cmd.text === undefined ? m.text : (cmd.text.trim() || null)
  if (kind === 'note' && !text) return fail('invalid', 'Text: write what the note says.', 'text')
  if (kind === m.kind && text === m.text) return fail('no-change', 'The marker already says that; nothing changed.')
  return changed(s, m, { kind, text }, by, now)
}

export function deleteMarker(s: ShootState, cmd: ShootCommandOf<'marker.delete'>, by: ShootActor, now: number): Outcome {
  const m = findMarker(s, cmd.markerId)
  if ('ok' in m) return m
  return changed(s, m, null, by, now)
}

/** The start written for a rate: the same label with the rate's separator, when it exists there. */
function startAt(start: string, rate: TimecodeRate): string | null {
  const label = `${start.slice(0, 8)}${rate.drop ? ';' : ':'}${start.slice(9)}`
  try {
    timecodeToFrames(label, rate)
    return label
  } catch {
    return null
  }
}

export function setCamera(s: ShootState, cmd: ShootCommandOf<'camera.set'>, newId: (() => string) | undefined): Outcome {
  let rate: TimecodeRate
  try {
    rate = parseTimecodeRate(cmd.rate)
  } catch (error) {
    return fail('invalid', `Frame rate: ${(error as Error).message}.`, 'rate')
  }
  const cameras = s.cameras ?? []
  const old = cmd.cameraId ? cameras.find((c) => c.id === cmd.cameraId) : undefined
  let start: string
  if (cmd.start !== undefined) {
    try {
      timecodeToFrames(cmd.start, rate)
    } catch (error) {
      return fail('invalid', `Start timecode: ${(error as Error).message}.`, 'start')
    }
    start = cmd.start
  } else {
    start = (old && startAt(old.start, rate)) ?? defaultStartTimecode(rate)
  }
  if (!old && cameras.length >= SHOOT_CAMERA_LIMIT) {
    return fail('too-many-cameras', `This shoot has ${SHOOT_CAMERA_LIMIT} cameras, the most one shoot keeps; remove one first.`)
  }
  const id = old?.id ?? cmd.cameraId ?? newId?.()
  if (!id) return fail('no-id', 'The new camera could not be given a name to track it by; reload the screen and try again.', 'cameraId')
  const camera: ShootCamera = { id, name: cmd.name.trim(), fps: rate.fps, drop: !!rate.drop, start }
  return {
    state: { ...s, cameras: old ? cameras.map((c) => (c.id === id ? camera : c)) : [...cameras, camera] },
    events: [{ type: 'camera.changed', cameraId: id, removed: false }],
  }
}

export function removeCamera(s: ShootState, cmd: ShootCommandOf<'camera.remove'>): Outcome {
  const cameras = s.cameras ?? []
  if (!cameras.some((c) => c.id === cmd.cameraId)) {
    return fail('unknown-camera', 'This shoot has no such camera; reload the take log to see its cameras.', 'cameraId')
  }
  return {
    state: { ...s, cameras: cameras.filter((c) => c.id !== cmd.cameraId) },
    events: [{ type: 'camera.changed', cameraId: cmd.cameraId, removed: true }],
  }
}

/** The four take-log commands, as the reducer dispatches them (registered by shoot-reducer.ts). */
export const takeLogCommands: TakeLogCommands = (s, cmd, by, newId, now) => {
  switch (cmd.type) {
    case 'marker.edit': return editMarker(s, cmd, by, now)
    case 'marker.delete': return deleteMarker(s, cmd, by, now)
    case 'camera.set': return setCamera(s, cmd, newId)
    case 'camera.remove': return removeCamera(s, cmd)
  }
}
