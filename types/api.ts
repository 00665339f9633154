// What the app's routes answer, as the client receives them (JSON: dates as strings). Each type is
// inferred by Nitro from its route handler (.nuxt/types/nitro-routes.d.ts), so a change on the
// server shows up in the type check of every page that reads it; nothing here is written by hand.
import type { InternalApi } from 'nitropack/types'

/**
 * Nitro's Simplify spreads a branded value (Sequelize's CreationOptional<number> or <string>: a row's
 * id, version or kind) into an object of its methods; this reads it back as the number or string it
 * is on the wire. Pages that keep an answer in a typed ref fetch with these types
 * (`useFetch<EpisodeView>(…)`), since useFetch's own inference keeps the spread form.
 */
type Unbranded<T> = T extends string | number | boolean | null | undefined ? T
  : T extends { toFixed: unknown; toPrecision: unknown } ? number
  : T extends { charAt: unknown; toUpperCase: unknown } ? string
  : T extends readonly (infer U)[] ? Unbranded<U>[]
  : T extends object ? { [K in keyof T]: Unbranded<T[K]> }
  : T

/** The answer of `method` on `route` (GET by default), e.g. `ApiAnswer<'/api/episodes/:id/plan'>`. */
export type ApiAnswer<Route extends keyof InternalApi, Method extends keyof InternalApi[Route] = 'get' & keyof InternalApi[Route]> =
  Unbranded<InternalApi[Route][Method]>

export type MeAnswer = ApiAnswer<'/api/me'>
export type MembershipInfo = MeAnswer['memberships'][number]

export type EpisodeView = ApiAnswer<'/api/episodes/:id'>
export type EpisodeShowView = ApiAnswer<'/api/episodes/:id/show'>
export type CallSheetAnswer = ApiAnswer<'/api/episodes/:id/call-sheet'>
export type EpisodeRow = ApiAnswer<'/api/studios/:studioId/episodes'>['episodes'][number]
export type PlanView = ApiAnswer<'/api/episodes/:id/plan'>
export type PlanStepView = PlanView['steps'][number]

export type RecipeListRow = ApiAnswer<'/api/studios/:studioId/recipes'>['recipes'][number]
export type LoadedRecipe = ApiAnswer<'/api/recipes/:id'>
export type ScaledRecipe = ApiAnswer<'/api/recipes/:id/scaled'>
export type RecipeCost = ApiAnswer<'/api/recipes/:id/cost'>
export type PriceRow = ApiAnswer<'/api/studios/:studioId/prices'>['prices'][number]
export type PriceImportReport = ApiAnswer<'/api/studios/:studioId/prices/import', 'post'>

export type CrewMember = ApiAnswer<'/api/studios/:studioId/members'>['members'][number]
export type PendingInvite = ApiAnswer<'/api/studios/:studioId/invites'>['invites'][number]
export type InvitePreview = ApiAnswer<'/api/invites/:token'>
export type OutboxEntry = ApiAnswer<'/api/studios/:studioId/outbox'>['mails'][number]
export type OutboxMail = ApiAnswer<'/api/studios/:studioId/outbox/:mailId'>
export type JoinCodeView = ApiAnswer<'/api/shoots/:id/join-codes'>['codes'][number]
