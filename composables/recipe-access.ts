// What the signed-in member may do in the studio a recipe belongs to, from the shared role table.
// A recipe opened from a link may belong to another of the member's studios than the one the
// header works in: the header follows it once the page is in the browser.
import type { MaybeRefOrGetter } from 'vue'
import type { StudioAction } from '~~/shared/utils/roles'

export function useStudioAccess(studioId: MaybeRefOrGetter<number | null | undefined>) {
  const account = useAccountStore()
  const membership = computed(() => account.memberships.find((m) => m.studioId === toValue(studioId)))
  const can = (action: StudioAction) => !!membership.value && roleCan(membership.value.role, action)
  onMounted(() => {
    const id = toValue(studioId)
    if (id && membership.value && account.studioId !== id) account.switchStudio(id).catch(() => {})
  })
  return { membership, can }
}

/** The opening of a page under /studios/:studioId: the studio's id, the member's access, and a 404
 * when the studio is not one of theirs. */
export function useStudioPage() {
  const studioId = Number(useRoute().params.studioId)
  const access = useStudioAccess(studioId)
  if (!access.membership.value) throw createError({ statusCode: 404, statusMessage: 'There is no such studio on your account.', fatal: true })
  return { studioId, ...access }
}
