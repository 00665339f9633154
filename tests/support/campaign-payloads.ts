// Generated bad input for the campaign (tests/server/campaign.test.ts), with fast-check: values of
// every wrong kind (wrong types, huge and unicode strings, negative and enormous numbers), JSON
// bodies with fields replaced, dropped and added, raw bodies that are not JSON (broken JSON, HTML,
// CSV, form posts), bad route ids, and files whose bytes lie about their type.
import fc from 'fast-check'

/** Text that is hard on readers: control characters, right-to-left marks, emoji, markup, paths. */
const nasty = fc.constantFrom(
  '\u0000', '\u202e', '\ufeff', '💥🍝', 'Ω≈ç√', '<script>alert(1)</script>', '"; DROP TABLE recipes; --', '../../etc/passwd',
  '%00', '${7*7}', '{{7*7}}', '\\u0000', 'null', 'undefined', 'NaN', '-1', '1e999', ' ', '\n\t',
)
const huge = fc.tuple(fc.constantFrom('x', 'é', '💥', '<a>', '1/2 '), fc.integer({ min: 1_000, max: 60_000 })).map(([s, n]) => s.repeat(n))

/** A value of any JSON kind, weighted towards the kinds that break validators. */
export const junk: fc.Arbitrary<unknown> = fc.oneof(
  { arbitrary: fc.constantFrom(null, true, false, 0, -1, -0.5, 1e308, -1e308, 2 ** 53 + 2, 1.5, ''), weight: 4 },
  { arbitrary: fc.integer({ min: -1e12, max: 1e12 }), weight: 2 },
  { arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }), weight: 2 },
  { arbitrary: fc.string({ maxLength: 40 }), weight: 3 },
  { arbitrary: fc.string({ unit: 'grapheme', maxLength: 40 }), weight: 2 },
  { arbitrary: nasty, weight: 3 },
  { arbitrary: huge, weight: 1 },
  { arbitrary: fc.array(fc.oneof(fc.integer(), fc.string({ maxLength: 8 })), { maxLength: 5 }), weight: 2 },
  { arbitrary: fc.dictionary(fc.string({ maxLength: 8 }), fc.oneof(fc.integer(), fc.string({ maxLength: 8 })), { maxKeys: 3 }), weight: 2 },
)

/** A JSON body built from a valid `base`: some fields replaced by junk, some dropped, extras added; or not an object at all. */
export function jsonBodies(base: Record<string, unknown>): fc.Arbitrary<unknown> {
  const keys = Object.keys(base)
  const mutated = fc.record({
    replace: keys.length ? fc.subarray(keys, { minLength: 1 }) : fc.constant([] as string[]),
    values: fc.array(junk, { minLength: keys.length, maxLength: keys.length }),
    drop: fc.subarray(keys),
    extra: fc.dictionary(fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom('__proto__', 'constructor', 'id', 'studioId', 'role')), junk, { maxKeys: 3 }),
  }).map(({ replace, values, drop, extra }) => {
    const body = new Map<string, unknown>([...Object.entries(extra), ...Object.entries(base)])
    replace.forEach((key, i) => body.set(key, values[i]))
    for (const key of drop) if (!replace.includes(key)) body.delete(key)
    return Object.fromEntries(body)
  })
  return fc.oneof({ arbitrary: mutated, weight: 8 }, { arbitrary: junk, weight: 2 })
}

/** A body as raw text with its Content-Type: broken JSON, HTML, CSV, a form post, XML, nothing. */
export const rawBodies: fc.Arbitrary<{ text: string; type: string }> = fc.oneof(
  fc.string({ maxLength: 60 }).map((s) => ({ text: `{"${s}`, type: 'application/json' })),
  fc.string({ maxLength: 60 }).map((s) => ({ text: `[${s}`, type: 'application/json' })),
  fc.constantFrom('{', '}', '{"a":', '{"a":1,}', "{'a':1}", 'NaN', '{"a":1}{"b":2}', '\ufeff{}x').map((text) => ({ text, type: 'application/json' })),
  fc.string({ maxLength: 80 }).map((s) => ({ text: `<html><body><p>${s}</p>`, type: 'text/html' })),
  fc.array(fc.string({ maxLength: 10 }), { maxLength: 6 }).map((cells) => ({ text: `a,b,c\n${cells.join(',')}\n`, type: 'text/csv' })),
  fc.string({ maxLength: 40 }).map((s) => ({ text: `name=${encodeURIComponent(s)}&role=producer`, type: 'application/x-www-form-urlencoded' })),
  fc.string({ maxLength: 40 }).map((s) => ({ text: `<?xml version="1.0"?><a>${s}</a>`, type: 'application/xml' })),
  fc.string({ maxLength: 40 }).map((text) => ({ text, type: 'text/plain' })),
)

