// The shoot reducer's core: (state, well-formed command) → new state | error. Pure: the time and
// new ids come in through the context, the input state is never changed. The server reaches it
// through applyShootCommand (shoot-reducer.ts), which first checks the command's shape with zod;
// screens apply their own commands with it directly for optimistic feedback.
//
// Order of checks: the shoot having ended (only the take log's tidying goes on after, take-log-apply.ts),
// then the command against the state. Who may send which
// command is decided once, before this, by applyShootCommand (shoot-reducer.ts) from the role table.
// Before a command applies, timers whose deadline has passed are marked due, so a command never
// acts on a timer that has in fact already rung.
import {
  SHOOT_AFTER_END_COMMANDS, SHOOT_MARKER_LIMIT, SHOOT_TIMER_LIMIT, SHOOT_TIMER_MAX_MS, SHOOT_TIMER_SLOTS,
  type ShootActor, type ShootApplyResult, type ShootCommand, type ShootCommandContext, type ShootCommandError,
  type ShootCommandOf, type ShootCursor, type ShootErrorCode, type ShootEvent, type ShootMarker, type ShootState, type ShootTimer,
} from '../types/shoot'
import { shootClockAt, shootClockAtSpeed, shootClockStarted, shootClockStopped } from './shoot-clock'
import {
  isShootTimerLive, markDueTimers, newShootTimer, shootTimerDueAt, shootTimerPausedAt, shootTimerRunningFrom, timerChecking,
  timerRemainingMs,
} from './shoot-timers'
import { clockTextMs } from './clock-text'
import { shootCursorMoved, shootCursorRef, shootSegmentPositions, shootStepRefAt } from './shoot'
import { isTimedWait, shootPlanStep, startWait, stepTimerOf } from './shoot-waits'
import { actionName as press } from './shoot-words'
import { recordingMsAt } from './recording-time'

type Failure = { ok: false; error: ShootCommandError }
type Change = { state: ShootState; events: ShootEvent[] }
type Outcome = Change | Failure

/**
 * The take log's own commands (cameras, marker changes), from take-log-apply.ts. The server's reducer
 * (shoot-reducer.ts) registers them; the screens apply only their own commands ahead of the server,
 * and none of these, so they do not load its timecode maths.
 */
export type TakeLogCommands = (
  s: ShootState, cmd: ShootCommandOf<'marker.edit' | 'marker.delete' | 'camera.set' | 'camera.remove'>,
  by: ShootActor, newId: (() => string) | undefined, now: number,
) => Outcome
let takeLogCommands: TakeLogCommands | null = null
export function applyTakeLogCommandsWith(apply: TakeLogCommands) {
  takeLogCommands = apply
}

const fail = (code: ShootErrorCode, message: string, field?: string): Failure =>
  ({ ok: false, error: field ? { code, message, field } : { code, message } })
const isFailure = (o: Outcome): o is Failure => 'ok' in o

/** Applies one well-formed command (one this code built, or one shoot-schema.ts has read). */
export function applyKnownShootCommand(state: ShootState, command: ShootCommand, ctx: ShootCommandContext): ShootApplyResult {
  const now = ctx?.nowServerMs
  if (typeof now !== 'number' || !Number.isFinite(now)) return fail('invalid', 'The server could not read its own clock; try again.', 'nowServerMs')
  if (state.status === 'ended' && !SHOOT_AFTER_END_COMMANDS.includes(command.type)) return fail('shoot-ended', 'This shoot has ended, so nothing in it can change; start a new rehearsal or recording from the episode to go again.')

  const marked = markDueTimers(state, now)
  const base: ShootState = { ...marked.state, seq: state.seq }
  const outcome = dispatch(base, command, ctx, now)
  if (isFailure(outcome)) return outcome
  return {
    ok: true,
    state: { ...outcome.state, seq: state.seq + 1 },
    events: [...marked.due.map(dueEvent), ...outcome.events],
  }
}

