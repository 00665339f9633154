// This device's settings for the shoot screens (shared/utils/device-settings.ts), kept in this
// browser's localStorage (VueUse), so a reload or a new shoot keeps them.
import { defineStore } from 'pinia'
import { DEFAULT_DEVICE_SETTINGS, readDeviceSettings, type DeviceSettings } from '~~/shared/utils/device-settings'

export const DEVICE_SETTINGS_KEY = 'hobline:device-settings'

export const useDeviceSettings = defineStore('device-settings', () => {
  const stored = useLocalStorage<DeviceSettings>(DEVICE_SETTINGS_KEY, DEFAULT_DEVICE_SETTINGS, {
    mergeDefaults: (saved) => readDeviceSettings(saved),
    initOnMounted: true,
  })
  const settings = computed(() => readDeviceSettings(stored.value))

  function update(patch: Partial<DeviceSettings>) {
    stored.value = readDeviceSettings({ ...settings.value, ...patch })
  }
  function reset() {
    stored.value = { ...DEFAULT_DEVICE_SETTINGS }
  }

  /** Whether this device rings aloud while rolling: its own choice, else by role (the producer's
   * desk rings, the host's tablet and the camera's phone stay quiet on set). */
  function audibleWhileRolling(role: string | null): boolean {
    const own = settings.value.audibleWhileRolling
    return own ?? role === 'producer'
  }

  return { settings, update, reset, audibleWhileRolling }
})