/** Route ids that name no row: not numbers, not whole, not positive, past any id given out. */
export const badIds: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom('0', '-1', '1.5', '1e3', 'NaN', 'Infinity', '0x10', ' 1', '%20', '9007199254740993', '99999999999999999999', 'null', '💥'),
  fc.integer({ min: 10_000_000, max: 2_000_000_000 }).map(String),
  fc.integer({ min: -1e9, max: -1 }).map(String),
  fc.string({ minLength: 1, maxLength: 30 }).filter((s) => !/^\d+$/.test(s.trim())),
  huge.map((s) => s.slice(0, 2000)),
).map((s) => encodeURIComponent(s))

/** Tokens in links (invites, password resets) that were never given out. */
export const badTokens: fc.Arbitrary<string> = fc.oneof(
  fc.string({ minLength: 1, maxLength: 80 }),
  fc.stringMatching(/^[A-Za-z0-9_-]{43}$/),
  huge.map((s) => s.slice(0, 2000)),
).map((s) => encodeURIComponent(s))

const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]
const JPEG = [0xff, 0xd8, 0xff, 0xe0]
const WEBP = [...Buffer.from('RIFF'), 0, 0, 0, 0, ...Buffer.from('WEBPVP8 ')]

/** A photo upload that is no photo: random bytes, a true header over garbage, other formats named as images, wrong fields. */
export const badUploads: fc.Arbitrary<{ field: string; name: string; type: string; bytes: Uint8Array }> = fc.record({
  field: fc.oneof({ arbitrary: fc.constant('photo'), weight: 6 }, { arbitrary: fc.string({ maxLength: 10 }), weight: 1 }),
  name: fc.constantFrom('dish.jpg', 'dish.png', 'dish.webp', 'dish.svg', 'dish.gif', '../../x.jpg', 'x'),
  type: fc.constantFrom('image/jpeg', 'image/png', 'image/webp', 'image/svg+xml', 'image/gif', 'text/html', 'application/octet-stream'),
  bytes: fc.oneof(
    fc.uint8Array({ maxLength: 4096 }),
    fc.tuple(fc.constantFrom(PNG, JPEG, WEBP), fc.uint8Array({ maxLength: 4096 })).map(([head, rest]) => Uint8Array.from([...head, ...rest])),
    fc.constantFrom('<svg xmlns="http://www.w3.org/2000/svg"/>', 'GIF89a\u0001\u0000\u0001\u0000', '<html><script>alert(1)</script>', '')
      .map((s) => new TextEncoder().encode(s)),
  ),
})

/** A price list that is not one: wrong columns, negative and non-numeric prices, unknown units, junk. */
export const badPriceLists: fc.Arbitrary<string> = fc.oneof(
  fc.array(fc.tuple(fc.string({ maxLength: 20 }), fc.oneof(fc.string({ maxLength: 6 }), fc.constantFrom('-1', '0', '1e999', 'NaN')), fc.string({ maxLength: 6 }), fc.oneof(fc.string({ maxLength: 6 }), fc.constantFrom('-2.00', 'free', '1,2,3')), fc.string({ maxLength: 4 })), { maxLength: 8 })
    .map((rows) => `item,package size,unit,price,currency\n${rows.map((r) => r.join(',')).join('\n')}\n`),
  fc.string({ maxLength: 300 }),
  huge.map((s) => `item,package size,unit,price,currency\n${s}`),
)

/** Recipe imports that hold no recipe to save: broken JSON-LD, pages without it, wrong types. */
export const badImports: fc.Arbitrary<{ text: string; type: string }> = fc.oneof(
  jsonBodies({ '@context': 'https://schema.org', '@type': 'Recipe', name: 'Campaign bread', recipeYield: '2', recipeIngredient: ['1 cup flour'] })
    .map((body) => ({ text: JSON.stringify(body) ?? 'null', type: 'application/ld+json' })),
  fc.string({ maxLength: 200 }).map((s) => ({ text: `<html><script type="application/ld+json">{"@type":"Recipe",${s}</script>`, type: 'text/html' })),
  fc.string({ maxLength: 200 }).map((s) => ({ text: `<html><body>${s}`, type: 'text/html' })),
  fc.constantFrom('<script type=application/ld+json>'.repeat(2000), '<a><b>'.repeat(20_000), '{"@graph":'.repeat(5000)).map((text) => ({ text, type: 'text/html' })),
  rawBodies,
)