function dispatch(s: ShootState, cmd: ShootCommand, ctx: ShootCommandContext, now: number): Outcome {
  switch (cmd.type) {
    case 'shoot.start': return startShoot(s, ctx, now)
    case 'shoot.pause': return pauseShoot(s, now)
    case 'shoot.resume': return resumeShoot(s, now)
    case 'shoot.end': return endShoot(s, cmd, now)
    case 'step.next': return stepBy(s, 1, ctx, now)
    case 'step.previous': return stepBy(s, -1, ctx, now)
    case 'step.jump': return jumpTo(s, cmd, ctx, now)
    case 'timer.start': return startTimer(s, cmd, ctx, now)
    case 'timer.pause': return pauseTimer(s, cmd, now)
    case 'timer.resume': return resumeTimer(s, cmd, now)
    case 'timer.addTime': return addTime(s, cmd, now)
    case 'timer.cancel': return cancelTimer(s, cmd, now)
    case 'timer.acknowledge': return acknowledgeTimer(s, cmd, ctx, now)
    case 'rolling.set': return setRolling(s, cmd, ctx, now)
    case 'clock.speed': return setSpeed(s, cmd, now)
    case 'marker.add': return addMarker(s, cmd, ctx, now)
    case 'wait.start': return startWaitNow(s, cmd, ctx, now)
    case 'marker.edit':
    case 'marker.delete':
    case 'camera.set':
    case 'camera.remove':
      return takeLogCommands ? takeLogCommands(s, cmd, actorOf(ctx), ctx.newId, now) : fail('invalid', 'The server applies changes to the take log; wait for it.')
    default: {
      const unknown: never = cmd
      return fail('invalid', `This screen sent an action the shoot does not know ("${String((unknown as { type: string }).type).slice(0, 40)}"); reload the screen.`, 'type')
    }
  }
}

// ---- the shoot as a whole --------------------------------------------------------------------

function statusEvent(s: ShootState, now: number): ShootEvent {
  return { type: 'shoot.status', status: s.status, atServerMs: now, shootMs: shootClockAt(s.clock, now) }
}

/** Rehearsal timers follow the shoot clock: held while it stops, released when it runs. */
function holdRunningTimers(s: ShootState, now: number): { timers: ShootTimer[]; events: ShootEvent[] } {
  const events: ShootEvent[] = []
  const timers = s.timers.map((t) => {
    if (t.state !== 'running') return t
    events.push({ type: 'timer.changed', timerId: t.id, state: 'paused' })
    return shootTimerPausedAt(t, now, true)
  })
  return { timers, events }
}
function releaseHeldTimers(s: ShootState, now: number, speed: number): { timers: ShootTimer[]; events: ShootEvent[] } {
  const events: ShootEvent[] = []
  const timers = s.timers.map((t) => {
    if (t.state !== 'paused' || !t.heldByShoot) return t
    events.push({ type: 'timer.changed', timerId: t.id, state: 'running' })
    return shootTimerRunningFrom(t, now, t.remainingMs ?? 0, speed)
  })
  return { timers, events }
}

function startShoot(s: ShootState, ctx: ShootCommandContext, now: number): Outcome {
  if (s.status !== 'ready') {
    return fail('already-started', s.status === 'paused' ? `The shoot has started and is paused; press ${press('shoot.resume')} instead.` : 'The shoot is already running.')
  }
  const clock = { ...s.clock, anchorServerMs: now, anchorShootMs: 0, running: true }
  const released = s.mode === 'rehearsal' ? releaseHeldTimers(s, now, clock.speed) : { timers: s.timers, events: [] }
  const stepRef = shootCursorRef(s)
  const next: ShootState = {
    ...s,
    status: 'running',
    clock,
    timers: released.timers,
    startedAtServerMs: now,
    rollingSinceShootMs: s.rolling ? 0 : null,
    visits: [...s.visits, { stepRef, enteredServerMs: now, enteredShootMs: 0 }],
  }
  const waited = startWait(withChapter(next, ctx, now), stepRef.stepId, actorOf(ctx), now)
  return {
    state: waited.state,
    events: [statusEvent(next, now), { type: 'step.entered', stepRef, atServerMs: now, shootMs: 0 }, ...released.events, ...waited.events],
  }
}

