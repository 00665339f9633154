// The shoot's state diff (server/shoot/state-diff.ts) against an independent JSON Patch library:
// for any two JSON documents, its patch applied by fast-json-patch's applyPatch (RFC 6902) gives the
// second document, and so does the screens' own apply (shoot-wire.ts). The worked examples are
// RFC 6902 Appendix A's (A.1 add, A.3 remove, A.5 replace) and RFC 6901 §3's escapes.
import fc from 'fast-check'
import jsonPatch from 'fast-json-patch'
import { describe, expect, it } from 'vitest'
import { diffStates } from '../../server/shoot/state-diff'
import { applyShootPatch } from '../../shared/utils/shoot-wire'

/** A document as the wire carries it. */
const wire = (v: unknown) => JSON.parse(JSON.stringify(v))

describe('diffStates', () => {
  it('RFC 6902 Appendix A: adding, removing and replacing an object member', () => {
    expect(diffStates({ foo: 'bar' }, { foo: 'bar', baz: 'qux' })).toEqual([{ op: 'add', path: '/baz', value: 'qux' }])
    expect(diffStates({ baz: 'qux', foo: 'bar' }, { foo: 'bar' })).toEqual([{ op: 'remove', path: '/baz' }])
    expect(diffStates({ baz: 'qux', foo: 'bar' }, { baz: 'boo', foo: 'bar' })).toEqual([{ op: 'replace', path: '/baz', value: 'boo' }])
  })

  it('escapes "~" and "/" in keys as RFC 6901 §3 says', () => {
    expect(diffStates({}, { 'a/b': 1, 'm~n': 2 })).toEqual([{ op: 'add', path: '/a~1b', value: 1 }, { op: 'add', path: '/m~0n', value: 2 }])
  })

  it('appends to an array at its end and removes from the end backwards', () => {
    expect(diffStates({ m: [1, 2] }, { m: [1, 2, 3, 4] })).toEqual([{ op: 'add', path: '/m/2', value: 3 }, { op: 'add', path: '/m/3', value: 4 }])
    expect(diffStates({ m: [1, 2, 3] }, { m: [1] })).toEqual([{ op: 'remove', path: '/m/2' }, { op: 'remove', path: '/m/1' }])
  })

  it('does not walk a part shared by both states: a thousand markers cost nothing when one timer changes', () => {
    const markers = Array.from({ length: 1000 }, (_, i) => ({ id: `m${i}`, kind: 'note', serverMs: i }))
    const before = { seq: 4, markers, timers: [{ id: 't1', state: 'running' }] }
    const after = { ...before, seq: 5, timers: [{ id: 't1', state: 'paused' }] }
    // A getter that throws if the diff reads into the shared markers.
    Object.defineProperty(markers, 0, { get: () => { throw new Error('walked the shared markers') }, enumerable: true })
    expect(diffStates(before, after)).toEqual([{ op: 'replace', path: '/seq', value: 5 }, { op: 'replace', path: '/timers/0/state', value: 'paused' }])
  })

  it('reads only the objects\' own members ("valueOf" and "toString" of {} are not members)', () => {
    expect(diffStates({}, { valueOf: 0 })).toEqual([{ op: 'add', path: '/valueOf', value: 0 }])
    expect(diffStates({ toString: '' }, {})).toEqual([{ op: 'remove', path: '/toString' }])
  })

  it('treats undefined members as absent, as JSON does', () => {
    expect(diffStates({ a: 1, b: undefined }, { a: 1 })).toEqual([])
    expect(diffStates({ a: 1 }, { a: undefined })).toEqual([{ op: 'remove', path: '/a' }])
    expect(diffStates({ a: undefined }, { a: 2 })).toEqual([{ op: 'add', path: '/a', value: 2 }])
  })

  it('any two JSON documents: applied by fast-json-patch and by the screens, the patch gives the second', () => {
    const doc = fc.jsonValue({ maxDepth: 4 })
    fc.assert(fc.property(doc, doc, (a, b) => {
      // A "__proto__" member is refused by both appliers by design (no shoot state has one).
      fc.pre(!JSON.stringify([a, b]).includes('"__proto__"'))
      const [before, after] = [wire(a), wire(b)]
      const patch = wire(diffStates(before, after))
      expect(jsonPatch.applyPatch(wire(before), wire(patch), true, false).newDocument).toEqual(after)
      expect(applyShootPatch(wire(before), patch)).toEqual(after)
    }), { numRuns: 2000 })
  })

  it('a document changed in part: the patch from the shared structure equals in effect fast-json-patch\'s compare', () => {
    fc.assert(fc.property(fc.dictionary(fc.string({ maxLength: 4 }), fc.jsonValue({ maxDepth: 3 })), fc.string({ maxLength: 4 }), fc.jsonValue({ maxDepth: 2 }),
      (base, key, value) => {
        fc.pre(!JSON.stringify([base, key, value]).includes('__proto__'))
        const before = wire(base)
        const after = { ...before, [key]: wire(value) }
        const ours = applyShootPatch(wire(before), wire(diffStates(before, after)))
        const theirs = jsonPatch.applyPatch(wire(before), jsonPatch.compare(before, after), true, false).newDocument
        expect(ours).toEqual(theirs)
      }), { numRuns: 1000 })
  })
})
