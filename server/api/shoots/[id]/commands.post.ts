// A shoot command over HTTP: the same checks and the same function as the socket's `shoot:command`.
import { z } from 'zod'

const body = z.object({ type: z.string({ error: 'type: name the command, such as step.next.' }).max(40) }).passthrough()

export default defineEventHandler(async (event) => {
  const { type } = await validateBody(event, body)
  const caller = await requireShoot(event, commandAction(type))
  const command = (await readBody(event)) as { type: string }
  const outcome = await runShootCommand(caller.shootId, command, caller)
  if (!outcome.ok) {
    const field = (outcome.error as { field?: string }).field
    throw createError({ statusCode: outcome.error.code === 'forbidden' ? 403 : outcome.error.code === 'invalid' ? 400 : 409, statusMessage: field ? `${field}: ${outcome.error.message}` : outcome.error.message, data: outcome.error })
  }
  return outcome
})
