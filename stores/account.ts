// Who is signed in, their studios, and which one the app shell is working in.
import { defineStore } from 'pinia'
import { roleCan, type StudioAction } from '~~/shared/utils/roles'
import type { MeAnswer, MembershipInfo } from '~/types/api'
import { forgetLastSnapshots } from '~/composables/last-snapshot'

export const useAccountStore = defineStore('account', {
  state: () => ({
    loaded: false,
    user: null as MeAnswer['user'],
    memberships: [] as MembershipInfo[],
    device: null as MeAnswer['device'],
    studioId: null as number | null,
  }),
  getters: {
    signedIn: (s) => !!s.user,
    current: (s): MembershipInfo | undefined => s.memberships.find((m) => m.studioId === s.studioId),
  },
  actions: {
    async load() {
      const headers = import.meta.server ? useRequestHeaders(['cookie']) : undefined
      const me = await $fetch<MeAnswer>('/api/me', { headers }).catch(() => null)
      this.user = me?.user ?? null
      this.memberships = me?.memberships ?? []
      this.device = me?.device ?? null
      this.studioId = me?.studioId ?? null
      this.loaded = true
    },
    can(action: StudioAction): boolean {
      return !!this.current && roleCan(this.current.role, action)
    },
    async switchStudio(studioId: number) {
      await $fetch('/api/me/studio', { method: 'PUT', body: { studioId } })
      this.studioId = studioId
    },
    async signOut() {
      await $fetch('/api/auth/logout', { method: 'POST' })
      // The shoot states kept on this device for reopening offline go with the session.
      forgetLastSnapshots()
      this.$reset()
      this.loaded = true
      await useUserSession().fetch()
    },
  },
})