function pauseShoot(s: ShootState, now: number): Outcome {
  if (s.status === 'ready') return fail('not-started', `The shoot has not started yet; press ${press('shoot.start')} first.`)
  if (s.status === 'paused') return fail('not-running', 'The shoot is already paused.')
  const held = s.mode === 'rehearsal' ? holdRunningTimers(s, now) : { timers: s.timers, events: [] }
  const next: ShootState = { ...s, status: 'paused', clock: shootClockStopped(s.clock, now), timers: held.timers }
  return { state: next, events: [statusEvent(next, now), ...held.events] }
}

function resumeShoot(s: ShootState, now: number): Outcome {
  if (s.status === 'ready') return fail('not-started', `The shoot has not started yet; press ${press('shoot.start')} instead.`)
  if (s.status === 'running') return fail('not-paused', `The shoot is running, not paused; there is nothing to resume.`)
  const released = s.mode === 'rehearsal' ? releaseHeldTimers(s, now, s.clock.speed) : { timers: s.timers, events: [] }
  const next: ShootState = { ...s, status: 'running', clock: shootClockStarted(s.clock, now), timers: released.timers }
  return { state: next, events: [statusEvent(next, now), ...released.events] }
}

function endShoot(s: ShootState, cmd: ShootCommandOf<'shoot.end'>, now: number): Outcome {
  const live = s.timers.filter(isShootTimerLive)
  if (live.length > 0 && !cmd.cancelTimers) {
    const list = live.map((t) => `"${t.label}" (${t.state === 'due' ? 'ringing' : `${clockTextMs(timerRemainingMs(t, now))} left`})`).join(', ')
    return fail('timers-active', `${live.length === 1 ? '1 timer still needs' : `${live.length} timers still need`} attention: ${list}. `
      + `Press ${press('timer.done')} or ${press('timer.cancel')} on each first, or ${press('shoot.end-cancel')}.`)
  }
  const events: ShootEvent[] = []
  const timers = s.timers.map((t) => {
    if (!isShootTimerLive(t)) return t
    events.push({ type: 'timer.changed', timerId: t.id, state: 'cancelled' })
    return cancelled(s, t, now)
  })
  if (s.rolling) events.push({ type: 'rolling.changed', rolling: false, atServerMs: now })
  const next: ShootState = { ...(s.rolling ? stopRolling(s, now) : s), status: 'ended', clock: shootClockStopped(s.clock, now), timers, endedAtServerMs: now }
  return { state: next, events: [...events, statusEvent(next, now)] }
}

// ---- the cursor --------------------------------------------------------------------------------

/** Moves the cursor; reaching a wait's beat starts its timer. */
function moveCursor(s: ShootState, cursor: ShootCursor, ctx: ShootCommandContext, now: number): Change {
  const moved: ShootState = { ...s, cursor: { segment: cursor.segment, step: cursor.step } }
  if (s.status === 'ready') return { state: moved, events: [] } // the shoot will start here
  const stepRef = shootCursorRef(moved)
  const shootMs = shootClockAt(s.clock, now)
  const visited = withChapter({ ...moved, visits: [...s.visits, { stepRef, enteredServerMs: now, enteredShootMs: shootMs }] }, ctx, now)
  const waited = startWait(visited, stepRef.stepId, actorOf(ctx), now)
  return { state: waited.state, events: [{ type: 'step.entered', stepRef, atServerMs: now, shootMs }, ...waited.events] }
}

/** A wait whose timer the host already started from its cue: Next goes past its beat. */
function waitStarted(s: ShootState, cursor: ShootCursor): boolean {
  const step = shootPlanStep(s, shootStepRefAt(s.runOrder, cursor)?.stepId ?? null)
  return isTimedWait(step) && !!stepTimerOf(s, step.id)
}

function stepBy(s: ShootState, by: 1 | -1, ctx: ShootCommandContext, now: number): Outcome {
  let target = shootCursorMoved(s.runOrder, s.cursor, by)
  if (!target) {
    return by === 1
      ? fail('at-last-step', 'This is the last step of the run order; there is no next step. Press “End the shoot” when it is done.')
      : fail('at-first-step', 'This is the first step of the run order; there is no previous step.')
  }
  while (by === 1 && waitStarted(s, target)) {
    const after = shootCursorMoved(s.runOrder, target, 1)
    if (!after) break
    target = after
  }
  return moveCursor(s, target, ctx, now)
}

