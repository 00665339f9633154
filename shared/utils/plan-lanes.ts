// The cook plan's lanes in plain words: "hands-1" is the cook's hands, "burner-2" a burner, and so
// on. A kind the kitchen has one of is named without its number; "aside" lanes (waits that hold no
// station) always keep theirs.
const LANE_WORDS: Record<string, string> = { hands: 'Hands', burner: 'Burner', oven: 'Oven', counter: 'Counter', aside: 'Resting' }

/** "Hands", "Burner 2", "Resting 1": the lane's name among the plan's lanes. */
export function planLaneName(lane: string, lanes: readonly string[]): string {
  const kind = lane.replace(/-\d+$/, '')
  const n = lane.match(/\d+$/)?.[0] ?? ''
  const one = lanes.filter((l) => l.startsWith(`${kind}-`)).length === 1
  const word = LANE_WORDS[kind] ?? kind
  return (one && kind !== 'aside') || !n ? word : `${word} ${n}`
}
