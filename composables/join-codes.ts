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
  return { data, loadError, role, pending, error, submit, revoke }
}
