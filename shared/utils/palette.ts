/*
 * Hobline's design tokens.
 *
 * Two themes share one set of names:
 * - "plan": a light, warm paper look for the pages where recipes and episodes are prepared.
 * - "set":  a dark look for the screens used during a shoot; low glare under studio lights,
 *           every text colour at 7:1 or more against its background (WCAG 2.2, 1.4.6 AAA).
 * Contrast ratios beside each colour are measured against the background named, by the WCAG 2.x
 * relative-luminance formula; tests/unit/palette.test.ts recomputes them.
 */
export const palette = {
  plan: {
    paper: '#faf7f1', // page background
    card: '#ffffff',
    line: '#d9d2c5', // borders (decorative only)
    ink: '#1d232b', // body text: 14.8:1 on paper
    muted: '#4a5360', // secondary text: 7.3:1 on paper
    paprika: '#a3301a', // primary action and links: 6.6:1 on paper; white text on it 7.0:1
    basil: '#2c6148', // confirmations: 6.7:1 on paper
    crust: '#8a4b00', // warnings: 6.4:1 on paper
  },
  set: {
    night: '#0f1318', // shoot-screen background
    panel: '#1a2028', // tiles
    edge: '#3a4452', // borders (decorative only)
    bone: '#f3eee4', // main text: 16.1:1 on night, 14.2:1 on panel
    haze: '#c2c9d2', // secondary text: 11.2:1 on night, 9.8:1 on panel
    saffron: '#ffc54d', // current line and focus: 11.8:1 on night, 10.4:1 on panel
    ember: '#ff8a66', // urgent timers and cautions: 8.1:1 on night, 7.1:1 on panel
    mint: '#7fe3a8', // running and "all good": 11.9:1 on night, 10.5:1 on panel
    sky: '#9fd4ff', // information: 11.8:1 on night, 10.4:1 on panel
  },
} as const

/*
 * Contrast themes a shoot screen can switch to on one device (device settings): "night" is the set
 * palette above; "day" is dark text on white for daylight kitchens; "max" is white on black with
 * brighter accents for glass and hard light. Each keeps the set names and AAA: every text colour
 * 7:1 or more on night and panel, and night text 7:1 or more on every accent (buttons).
 */
export const setThemes = {
  night: palette.set,
  day: {
    night: '#f6f2ea', panel: '#ffffff', edge: '#8c8478', bone: '#15191e', haze: '#363e4a',
    saffron: '#5c3d00', ember: '#8f2408', mint: '#14522f', sky: '#164a73',
  },
  max: {
    night: '#000000', panel: '#101010', edge: '#7a7a7a', bone: '#ffffff', haze: '#e8e8e8',
    saffron: '#ffd84d', ember: '#ffa285', mint: '#8ff0b5', sky: '#b8e2ff',
  },
} as const
