// What a producer may write on the call sheet (PATCH /api/episodes/:id/call-sheet) and what sending
// it names (POST …/call-sheet/send). Messages are instructions; the refusal puts the form's label in
// front (shared/utils/field-labels.ts): "Call time: write a time of day on the 24-hour clock, such as 08:30."
import { z } from 'zod'
import { typed } from './input-words'

const CALL_TIME = 'write a time of day on the 24-hour clock, such as 08:30, or leave it empty.'
const callTime = z.string({ error: typed(CALL_TIME) }).trim().regex(/^([01]\d|2[0-3]):[0-5]\d$/, CALL_TIME)
const text = (max: number, example: string) => z.string({ error: typed(`write it as text, such as ${example}, or leave it empty.`) })
  .trim().max(max, `write at most ${max} characters.`)
const VERSION = 'send the version number the call sheet had when you opened it; reload the page if unsure.'
const MEMBER = 'choose someone from the crew list.'

export const callSheetBodySchema = z.object({
  version: z.number({ error: typed(VERSION) }).int(VERSION).min(0, VERSION),
  callTime: callTime.or(z.literal('')).nullable().optional(),
  place: text(300, '"Unit 4, Brackenford Yard"').nullable().optional(),
  hospital: text(300, '"St Example Hospital, Long Road, open all night"').nullable().optional(),
  crewCalls: z.array(z.object({
    userId: z.number({ error: typed(MEMBER) }).int(MEMBER).positive(MEMBER),
    callTime: z.string({ error: typed('write a time of day on the 24-hour clock, such as 07:45.') })
      .trim().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'write a time of day on the 24-hour clock, such as 07:45.'),
  }), { error: 'send a list of crew call times, such as [{"userId": 2, "callTime": "07:45"}].' })
    .max(100, 'keep it to at most 100 crew call times.').optional(),
})

export type CallSheetBody = z.output<typeof callSheetBodySchema>

const HASH = 'send the fingerprint of the sheet you read (reload the page to get it).'
export const callSheetSendSchema = z.object({
  hash: z.string({ error: typed(HASH) }).regex(/^[0-9a-f]{64}$/, HASH),
})
