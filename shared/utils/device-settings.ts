// Settings that belong to one device, not to a shoot or an account: type size, contrast, mirror,
// reading pace, alarm volume and whether it rings while rolling, voice, read-aloud and keys. How
// stored settings are read back; the store (stores/device-settings.ts) keeps them in localStorage.
import { DEFAULT_KEY_MAP, normaliseKeyMap, type KeyMap } from './key-map'

export const PROMPT_SIZES = ['sm', 'md', 'lg', 'xl'] as const
export type PromptSize = (typeof PROMPT_SIZES)[number]
/** The size names a person chooses from, on the device settings and on the screen check alike. */
export const PROMPT_SIZE_LABELS: Record<PromptSize, string> = { sm: 'Large', md: 'Larger', lg: 'Very large', xl: 'Huge' }
export const PROMPT_SPACINGS = ['tight', 'normal', 'loose'] as const
export type PromptSpacing = (typeof PROMPT_SPACINGS)[number]
/** Contrast themes of the shoot screens: the dark set look, light for daylight kitchens, and
 * maximum contrast (pure white on black) for glass and bright lights. */
export const SET_THEMES = ['night', 'day', 'max'] as const
export type SetTheme = (typeof SET_THEMES)[number]
export const SET_THEME_LABELS: Record<SetTheme, string> = { night: 'Dark (studio)', day: 'Light (daylight)', max: 'Maximum contrast' }

/** Scroll pace of long lines, words per minute; common speaking rates for presenters run about
 * 130–170 wpm (common practice), so the range leaves room either side. */
export const WPM_MIN = 60
export const WPM_MAX = 260
export const WPM_DEFAULT = 150

export interface DeviceSettings {
  size: PromptSize
  spacing: PromptSpacing
  mirror: boolean
  theme: SetTheme
  wpm: number
  /** Alarm volume on this device, 0–1. */
  volume: number
  /** Ring aloud even while the camera rolls (the producer's laptop, an earpiece). */
  audibleWhileRolling: boolean | null
  readAloud: boolean
  voice: boolean
  keys: KeyMap
}

export const DEFAULT_DEVICE_SETTINGS: DeviceSettings = {
  size: 'lg',
  spacing: 'normal',
  mirror: false,
  theme: 'night',
  wpm: WPM_DEFAULT,
  volume: 0.8,
  audibleWhileRolling: null,
  readAloud: false,
  voice: false,
  keys: DEFAULT_KEY_MAP,
}

const clamp = (v: unknown, lo: number, hi: number, fallback: number) =>
  typeof v === 'number' && Number.isFinite(v) ? Math.min(hi, Math.max(lo, v)) : fallback
const oneOf = <T extends string>(list: readonly T[], v: unknown, fallback: T): T =>
  (list as readonly unknown[]).includes(v) ? (v as T) : fallback

/** Reads stored settings, keeping every valid field and replacing the rest by its default, so an
 * old or hand-edited entry never breaks a screen. */
export function readDeviceSettings(raw: unknown): DeviceSettings {
  const r = (raw && typeof raw === 'object' ? raw : {}) as Partial<Record<keyof DeviceSettings, unknown>>
  const d = DEFAULT_DEVICE_SETTINGS
  return {
    size: oneOf(PROMPT_SIZES, r.size, d.size),
    spacing: oneOf(PROMPT_SPACINGS, r.spacing, d.spacing),
    mirror: typeof r.mirror === 'boolean' ? r.mirror : d.mirror,
    theme: oneOf(SET_THEMES, r.theme, d.theme),
    wpm: Math.round(clamp(r.wpm, WPM_MIN, WPM_MAX, d.wpm)),
    volume: clamp(r.volume, 0, 1, d.volume),
    audibleWhileRolling: typeof r.audibleWhileRolling === 'boolean' ? r.audibleWhileRolling : null,
    readAloud: typeof r.readAloud === 'boolean' ? r.readAloud : d.readAloud,
    voice: typeof r.voice === 'boolean' ? r.voice : d.voice,
    keys: normaliseKeyMap(r.keys),
  }
}
