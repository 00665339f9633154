// Which screen each role works from during a shoot: the host reads the prompter, the camera
// operator follows the cue screen, the producer runs the control desk; a viewer watches the desk
// without its controls.
export const SHOOT_SCREENS = {
  prompter: { label: 'Prompter', for: 'the host' },
  cue: { label: 'Cue screen', for: 'the camera' },
  desk: { label: 'Control desk', for: 'the producer' },
} as const
export type ShootScreen = keyof typeof SHOOT_SCREENS

export function shootScreenFor(role: string): ShootScreen {
  if (role === 'host') return 'prompter'
  if (role === 'camera') return 'cue'
  return 'desk'
}

/** Where a device or member in a role lands for a shoot. */
export function shootScreenPath(shootId: number, role: string): string {
  return `/shoots/${shootId}/${shootScreenFor(role)}`
}
