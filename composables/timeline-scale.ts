// The time axis of a plan timeline, shared by the plan page and the control desk: a span of
// seconds fitted to the box's width (times a zoom), the x of a time, and minute ticks far enough
// apart to read (60 px or more).
import type { MaybeRefOrGetter, Ref } from 'vue'

export interface TimelineScaleOptions {
  box: Ref<HTMLElement | null>
  /** The seconds the axis covers from 0. */
  span: MaybeRefOrGetter<number>
  zoom?: MaybeRefOrGetter<number>
  labelWidth: number
  padRight: number
}

export function useTimelineScale(o: TimelineScaleOptions) {
  const { width: boxWidth } = useElementSize(o.box)
  const span = computed(() => Math.max(toValue(o.span), 60))
  const fitWidth = computed(() => Math.max(320, boxWidth.value || 960))
  const perSecond = computed(() => ((fitWidth.value - o.labelWidth - o.padRight) / span.value) * (toValue(o.zoom) ?? 1))
  const width = computed(() => Math.ceil(o.labelWidth + span.value * perSecond.value + o.padRight))
  const xAt = (s: number) => o.labelWidth + s * perSecond.value
  const ticks = computed(() => {
    const everyMin = [1, 2, 5, 10, 15, 20, 30, 60, 120].find((m) => m * 60 * perSecond.value >= 60) ?? 240
    const out: number[] = []
    for (let s = 0; s <= toValue(o.span) + 0.001; s += everyMin * 60) out.push(s)
    return out
  })
  return { fitWidth, perSecond, width, xAt, ticks }
}

/** The bar a timeline's tooltip is showing: shown at once, hidden after a moment (so it can be reached). */
export function useTimelineTip<T>() {
  const active = shallowRef<{ step: T; lane: number } | null>(null)
  let hideTimer: ReturnType<typeof setTimeout> | undefined
  function show(step: T, lane: number) {
    clearTimeout(hideTimer)
    active.value = { step, lane }
  }
  function hideSoon() {
    clearTimeout(hideTimer)
    hideTimer = setTimeout(() => (active.value = null), 150)
  }
  onBeforeUnmount(() => clearTimeout(hideTimer))
  return { active, show, hideSoon }
}