function jumpTo(s: ShootState, cmd: ShootCommandOf<'step.jump'>, ctx: ShootCommandContext, now: number): Outcome {
  const ref = shootStepRefAt(s.runOrder, cmd)
  if (!ref) return fail('no-such-step', noSuchStep(s, cmd), s.runOrder[cmd.segment] ? 'step' : 'segment')
  if (ref.segment === s.cursor.segment && ref.step === s.cursor.step) return fail('no-change', 'The shoot is already at that step.')
  return moveCursor(s, ref, ctx, now)
}

/** "Start it now": the host confirms a wait's cue before reaching its beat. */
function startWaitNow(s: ShootState, cmd: ShootCommandOf<'wait.start'>, ctx: ShootCommandContext, now: number): Outcome {
  if (s.status === 'ready') return fail('not-started', `Press ${press('shoot.start')} first; a wait starts on the shoot clock.`)
  const step = shootPlanStep(s, cmd.stepId)
  if (!isTimedWait(step)) {
    return fail('no-such-step', `That step is not a wait with a time in this shoot's cook plan; press ${press('timer.start')} to time it by hand instead.`, 'stepId')
  }
  const started = stepTimerOf(s, step.id)
  if (started) return fail('already-started', `"${started.label}" has already been started.`)
  const waited = startWait(s, step.id, actorOf(ctx), now)
  if (waited.state === s) {
    return fail('too-many-timers', `${SHOOT_TIMER_SLOTS} timers are running, the most a shoot runs at once; press ${press('timer.done')} or ${press('timer.cancel')} on one first.`)
  }
  return waited
}

function noSuchStep(s: ShootState, at: ShootCursor): string {
  const seg = s.runOrder[at.segment]
  if (!seg) return `The run order has ${s.runOrder.length} segments; there is no segment ${at.segment + 1}.`
  return `${seg.title ? `“${seg.title}”` : `Segment ${at.segment + 1}`} has ${shootSegmentPositions(seg)} steps; there is no step ${at.step + 1}.`
}

// ---- timers ------------------------------------------------------------------------------------

function actorOf(ctx: ShootCommandContext): ShootActor {
  const { role, id, name } = ctx.actor
  return name === undefined ? { role, id } : { role, id, name }
}

function newId(given: string | undefined, ctx: ShootCommandContext, taken: (id: string) => boolean, what: string, field: string): string | Failure {
  const id = given ?? ctx.newId?.()
  if (typeof id !== 'string' || id === '') return fail('no-id', `The new ${what} could not be given a name to track it by; reload the screen and try again.`, field)
  if (taken(id)) return fail('duplicate-id', `That ${what} was already added (this screen sent it twice); nothing more to do.`, field)
  return id
}

function lowestFreeSlot(live: ShootTimer[]): number | null {
  for (let slot = 0; slot < SHOOT_TIMER_SLOTS; slot++) if (!live.some((t) => t.slot === slot)) return slot
  return null
}

