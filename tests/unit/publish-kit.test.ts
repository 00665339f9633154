// The publish kit's chapter lines, Clip parts and description, worked by hand from a small take log.
import { describe, expect, it } from 'vitest'
import { recipeClips, segmentChapterLines, videoAt, videoDescription } from '../../shared/utils/publish-kit'
import { takeChapters, openPickups } from '../../shared/utils/take-log'
import type { ShootMarker } from '../../shared/types/shoot'

const runOrder = [
  { id: 'segment-intro', title: 'Hello and the premise', stepIds: [] },
  { id: 'segment-stew', title: 'Smoky bean stew', stepIds: ['11', '12'] },
  { id: 'segment-outro', title: 'Sign-off', stepIds: [] },
]
let n = 0
function marker(kind: ShootMarker['kind'], segmentId: string, stepId: string | null, recordingMs: number | null, serverMs = 1_000 + n): ShootMarker {
  n += 1
  const segment = runOrder.findIndex((s) => s.id === segmentId)
  return {
    id: `m${n}`, kind, text: null, shootMs: 0, serverMs, by: { role: 'camera', name: 'Cam' } as ShootMarker['by'],
    stepRef: { segment, step: 0, segmentId, stepId }, rollingSinceServerMs: 0, recordingMs,
  }
}

// A recording: the intro at 0:00, the stew's two steps at 1:35.5 and 2:10.25, back to its first
// step at 2:30 (a pickup), the outro at 3:20.999, and a note that is not a chapter.
const log: ShootMarker[] = [
  marker('chapter', 'segment-intro', null, 0),
  marker('chapter', 'segment-stew', '11', 95_500),
  marker('chapter', 'segment-stew', '12', 130_250),
  marker('note', 'segment-stew', '12', 140_000),
  marker('chapter', 'segment-stew', '11', 150_000),
  marker('chapter', 'segment-outro', null, 200_999),
]

describe('chapter lines for the video description', () => {
  it('one line per segment at its first chapter, seconds rounded down (worked by hand)', () => {
    const { lines, startsAtZero } = segmentChapterLines(takeChapters(log, runOrder))
    expect(lines.map((l) => l.line)).toEqual(['0:00 Hello and the premise', '1:35 Smoky bean stew', '3:20 Sign-off'])
    expect(startsAtZero).toBe(true)
  })
  it('writes hours from the first hour, and says when the first line is not at 0:00', () => {
    const late = [marker('chapter', 'segment-stew', '11', 3_725_000)]
    const { lines, startsAtZero } = segmentChapterLines(takeChapters(late, runOrder))
    expect(lines[0]!.line).toBe('1:02:05 Smoky bean stew') // 3725 s = 1 h 2 min 5 s
    expect(startsAtZero).toBe(false)
  })
  it('leaves out markers made while the camera was not rolling', () => {
    expect(takeChapters([marker('chapter', 'segment-intro', null, null)], runOrder)).toEqual([])
  })
})

