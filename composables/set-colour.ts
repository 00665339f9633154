// Tailwind classes for the set colours of the shoot vocabulary (shared/utils/shoot-words.ts),
// written out in full so Tailwind finds them: a state's colour is a word there, a class here.
import type { SetColour } from '~~/shared/utils/shoot-words'

const TEXT: Record<SetColour, string> = {
  night: 'text-set-night', panel: 'text-set-panel', edge: 'text-set-edge', bone: 'text-set-bone', haze: 'text-set-haze',
  saffron: 'text-set-saffron', ember: 'text-set-ember', mint: 'text-set-mint', sky: 'text-set-sky',
}
const BORDER: Record<SetColour, string> = {
  night: 'border-set-night', panel: 'border-set-panel', edge: 'border-set-edge', bone: 'border-set-bone', haze: 'border-set-haze',
  saffron: 'border-set-saffron', ember: 'border-set-ember', mint: 'border-set-mint', sky: 'border-set-sky',
}

/** The text colour class of a set colour. */
export function setText(colour: SetColour): string {
  return TEXT[colour]
}

/** The border colour class of a set colour. */
export function setBorder(colour: SetColour): string {
  return BORDER[colour]
}
