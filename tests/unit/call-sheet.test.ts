// The call sheet builder on a small episode worked by hand, and the change summary of a re-send.
import { describe, expect, it } from 'vitest'
import {
  addMinutes, buildCallSheet, callSheetChanges, callSheetSnapshot, peakUse, shootDateText, type CallSheetInput,
} from '../../shared/utils/call-sheet'
import { zonedTimeToUtc } from '../../shared/utils/time-zone'

const MIN = 60_000

function small(over: Partial<CallSheetInput> = {}): CallSheetInput {
  return {
    episode: { id: 7, title: 'Soup and bread', shootDate: '2026-12-10' },
    studio: { name: 'Test Kitchen', locale: 'en-GB', timeZone: 'Europe/London', units: 'metric', kitchen: { hands: 1, burners: 4, ovens: 1, racksPerOven: 2, parallelRecipes: true } },
    details: { callTime: '08:30', place: '1 Test Lane', hospital: null, crewCalls: [{ userId: 2, callTime: '07:45' }] },
    crew: [
      { userId: 1, name: 'Pat Producer', email: 'pat@example.test', role: 'producer' },
      { userId: 2, name: 'Hal Host', email: 'hal@example.test', role: 'host' },
    ],
    segments: [
      { id: 'intro', kind: 'intro', title: 'Welcome', plannedMs: 45_000 }, // 0:45
      { id: 'soup', kind: 'recipe', title: 'Leek soup', plannedMs: 30 * MIN + 20_000 }, // 30:20
      { id: 'sponsor', kind: 'sponsor', title: 'A word from Kettlebrook', plannedMs: 40_000 }, // 0:40
      { id: 'bread', kind: 'recipe', title: 'Soda bread', plannedMs: 35 * MIN }, // 35:00
      { id: 'outro', kind: 'outro', title: 'Sign-off', plannedMs: 30_000 }, // 0:30
    ],
    steps: [
      { station: 'counter', cautions: ['knife'] },
      { station: 'burner', cautions: ['boiling'] },
      { station: 'burner', cautions: [] },
      { station: 'oven', cautions: ['oven'] },
      { station: null, cautions: ['blending-hot'] },
    ],
    ingredients: [
      { item: 'leeks', allergens: { eu: [], us: [] } },
      { item: 'butter', allergens: { eu: ['milk'], us: ['milk'] }, allergenState: 'checked' },
      { item: 'plain flour', allergens: { eu: ['cereals-gluten'], us: ['wheat'] }, allergenState: 'suggested' },
    ],
    peak: { burner: 2, oven: 1 },
    ...over,
  }
}

