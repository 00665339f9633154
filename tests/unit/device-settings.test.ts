// Reading a device's stored settings back: every valid field kept, anything else replaced by its
// default, so an old or hand-edited entry never breaks a shoot screen. Product rules (DESIGN.md).
import { describe, expect, it } from 'vitest'
import { DEFAULT_DEVICE_SETTINGS, WPM_MAX, WPM_MIN, readDeviceSettings } from '../../shared/utils/device-settings'
import { DEFAULT_KEY_MAP } from '../../shared/utils/key-map'

describe('readDeviceSettings', () => {
  it('gives the defaults for nothing stored or for junk', () => {
    expect(readDeviceSettings(undefined)).toEqual(DEFAULT_DEVICE_SETTINGS)
    expect(readDeviceSettings('mirror')).toEqual(DEFAULT_DEVICE_SETTINGS)
    expect(readDeviceSettings({ size: 'giant', theme: 3, mirror: 'yes', volume: 'loud', keys: 'PageDown' })).toEqual(DEFAULT_DEVICE_SETTINGS)
  })
  it('keeps valid fields', () => {
    const s = readDeviceSettings({ size: 'xl', spacing: 'loose', mirror: true, theme: 'max', wpm: 120, volume: 0.25, audibleWhileRolling: false, readAloud: true, voice: true, keys: { next: ['j'] } })
    expect(s).toMatchObject({ size: 'xl', spacing: 'loose', mirror: true, theme: 'max', wpm: 120, volume: 0.25, audibleWhileRolling: false, readAloud: true, voice: true })
    expect(s.keys.next).toEqual(['j'])
    expect(s.keys.previous).toEqual(DEFAULT_KEY_MAP.previous)
  })
  it('holds the pace and the volume to their ranges, and leaves "ring while rolling" to the role when unset', () => {
    expect(readDeviceSettings({ wpm: 5000 }).wpm).toBe(WPM_MAX)
    expect(readDeviceSettings({ wpm: -1 }).wpm).toBe(WPM_MIN)
    expect(readDeviceSettings({ wpm: 151.6 }).wpm).toBe(152)
    expect(readDeviceSettings({ volume: 7 }).volume).toBe(1)
    expect(readDeviceSettings({ volume: Number.NaN }).volume).toBe(DEFAULT_DEVICE_SETTINGS.volume)
    expect(readDeviceSettings({ audibleWhileRolling: 'on' }).audibleWhileRolling).toBeNull()
  })
})