function startTimer(s: ShootState, cmd: ShootCommandOf<'timer.start'>, ctx: ShootCommandContext, now: number): Outcome {
  if (s.timers.length >= SHOOT_TIMER_LIMIT) return fail('too-many-timers', `This shoot has had ${SHOOT_TIMER_LIMIT} timers, the most one shoot keeps.`)
  const live = s.timers.filter(isShootTimerLive)
  if (live.length >= SHOOT_TIMER_SLOTS) {
    return fail('too-many-timers', `${SHOOT_TIMER_SLOTS} timers are running, the most a shoot runs at once; press ${press('timer.done')} or ${press('timer.cancel')} on one first.`)
  }
  let slot: number
  if (cmd.slot !== undefined) {
    const holder = live.find((t) => t.slot === cmd.slot)
    if (holder) return fail('slot-taken', `Timer #${cmd.slot + 1} is already "${holder.label}"; pick another number, or leave it for Hobline to choose.`, 'slot')
    slot = cmd.slot
  } else {
    slot = lowestFreeSlot(live)!
  }
  const id = newId(cmd.timerId, ctx, (x) => s.timers.some((t) => t.id === x), 'timer', 'timerId')
  if (typeof id !== 'string') return id
  const stepRef = cmd.stepRef ? shootStepRefAt(s.runOrder, cmd.stepRef) : shootCursorRef(s)
  if (!stepRef) return fail('no-such-step', noSuchStep(s, cmd.stepRef!), 'stepRef')

  const spec = { id, slot, label: cmd.label, sound: cmd.sound ?? null, stepRef, durationMs: cmd.durationMs, origin: 'free' as const, checkLeftMs: null }
  const timer = newShootTimer(s, spec, actorOf(ctx), now)
  return {
    state: { ...s, timers: [...s.timers, timer] },
    events: [{ type: 'timer.changed', timerId: id, state: timer.state }],
  }
}

function findTimer(s: ShootState, timerId: string): ShootTimer | Failure {
  return s.timers.find((t) => t.id === timerId) ?? fail('unknown-timer', 'This shoot has no such timer; it may have been cancelled on another screen. Reload to see the timers as they are.', 'timerId')
}

function closedFailure(t: ShootTimer): Failure | null {
  if (t.state === 'cancelled') return fail('timer-closed', `"${t.label}" was cancelled; press ${press('timer.start')} for a new one.`)
  if (t.state === 'acknowledged') {
    const by = t.acknowledgedBy?.name ?? t.acknowledgedBy?.role ?? 'someone'
    return fail('timer-closed', `"${t.label}" is done (${by} pressed ${press('timer.done')}); press ${press('timer.start')} for a new one, or ${press('timer.add')} to run it again.`)
  }
  return null
}

function replaceTimer(s: ShootState, timer: ShootTimer, extra: ShootEvent[] = []): Change {
  return {
    state: { ...s, timers: s.timers.map((t) => (t.id === timer.id ? timer : t)) },
    events: [{ type: 'timer.changed', timerId: timer.id, state: timer.state }, ...extra],
  }
}

function rehearsalStopped(s: ShootState): boolean {
  return s.mode === 'rehearsal' && !s.clock.running
}

function pauseTimer(s: ShootState, cmd: ShootCommandOf<'timer.pause'>, now: number): Outcome {
  const t = findTimer(s, cmd.timerId)
  if ('ok' in t) return t
  const closed = closedFailure(t)
  if (closed) return closed
  if (t.state === 'due') return fail('timer-due', `"${t.label}" is ringing; press ${press('timer.done')}, or ${press('timer.add')} to run it again.`)
  if (t.state === 'paused') {
    return fail('timer-not-running', t.heldByShoot
      ? `"${t.label}" is paused with the rehearsal; it runs again when you press ${press('shoot.resume')}.`
      : `"${t.label}" is already paused.`)
  }
  return replaceTimer(s, shootTimerPausedAt(t, now))
}

function resumeTimer(s: ShootState, cmd: ShootCommandOf<'timer.resume'>, now: number): Outcome {
  const t = findTimer(s, cmd.timerId)
  if ('ok' in t) return t
  const closed = closedFailure(t)
  if (closed) return closed
  if (t.state === 'due') return fail('timer-due', `"${t.label}" is ringing; press ${press('timer.done')}, or ${press('timer.add')} to run it again.`)
  if (t.state === 'running') return fail('timer-not-paused', `"${t.label}" is running, not paused.`)
  if (rehearsalStopped(s)) {
    return fail('rehearsal-stopped', s.status === 'ready'
      ? `The rehearsal has not started and its timers wait for it; press ${press('shoot.start')} first.`
      : `The rehearsal is paused and its timers with it; press ${press('shoot.resume')} first.`)
  }
  return replaceTimer(s, shootTimerRunningFrom(t, now, t.remainingMs ?? 0, s.clock.speed))
}

