import type { Config } from 'tailwindcss'
import plugin from 'tailwindcss/plugin'

import { palette, setThemes } from './shared/utils/palette'

export { palette, setThemes }

type SetColour = keyof typeof palette.set
const setVars = (theme: Record<SetColour, string>) =>
  Object.fromEntries(Object.entries(theme).map(([name, hex]) => [`--set-${name}`, hex]))

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
      // The alarm's flashing screen edge (ShootAlarmFlash): about once a second, well below WCAG 2.2
      // SC 2.3.1's three flashes a second. A utility, so it is in the page's inlined CSS: a component's
      // own <style> would be one more stylesheet every shoot screen waits for before it paints.
      keyframes: { 'alarm-edge': { from: { opacity: '1' }, to: { opacity: '0.15' } } },
      animation: { 'alarm-edge': 'alarm-edge 1s steps(2, jump-none) infinite' },
      // The set colours are CSS variables, so a screen's contrast theme is one attribute.
      colors: {
        plan: palette.plan,
        set: Object.fromEntries(Object.keys(palette.set).map((name) => [name, `var(--set-${name})`])),
      },
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
  plugins: [
    plugin(({ addBase }) => {
      addBase({
        ':root': setVars(setThemes.night),
        '[data-set-theme="day"]': setVars(setThemes.day),
        '[data-set-theme="max"]': setVars(setThemes.max),
      })
    }),
  ],
} satisfies Config
