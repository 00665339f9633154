// The shoot:event wire (shared/utils/shoot-wire.ts): a JSON Patch (RFC 6902) from the state at
// baseSeq to the state at seq. The patches are made by fast-json-patch's compare, as the engine
// makes them, and the screens' small apply is checked against the package's own applyPatch (the
// reference implementation here) and against RFC 6902's examples (Appendix A) and RFC 6901's
// pointer escapes (§3, "~1" for "/", "~0" for "~").
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import fastJsonPatch from 'fast-json-patch'
import type { ShootActor, ShootSegment, ShootState } from '../../shared/types/shoot'
import { createShootState } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { applyShootMessage, applyShootPatch, type ShootPatchOperation } from '../../shared/utils/shoot-wire'

const { applyPatch, compare, deepClone } = fastJsonPatch
const diff = (a: unknown, b: unknown) => compare(a as object, b as object) as ShootPatchOperation[]

const RUN_ORDER: ShootSegment[] = [
  { id: 'intro', title: 'Welcome', stepIds: [] },
  { id: 'orzo', title: 'Lemon orzo', stepIds: ['orzo-boil', 'orzo-cook'] },
  { id: 'outro', title: 'Sign-off', stepIds: [] },
]
const HOST: ShootActor = { role: 'host', id: 'user:2', name: 'Host' }
const T0 = 1_760_000_000_000

describe('applyShootPatch', () => {
  it('applies RFC 6902 Appendix A.1, A.2, A.3, A.4 and A.5 as written there', () => {
    expect(applyShootPatch({ foo: 'bar' }, [{ op: 'add', path: '/baz', value: 'qux' }])).toEqual({ baz: 'qux', foo: 'bar' })
    expect(applyShootPatch({ foo: ['bar', 'baz'] }, [{ op: 'add', path: '/foo/1', value: 'qux' }])).toEqual({ foo: ['bar', 'qux', 'baz'] })
    expect(applyShootPatch({ baz: 'qux', foo: 'bar' }, [{ op: 'remove', path: '/baz' }])).toEqual({ foo: 'bar' })
    expect(applyShootPatch({ foo: ['bar', 'qux', 'baz'] }, [{ op: 'remove', path: '/foo/1' }])).toEqual({ foo: ['bar', 'baz'] })
    expect(applyShootPatch({ baz: 'qux', foo: 'bar' }, [{ op: 'replace', path: '/baz', value: 'boo' }])).toEqual({ baz: 'boo', foo: 'bar' })
  })

  it('appends with "-" (RFC 6902 A.16) and reads RFC 6901 escapes', () => {
    expect(applyShootPatch({ foo: ['bar'] }, [{ op: 'add', path: '/foo/-', value: ['abc', 'def'] }])).toEqual({ foo: ['bar', ['abc', 'def']] })
    expect(applyShootPatch({ 'a/b': 1, 'm~n': 2 }, [{ op: 'replace', path: '/a~1b', value: 3 }, { op: 'remove', path: '/m~0n' }])).toEqual({ 'a/b': 3 })
  })

  it('refuses what cannot apply: a missing member or index (RFC 6902 §4.2, §4.3, A.12), an unknown operation, a path that is no pointer', () => {
    expect(() => applyShootPatch({ foo: 'bar' }, [{ op: 'remove', path: '/baz' }])).toThrow()
    expect(() => applyShootPatch({ foo: 'bar' }, [{ op: 'replace', path: '/baz', value: 1 }])).toThrow()
    expect(() => applyShootPatch({ foo: 'bar' }, [{ op: 'add', path: '/baz/bat', value: 'qux' }])).toThrow()
    expect(() => applyShootPatch({ foo: [1] }, [{ op: 'add', path: '/foo/2', value: 3 }])).toThrow()
    expect(() => applyShootPatch({ foo: [1] }, [{ op: 'replace', path: '/foo/01', value: 3 }])).toThrow()
    expect(() => applyShootPatch({ foo: 1 }, [{ op: 'move', path: '/bar', from: '/foo' } as unknown as ShootPatchOperation])).toThrow()
    expect(() => applyShootPatch({ foo: 1 }, [{ op: 'replace', path: 'foo', value: 2 }])).toThrow()
    expect(() => applyShootPatch({}, [{ op: 'add', path: '/__proto__', value: { polluted: true } }])).toThrow()
  })

  it('gives the state fast-json-patch gives for any two JSON documents, and leaves the old one as it was', () => {
    fc.assert(fc.property(fc.jsonValue(), fc.jsonValue(), (a, b) => {
      const before = { doc: a }
      const after = { doc: b }
      const frozen = JSON.stringify(before)
      const patch = diff(before, after)
      const ours = applyShootPatch(before, patch)
      const theirs = applyPatch(deepClone(before), deepClone(patch) as never).newDocument
      // As the wire carries them (JSON has no -0: fast-json-patch clones through JSON, ours keeps the value given).
      const wire = (v: unknown) => JSON.parse(JSON.stringify(v))
      expect(wire(ours)).toEqual(wire(theirs))
      expect(JSON.parse(JSON.stringify(ours))).toEqual(JSON.parse(JSON.stringify(after)))
      expect(JSON.stringify(before)).toBe(frozen)
    }), { numRuns: 500 })
  })
})

describe('applyShootMessage', () => {
  const ready = createShootState({ id: '1', mode: 'rehearsal', runOrder: RUN_ORDER })
  const step = (s: ShootState, command: object, at: number) => {
    const r = applyShootCommand(s, command, { nowServerMs: at, actor: HOST, newId: () => `id${at}` })
    if (!r.ok) throw new Error(r.error.message)
    return r.state
  }

  it('follows a shoot command by command from its patches alone', () => {
    let server = ready
    let screen: ShootState = JSON.parse(JSON.stringify(ready))
    const commands = [{ type: 'shoot.start' }, { type: 'step.next' }, { type: 'timer.start', label: 'Orzo', durationMs: 480_000 },
      { type: 'marker.add', kind: 'good' }, { type: 'shoot.pause' }, { type: 'shoot.resume' }, { type: 'step.previous' }]
    commands.forEach((c, i) => {
      const next = step(server, c, T0 + i * 1000)
      const patch = JSON.parse(JSON.stringify(diff(server, next)))
      screen = applyShootMessage(screen, { baseSeq: server.seq, seq: next.seq, patch })!
      expect(screen).toEqual(JSON.parse(JSON.stringify(next)))
      server = next
    })
    // A marker is one added member, not the whole list again.
    const marked = step(server, { type: 'marker.add', kind: 'note', text: 'Steam' }, T0 + 99_000)
    expect(diff(server, marked).filter((op) => op.path.startsWith('/markers/'))).toHaveLength(1)
  })

  it('asks for a snapshot (null) on a gap, on a patch that does not apply, and on a patch that ends at another seq', () => {
    const started = step(ready, { type: 'shoot.start' }, T0)
    const next = step(started, { type: 'step.next' }, T0 + 1000)
    const patch = diff(started, next)
    expect(applyShootMessage(ready, { baseSeq: started.seq, seq: next.seq, patch })).toBeNull()
    expect(applyShootMessage(null, { baseSeq: started.seq, seq: next.seq, patch })).toBeNull()
    expect(applyShootMessage(started, { baseSeq: started.seq, seq: next.seq, patch: [{ op: 'remove', path: '/nothing' }] })).toBeNull()
    expect(applyShootMessage(started, { baseSeq: started.seq, seq: next.seq + 1, patch })).toBeNull()
    expect(applyShootMessage(started, { baseSeq: started.seq, seq: next.seq, patch })).toEqual(next)
  })
})
