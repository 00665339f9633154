// One server-clock reading per shoot screen, shared by every countdown on it.
import type { InjectionKey } from 'vue'
import type { KeyAction } from '~~/shared/utils/key-map'

export const SHOOT_NOW: InjectionKey<Readonly<Ref<number>>> = Symbol('shoot-now')

/** The screen's server clock (ScreenShell provides it); a component outside a shell reads its own. */
export function useShootNow(): Readonly<Ref<number>> {
  return inject(SHOOT_NOW, null) ?? useServerNow()
}

/** The screen's actions (next, previous, start the step's timer…), the same path as keys and voice. */
export const SHOOT_ACTIONS: InjectionKey<(action: KeyAction) => boolean | void> = Symbol('shoot-actions')

export function useShootActions(): (action: KeyAction) => boolean | void {
  return inject(SHOOT_ACTIONS, () => false)
}
