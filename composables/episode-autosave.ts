// The episode builder's autosave: every change goes into a draft, is saved ~600 ms after the last
// one (never two requests at once; the latest draft wins), and can be undone. A refusal keeps the
// draft and says why; someone else's save (409) waits for the editor to choose theirs or theirs over.
import type { EpisodeView } from '~/types/api'
import type { ShowSegment } from '~~/shared/utils/show-segments'

export interface EpisodeDraft {
  title: string
  shootDate: string | null
  /** A number, or the text as typed when it is not one: the server says what to write. */
  servings: number | string | null
  unitSystem: 'metric' | 'us' | null
  budgetPerServingMinor: number | null
  targetSeconds: number | null
  hostId: number | null
  segments: ShowSegment[]
}

export type SaveState = 'saved' | 'waiting' | 'saving' | 'failed'

/** The run order as the PATCH takes it: recipe and closing lines only on recipe segments, what to frame on the others. */
export function segmentsOf(e: Pick<EpisodeView, 'segments'>): ShowSegment[] {
  return [...e.segments].sort((a, b) => a.position - b.position).map((s) => ({
    id: s.id, kind: s.kind, title: s.title, script: s.script as ShowSegment['script'],
    ...(s.kind === 'recipe' ? { recipeId: s.recipeId ?? undefined, closing: s.closing as ShowSegment['script'] } : { shot: s.shot ?? '' }),
  }))
}

export function draftOf(e: EpisodeView): EpisodeDraft {
  return {
    title: e.title, shootDate: e.shootDate, servings: e.servings, unitSystem: e.unitSystem, budgetPerServingMinor: e.budgetPerServingMinor,
    targetSeconds: e.targetSeconds, hostId: e.hostId, segments: segmentsOf(e),
  }
}

const copy = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T
const DEBOUNCE_MS = 600
/** Keystrokes in one box within this long are one change for Undo. */
const GROUP_MS = 2000

export function useEpisodeAutosave(initial: EpisodeView, onSaved: (e: EpisodeView) => void) {
  const draft = ref<EpisodeDraft>(draftOf(initial))
  const version = ref(initial.version)
  const history = shallowRef<EpisodeDraft[]>([])
  const state = ref<SaveState>('saved')
  const message = ref<string | null>(null)
  const field = ref<string | null>(null)
  const conflict = ref<EpisodeView | null>(null)
  let timer: ReturnType<typeof setTimeout> | undefined
  let inFlight = false
  let again = false
  let lastGroup = ''
  let lastAt = 0

  function schedule() {
    state.value = 'waiting'
    clearTimeout(timer)
    timer = setTimeout(flush, DEBOUNCE_MS)
  }

  /** Changes the draft; changes of one `group` (typing in one box) close together are one step of Undo. */
  function change(mutate: (d: EpisodeDraft) => void, group = '') {
    const now = Date.now()
    if (!group || group !== lastGroup || now - lastAt > GROUP_MS) history.value = [...history.value.slice(-49), copy(draft.value)]
    lastGroup = group
    lastAt = now
    const next = copy(draft.value)
    mutate(next)
    draft.value = next
    schedule()
  }

  function undo() {
    const previous = history.value.at(-1)
    if (!previous) return
    history.value = history.value.slice(0, -1)
    lastGroup = ''
    draft.value = previous
    schedule()
  }

  async function flush() {
    clearTimeout(timer)
    if (inFlight) {
      again = true
      return
    }
    if (conflict.value) return
    inFlight = true
    state.value = 'saving'
    const sent = draft.value
    try {
      const next = await $fetch<EpisodeView>(`/api/episodes/${initial.id}`, { method: 'PATCH', body: { version: version.value, ...sent } })
      version.value = next.version
      message.value = null
      field.value = null
      onSaved(next)
      if (draft.value === sent) state.value = 'saved'
    } catch (e) {
      if ((e as { statusCode?: number }).statusCode === 409) {
        conflict.value = (e as { data?: { data?: { current?: EpisodeView } } }).data?.data?.current
          ?? (await $fetch<EpisodeView>(`/api/episodes/${initial.id}`))
      }
      message.value = apiErrorMessage(e)
      field.value = apiErrorField(e)
      state.value = 'failed'
    } finally {
      inFlight = false
      if (again) {
        again = false
        flush()
      }
    }
  }

  function loadTheirs() {
    const theirs = conflict.value
    if (!theirs) return
    history.value = [...history.value, copy(draft.value)]
    draft.value = draftOf(theirs)
    version.value = theirs.version
    conflict.value = null
    message.value = null
    state.value = 'saved'
    onSaved(theirs)
  }

  function keepMine() {
    if (!conflict.value) return
    version.value = conflict.value.version
    conflict.value = null
    flush()
  }

  const statusText = computed(() => ({
    saved: 'All changes saved',
    waiting: 'Saving…',
    saving: 'Saving…',
    failed: `Not saved: ${message.value ?? 'try again.'}`,
  })[state.value])
  const fieldError = (name: string) => (field.value === name ? message.value : null)

  if (import.meta.client) {
    const warn = (e: BeforeUnloadEvent) => {
      if (state.value !== 'saved') e.preventDefault()
    }
    onMounted(() => window.addEventListener('beforeunload', warn))
    onBeforeUnmount(() => {
      window.removeEventListener('beforeunload', warn)
      if (state.value === 'waiting') flush()
    })
  }

  const canUndo = computed(() => history.value.length > 0)
  return { draft, version, state, statusText, message, fieldError, conflict, canUndo, change, undo, flush, loadTheirs, keepMine }
}
