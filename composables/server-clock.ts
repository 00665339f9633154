// The server clock on this screen: Date.now() + the store's offset, read again on every animation
// frame (at most `fps` times a second) and never counted. The frame loop stops while the page is
// hidden and, when it is shown again, reads the clock afresh before drawing.
export function useServerNow(options: { fps?: number } = {}): Readonly<Ref<number>> {
  const shoot = useShootStore()
  const now = shallowRef(shoot.serverNowMs())
  const read = () => {
    now.value = shoot.serverNowMs()
  }
  const frames = useRafFn(read, { immediate: false, fpsLimit: options.fps ?? 20 })
  const visibility = useDocumentVisibility()
  watch(visibility, (v) => {
    if (v === 'hidden') return frames.pause()
    read()
    frames.resume()
  }, { immediate: true })
  watch(() => shoot.offset, read)
  return readonly(now)
}
