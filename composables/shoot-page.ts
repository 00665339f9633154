// The data a shoot screen page starts from: the snapshot fetched with the page (so the prompter's
// text is in the first HTML the tablet gets) and held in the shoot store at once. The route's
// answer is the same snapshot `shoot:join` acknowledges with.
import type { ApiAnswer } from '~~/types/api'

export type ShootPageData = ApiAnswer<'/api/shoots/:id'>

export async function useShootPage() {
  const route = useRoute()
  const shootId = Number(route.params.id)
  const { data: shoot, error } = await useFetch<ShootPageData>(`/api/shoots/${route.params.id}`)
  const snapshot = computed(() => shoot.value ?? null)
  if (snapshot.value) useShootStore().prime(shootId, snapshot.value)
  return { shootId, shoot, snapshot, error }
}