describe('Clip parts of a recipe video', () => {
  it('one Clip per step of the segment, from its first chapter to the next chapter of the recording', () => {
    const names = { 11: 'Soften the onions', 12: 'Simmer the beans' } as Record<string, string>
    const chapters = takeChapters(log, runOrder).map((c) => ({ ...c, name: names[c.stepId ?? ''] ?? c.segmentTitle }))
    const clips = recipeClips(new Set(['11', '12']), chapters, 240_000, 'https://video.example/watch?v=abc')
    expect(clips).toEqual([
      { '@type': 'Clip', name: 'Soften the onions', startOffset: 95.5, endOffset: 130.25, url: 'https://video.example/watch?v=abc&t=95' },
      { '@type': 'Clip', name: 'Simmer the beans', startOffset: 130.25, endOffset: 150, url: 'https://video.example/watch?v=abc&t=130' },
    ])
  })
  it('the last clip of a recording ends where the recording ends', () => {
    const last = [...log, marker('chapter', 'segment-stew', '12', 230_000)]
    const chapters = takeChapters(last, runOrder).map((c) => ({ ...c, name: 'Simmer the beans' }))
    expect(recipeClips(new Set(['12']), chapters, 240_000, null)).toEqual([
      { '@type': 'Clip', name: 'Simmer the beans', startOffset: 130.25, endOffset: 150 },
    ])
    const onlyLast = takeChapters([marker('chapter', 'segment-stew', '12', 230_000)], runOrder).map((c) => ({ ...c, name: 'Simmer' }))
    expect(recipeClips(new Set(['12']), onlyLast, 240_000, null)).toEqual([{ '@type': 'Clip', name: 'Simmer', startOffset: 230, endOffset: 240 }])
  })
  it('a cook-plan segment that interleaves two recipes: one line per recipe, and each recipe\'s Clips are its own steps', () => {
    // Steps 11 and 12 are the stew's, 21 the flatbread's, all in one cooking segment.
    const cooking = [{ id: 'segment-cook', title: 'Cooking', stepIds: ['11', '21', '12'] }]
    const recipeOf = new Map([['11', 'Smoky bean stew'], ['12', 'Smoky bean stew'], ['21', 'Pan flatbreads']])
    const interleaved = [
      marker('chapter', 'segment-cook', '11', 10_000), marker('chapter', 'segment-cook', '21', 70_000), marker('chapter', 'segment-cook', '12', 100_000),
    ]
    const chapters = takeChapters(interleaved, cooking, recipeOf)
    expect(segmentChapterLines(chapters).lines.map((l) => l.line)).toEqual(['0:10 Smoky bean stew', '1:10 Pan flatbreads'])
    const clips = recipeClips(new Set(['11', '12']), chapters.map((c) => ({ ...c, name: c.stepId! })), 130_000, null)
    expect(clips.map((c) => [c.name, c.startOffset, c.endOffset])).toEqual([['11', 10, 70], ['12', 100, 130]])
  })
  it('puts the second into the video address', () => {
    expect(videoAt('https://video.example/v/abc', 61_999)).toBe('https://video.example/v/abc?t=61')
  })
})

describe('pickups still to record', () => {
  it('stay open until a later good take on the same step', () => {
    const pickup = marker('pickup', 'segment-stew', '12', 135_000, 5_000)
    const earlierGood = marker('good', 'segment-stew', '12', 120_000, 4_000)
    expect(openPickups([earlierGood, pickup]).map((m) => m.id)).toEqual([pickup.id])
    const laterGoodElsewhere = marker('good', 'segment-stew', '11', 160_000, 6_000)
    expect(openPickups([pickup, laterGoodElsewhere])).toHaveLength(1)
    expect(openPickups([pickup, marker('good', 'segment-stew', '12', 170_000, 7_000)])).toEqual([])
  })
})

describe('the video description', () => {
  it('premise, chapters, then each recipe with its cost line and ingredients', () => {
    const text = videoDescription({
      title: 'Three dinners under £2', premise: 'Three dinners for four, each under £2 a serving.',
      chapters: segmentChapterLines(takeChapters(log, runOrder)).lines,
      recipes: [{ title: 'Smoky bean stew', costLine: '£1.20 a serving (£1.35 with the optional parsley)', ingredients: ['2 × 400 g tins beans', '1 onion'], pageUrl: null }],
      pricesLine: 'Prices seen at Marrow Lane Grocer, 3 Nov 2026.',
    })
    expect(text).toBe([
      'Three dinners under £2', '', 'Three dinners for four, each under £2 a serving.', '',
      'Chapters', '0:00 Hello and the premise', '1:35 Smoky bean stew', '3:20 Sign-off', '',
      'Smoky bean stew', '£1.20 a serving (£1.35 with the optional parsley)', '- 2 × 400 g tins beans', '- 1 onion', '',
      'Prices seen at Marrow Lane Grocer, 3 Nov 2026.',
    ].join('\n') + '\n')
  })
})