describe('call sheet', () => {
  it('times the run order from the call time, each segment after the planned lengths before it', () => {
    // Worked by hand: starts at 0, 0:45, 31:05, 31:45, 66:45 min after 08:30 → 0, 1, 31, 32, 67 to the
    // minute (0.75 rounds up to 1, 31.08 down to 31, 31.75 up to 32, 66.75 up to 67); the whole run is
    // 67:15, so the planned wrap is 08:30 + 67 = 09:37.
    const sheet = buildCallSheet(small())
    expect(sheet.runOrder.map((r) => r.startMin)).toEqual([0, 1, 31, 32, 67])
    expect(sheet.runOrder.map((r) => r.start)).toEqual(['08:30', '08:31', '09:01', '09:02', '09:37'])
    expect(sheet.plannedMs).toBe(67 * MIN + 15_000)
    expect(sheet.wrap).toBe('09:37')
    expect(sheet.runOrder[2]!.kind).toBe('Sponsor read')
  })

  it('puts the call in the studio\'s time zone: London is on GMT in December and BST (UTC+1) in July', () => {
    // IANA tzdata: Europe/London keeps GMT from the last Sunday of October to the last Sunday of March.
    const sheet = buildCallSheet(small())
    expect(sheet.startsAt).toBe('2026-12-10T08:30:00.000Z')
    expect(sheet.endsAt).toBe('2026-12-10T09:37:15.000Z')
    expect(zonedTimeToUtc('2026-07-10', '08:30', 'Europe/London').toISOString()).toBe('2026-07-10T07:30:00.000Z')
    // New York is on EST (UTC−5) in December; Tokyo at UTC+9 all year.
    expect(zonedTimeToUtc('2026-12-10', '08:30', 'America/New_York').toISOString()).toBe('2026-12-10T13:30:00.000Z')
    expect(zonedTimeToUtc('2026-12-10', '08:30', 'Asia/Tokyo').toISOString()).toBe('2026-12-09T23:30:00.000Z')
    // 2026-12-10 is a Thursday (Zeller's congruence by hand: h = (10 + 33 + 26 + 6 + 5 + 100) mod 7 = 5).
    expect(sheet.dateText).toBe('Thursday, 10 December 2026')
    expect(shootDateText('2026-12-10', 'en-US')).toBe('Thursday, December 10, 2026')
  })

  it('gives each crew member their own call time or the sheet\'s, with the role in words', () => {
    const sheet = buildCallSheet(small())
    expect(sheet.crew).toEqual([
      { userId: 1, name: 'Pat Producer', email: 'pat@example.test', role: 'Producer', callTime: '08:30' },
      { userId: 2, name: 'Hal Host', email: 'hal@example.test', role: 'Host', callTime: '07:45' },
    ])
    const none = buildCallSheet(small({ details: { callTime: null, place: '', hospital: '  ', crewCalls: [] } }))
    expect(none.runOrder.every((r) => r.start === null)).toBe(true)
    expect([none.startsAt, none.wrap, none.place, none.hospital]).toEqual([null, null, null, null])
  })

  it('lists the equipment the plan uses from the stations, the kitchen and the cautions', () => {
    const sheet = buildCallSheet(small())
    expect(sheet.equipment).toEqual([
      'Hob: 4 burners in the kitchen, the plan uses up to 2 at once',
      'Oven: 1 oven, 2 dishes each, the plan uses up to 1 dish at once',
      'Counter space for prep',
      'Sharp knives and boards on damp cloths',
      'Large pans for boiling, and a colander in the sink',
      'Dry oven gloves',
      'Blender with a vented lid, and a folded towel',
    ])
    expect(buildCallSheet(small({ peak: null })).equipment[0]).toBe('Hob: 4 burners in the kitchen')
  })

  it('names the allergens on set in the EU list, and the US list as well for a studio in US units', () => {
    const eu = buildCallSheet(small())
    expect(eu.allergens.eu).toEqual(['Cereals containing gluten (wheat (such as spelt and khorasan wheat), rye, barley, oats)', 'Milk (including lactose)'])
    expect(eu.allergens.us).toBeNull()
    expect(eu.allergens.unchecked).toBe(1)
    const us = buildCallSheet(small({ studio: { ...small().studio, units: 'us', locale: 'en-US' } }))
    expect(us.allergens.us).toEqual(['Milk', 'Wheat'])
  })

  it('writes safety notes for the cautions present, allergens, and food held warm, deferring to local rules', () => {
    const sheet = buildCallSheet(small())
    expect(sheet.safety.map((s) => s.label)).toEqual(['Hot oven', 'Sharp knife', 'Blending hot liquid', 'Boiling liquid', 'Allergens on set', 'Food kept warm'])
    const warm = sheet.safety.find((s) => s.id === 'hot-holding')!
    // UK studio: the UK's 63 °C first (Food Safety and Hygiene (England) Regulations 2013, cited in cautions.ts).
    expect(warm.text).toMatch(/^Food kept warm\. UK food hygiene rules: hold hot food at 63 °C or above/)
    expect(warm.text).toContain('Follow your local food-safety rules.')
    expect(sheet.safety.find((s) => s.id === 'allergen')!.text).toMatch(/^Allergens on set: Cereals containing gluten, Milk\. Tell the crew/)
  })

  it('adds minutes on a 24-hour clock and counts overlaps the way a station is held', () => {
    expect(addMinutes('23:50', 20)).toBe('00:10')
    expect(peakUse([{ start: 0, end: 10 }, { start: 5, end: 15 }, { start: 12, end: 20 }])).toBe(2)
    expect(peakUse([{ start: 0, end: 5 }, { start: 5, end: 10 }])).toBe(1)
    expect(peakUse([])).toBe(0)
  })

  it('says what changed since the last sent sheet, one line each', () => {
    const before = callSheetSnapshot(buildCallSheet(small()))
    const input = small()
    const segments = [...input.segments]
    // The sponsor read moves to after the bread: 3rd → 4th.
    segments.splice(2, 1)
    segments.splice(3, 0, input.segments[2]!)
    const after = callSheetSnapshot(buildCallSheet({
      ...input, segments,
      details: { ...input.details, callTime: '09:00', hospital: 'St Example, Long Road' },
      crew: [...input.crew, { userId: 3, name: 'Cam Era', email: 'cam@example.test', role: 'camera' }],
    }))
    expect(callSheetChanges(before, after)).toEqual([
      'Call time: 08:30 → 09:00',
      'Nearest hospital: to fill in → St Example, Long Road',
      'Crew: Cam Era added (Camera)',
      'Run order: A word from Kettlebrook moved (now 4th, was 3rd)',
    ])
    expect(callSheetChanges(before, before)).toEqual([])
  })
})