function addTime(s: ShootState, cmd: ShootCommandOf<'timer.addTime'>, now: number): Outcome {
  const t = findTimer(s, cmd.timerId)
  if ('ok' in t) return t
  if (t.state === 'cancelled') return closedFailure(t)!
  const tooLong = () => fail('invalid', `That would leave more than 24 hours on "${t.label}"; a timer runs at most 24 hours.`, 'deltaMs')

  if (t.state === 'due' || t.state === 'acknowledged') {
    // A timer that has rung runs again for the time added ("two more minutes").
    if (cmd.deltaMs < 0) return fail('timer-due', `"${t.label}" has already rung; there is no time left to take off. Press ${press('timer.add')} to run it again.`)
    let slot = t.slot
    if (t.state === 'acknowledged') {
      const live = s.timers.filter(isShootTimerLive)
      if (live.some((o) => o.slot === slot)) {
        const free = lowestFreeSlot(live)
        if (free === null) return fail('too-many-timers', `${SHOOT_TIMER_SLOTS} timers are running, the most a shoot runs at once; press ${press('timer.done')} or ${press('timer.cancel')} on one first.`)
        slot = free
      }
    }
    const again: ShootTimer = { ...t, slot, durationMs: t.durationMs + cmd.deltaMs }
    const timer = rehearsalStopped(s)
      ? { ...again, state: 'paused' as const, deadlineServerMs: null, remainingMs: cmd.deltaMs, heldByShoot: true, dueAtServerMs: null, acknowledgedBy: null, acknowledgedAtServerMs: null }
      : shootTimerRunningFrom(again, now, cmd.deltaMs, s.clock.speed)
    return replaceTimer(s, timer)
  }

  const left = timerRemainingMs(t, now)
  const after = left + cmd.deltaMs
  if (after > SHOOT_TIMER_MAX_MS) return tooLong()
  if (after <= 0) {
    // Taking off all the time that is left: the timer is due now.
    const due = shootTimerDueAt({ ...t, durationMs: Math.max(0, Math.round(t.durationMs - left)) }, now)
    return replaceTimer(s, due, [dueEvent(due)])
  }
  const changed: ShootTimer = { ...t, durationMs: t.durationMs + cmd.deltaMs }
  if (t.state === 'paused') return replaceTimer(s, { ...changed, remainingMs: after })
  return replaceTimer(s, shootTimerRunningFrom(changed, now, after, t.speed))
}

function cancelled(s: ShootState, t: ShootTimer, now: number): ShootTimer {
  return {
    ...t, state: 'cancelled', remainingMs: Math.round(timerRemainingMs(t, now)), deadlineServerMs: null,
    heldByShoot: false, cancelledAtServerMs: now, closedAtShootMs: shootClockAt(s.clock, now),
  }
}

function cancelTimer(s: ShootState, cmd: ShootCommandOf<'timer.cancel'>, now: number): Outcome {
  const t = findTimer(s, cmd.timerId)
  if ('ok' in t) return t
  const closed = closedFailure(t)
  if (closed) return closed
  return replaceTimer(s, cancelled(s, t, now))
}

function acknowledgeTimer(s: ShootState, cmd: ShootCommandOf<'timer.acknowledge'>, ctx: ShootCommandContext, now: number): Outcome {
  const t = findTimer(s, cmd.timerId)
  if ('ok' in t) return t
  const closed = closedFailure(t)
  if (closed) return closed
  // A wait may be called done from its "check it" moment on (the short end of its range).
  if (t.state !== 'due' && !timerChecking(t, now)) {
    return fail('timer-not-due', `"${t.label}" has ${clockTextMs(timerRemainingMs(t, now))} left and is not ringing yet; press ${press('timer.cancel')} to stop it early.`)
  }
  const done: ShootTimer = {
    ...t, state: 'acknowledged', acknowledgedBy: actorOf(ctx), acknowledgedAtServerMs: now, closedAtShootMs: shootClockAt(s.clock, now),
    deadlineServerMs: t.state === 'due' ? t.deadlineServerMs : null, remainingMs: null, heldByShoot: false,
  }
  return replaceTimer(s, done)
}

