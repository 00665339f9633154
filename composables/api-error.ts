// The message a person should read for a failed API call: the server's own words when it gave some.
export function apiErrorMessage(error: unknown, fallback = 'Something went wrong. Try again.'): string {
  const e = error as { data?: { statusMessage?: string; message?: string }; statusMessage?: string; message?: string } | null
  return e?.data?.statusMessage || e?.statusMessage || e?.data?.message || fallback
}

/** The field a refusal named (`data.field`, the request's key such as "email" or "steps.2.text"), so a form can mark it. */
export function apiErrorField(error: unknown): string | null {
  const e = error as { data?: { data?: { field?: string } } } | null
  return e?.data?.data?.field ?? null
}
