// A small form helper: submit once at a time, keep the server's message and the field it named.
export function useSubmit<T>(action: () => Promise<T>) {
  const pending = ref(false)
  const error = ref<string | null>(null)
  const field = ref<string | null>(null)
  async function submit(): Promise<T | undefined> {
    if (pending.value) return
    pending.value = true
    error.value = null
    field.value = null
    try {
      return await action()
    } catch (e) {
      error.value = apiErrorMessage(e)
      field.value = apiErrorField(e)
    } finally {
      pending.value = false
    }
  }
  const fieldError = (name: string) => (field.value === name ? error.value : null)
  return { pending, error, field, submit, fieldError }
}
