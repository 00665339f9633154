import type { Config } from 'tailwindcss'

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

export default {
  content: [
    './components/**/*.{vue,ts}',
    './layouts/**/*.vue',
    './pages/**/*.vue',
    './composables/**/*.ts',
    './plugins/**/*.ts',
    './app.vue',
    './error.vue',
  ],
  theme: {
    extend: {
      colors: palette,
      fontFamily: {
        sans: ['"Atkinson Hyperlegible"', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        // Prompter and cue sizes, for reading from two metres and more.
        cue: ['2.25rem', { lineHeight: '1.2' }],
        'prompt-sm': ['3rem', { lineHeight: '1.25' }],
        prompt: ['4rem', { lineHeight: '1.25' }],
        'prompt-lg': ['5.5rem', { lineHeight: '1.2' }],
        'prompt-xl': ['7rem', { lineHeight: '1.15' }],
        countdown: ['9rem', { lineHeight: '1', letterSpacing: '-0.01em' }],
      },
      minHeight: { touch: '44px' },
      minWidth: { touch: '44px' },
      borderRadius: { tile: '1.25rem' },
    },
  },
  plugins: [],
} satisfies Config
