// The join codes of a shoot, for the devices page and the control desk: the list, making one for a
// role, revoking one.
import type { ApiAnswer } from '~/types/api'

export function useJoinCodes(shootId: number | string, options: { server?: boolean } = {}) {
  const base = `/api/shoots/${shootId}/join-codes`
  const { data, error: loadError, refresh } = useFetch<ApiAnswer<'/api/shoots/:id/join-codes'>>(base, { server: options.server ?? true })
  const role = ref<'host' | 'camera'>('host')
  const { pending, error, submit } = useSubmit(async () => {
    await $fetch(base, { method: 'POST', body: { role: role.value } })
    await refresh()
  })
  async function revoke(id: number) {
    await $fetch(`${base}/${id}`, { method: 'DELETE' }).catch(() => null)
    await refresh()
  }
  // The whole address a device types, from the site URL the server is set up with (the page's own
  // origin when it has none), so a crew member reads "http://192.168.1.20:3000/join", not "/join".
  const site = useRuntimeConfig().public.siteUrl || useRequestURL().origin
  const joinAddress = `${String(site).replace(/\/+$/, '')}/join`
  return { data, loadError, role, pending, error, submit, revoke, joinAddress }
}
