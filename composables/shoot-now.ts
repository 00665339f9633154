// One server-clock reading per shoot screen, shared by every countdown on it.
import type { InjectionKey } from 'vue'

export const SHOOT_NOW: InjectionKey<Readonly<Ref<number>>> = Symbol('shoot-now')

/** The screen's server clock (ScreenShell provides it); a component outside a shell reads its own. */
export function useShootNow(): Readonly<Ref<number>> {
  return inject(SHOOT_NOW, null) ?? useServerNow()
}
