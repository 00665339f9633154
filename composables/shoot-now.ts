// One server-clock reading per shoot screen, shared by every countdown on it.
import type { InjectionKey } from 'vue'
import type { KeyAction } from '~~/shared/utils/key-map'

export const SHOOT_NOW: InjectionKey<Readonly<Ref<number>>> = Symbol('shoot-now')

/** The screen's server clock (ScreenShell provides it); a component outside a shell reads its own. */
export function useShootNow(): Readonly<Ref<number>> {
  return inject(SHOOT_NOW, null) ?? useServerNow()
}

/** Runs one of the screen's actions; true when the screen has it and did it (useHandsFree's run). */
export type ShootActionRunner = (action: KeyAction) => boolean

/** The screen's actions (next, previous, start the step's timer…), the same path as keys and voice. */
export const SHOOT_ACTIONS: InjectionKey<ShootActionRunner> = Symbol('shoot-actions')

export function useShootActions(): ShootActionRunner {
  return inject(SHOOT_ACTIONS, () => false)
}
