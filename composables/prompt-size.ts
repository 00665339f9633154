// The prompter's type sizes as Tailwind classes, one per size a device may choose
// (PROMPT_SIZE_LABELS in shared/utils/device-settings.ts): the prompter and the screen check
// draw the same size from the same name.
import type { PromptSize } from '~~/shared/utils/device-settings'

export const PROMPT_SIZE_CLASSES: Record<PromptSize, string> = {
  sm: 'text-4xl md:text-prompt-sm',
  md: 'text-5xl md:text-prompt',
  lg: 'text-prompt-sm md:text-prompt-lg',
  xl: 'text-prompt md:text-prompt-xl',
}