function dueEvent(t: ShootTimer): ShootEvent {
  return { type: 'timer.due', timerId: t.id, label: t.label, slot: t.slot, sound: t.sound, dueAtServerMs: t.dueAtServerMs ?? t.deadlineServerMs ?? 0 }
}

// ---- rolling, speed, markers -----------------------------------------------------------------------

function setRolling(s: ShootState, cmd: ShootCommandOf<'rolling.set'>, ctx: ShootCommandContext, now: number): Outcome {
  if (cmd.rolling === s.rolling) return fail('no-change', s.rolling ? 'The camera is already rolling.' : `The camera is not rolling; press ${press('rolling.on')} to roll.`)
  if (!cmd.rolling) return { state: stopRolling(s, now), events: [{ type: 'rolling.changed', rolling: false, atServerMs: now }] }
  const rolled: ShootState = { ...s, rolling: true, rollingSinceServerMs: now, rollingSinceShootMs: shootClockAt(s.clock, now) }
  // The take opens on a chapter at the step on screen, when the shoot is under way.
  const next = s.status === 'ready' ? rolled : withChapter(rolled, ctx, now)
  return { state: next, events: [{ type: 'rolling.changed', rolling: true, atServerMs: now }] }
}

/** The camera stops: this roll's length joins the recording time of the rolls before. */
function stopRolling(s: ShootState, now: number): ShootState {
  return { ...s, rolling: false, rollingSinceServerMs: null, rollingSinceShootMs: null, recordedMs: recordingMsAt(s, now) ?? (s.recordedMs ?? 0) }
}

/** A chapter marker at the step the cursor is on, stamped with the recording time (only while rolling). */
function withChapter(s: ShootState, ctx: ShootCommandContext, now: number): ShootState {
  if (!s.rolling || s.markers.length >= SHOOT_MARKER_LIMIT) return s
  const id = `chapter-${s.seq + 1}-${s.markers.length + 1}`
  const marker: ShootMarker = {
    id, kind: 'chapter', text: null, shootMs: shootClockAt(s.clock, now), serverMs: now,
    stepRef: shootCursorRef(s), by: actorOf(ctx), rollingSinceServerMs: s.rollingSinceServerMs, recordingMs: recordingMsAt(s, now),
  }
  return { ...s, markers: [...s.markers, marker] }
}

function setSpeed(s: ShootState, cmd: ShootCommandOf<'clock.speed'>, now: number): Outcome {
  if (s.mode === 'take') return fail('take-mode', 'A recording runs in real time (1×); rehearsal speed is for rehearsals.')
  if (cmd.speed === s.clock.speed) return fail('no-change', `The rehearsal already runs at ${cmd.speed}×.`)
  const timers = s.timers.map((t) =>
    t.state === 'running' ? shootTimerRunningFrom(t, now, timerRemainingMs(t, now), cmd.speed) : t)
  return {
    state: { ...s, clock: shootClockAtSpeed(s.clock, now, cmd.speed), timers },
    events: [{ type: 'clock.changed', speed: cmd.speed, atServerMs: now }],
  }
}

function addMarker(s: ShootState, cmd: ShootCommandOf<'marker.add'>, ctx: ShootCommandContext, now: number): Outcome {
  if (s.status === 'ready') return fail('not-started', `Press ${press('shoot.start')} before marking: a marker is stamped with the shoot clock.`)
  if (s.markers.length >= SHOOT_MARKER_LIMIT) return fail('too-many-markers', `This shoot has ${SHOOT_MARKER_LIMIT} markers, the most one shoot keeps.`)
  const id = newId(cmd.markerId, ctx, (x) => s.markers.some((m) => m.id === x), 'marker', 'markerId')
  if (typeof id !== 'string') return id
  const marker = {
    id, kind: cmd.kind, text: cmd.text ? cmd.text : null, shootMs: shootClockAt(s.clock, now), serverMs: now,
    stepRef: shootCursorRef(s), by: actorOf(ctx), rollingSinceServerMs: s.rollingSinceServerMs, recordingMs: recordingMsAt(s, now),
  }
  return { state: { ...s, markers: [...s.markers, marker] }, events: [{ type: 'marker.added', markerId: id, kind: cmd.kind }] }
}

