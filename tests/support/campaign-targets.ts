// The campaign's targets (tests/server/campaign.test.ts, tests/server/refusal-words.test.ts): every
// mutating route with a generator of payloads it must refuse (tests/support/campaign-payloads.ts), a
// valid base command of each shoot command type, and the request that sends one payload.
import { url } from '@nuxt/test-utils/e2e'
import fc from 'fast-check'
import { z } from 'zod'
import type { ShootCommandType } from '../../shared/types/shoot'
import {
  inviteBodySchema, joinBodySchema, joinCodeBodySchema, loginBodySchema, resetRequestBodySchema,
  memberBodySchema, signupBodySchema, switchStudioBodySchema,
} from '../../shared/utils/account-schemas'
import { callSheetBodySchema, callSheetSendSchema } from '../../shared/utils/call-sheet-schema'
import { parsePriceCsv } from '../../shared/utils/price-csv'
import { publishRecipeSchema, publishTakeSchema } from '../../shared/utils/publish-schemas'
import { adoptActualsSchema, undoAdoptionSchema } from '../../shared/utils/rehearsal-schemas'
import { episodeCreateSchema, episodeUpdateSchema, priceBodySchema, recipeCreateSchema, recipeUpdateSchema, studioSettingsSchema } from '../../shared/utils/recipe-schemas'
import { importSchemaOrgRecipe } from '../../shared/utils/schemaorg-import'
import { shootCommandSchema } from '../../shared/utils/shoot-schema'
import { newStudioBodySchema } from '../../shared/utils/studio-schemas'
import { badIds, badImports, badPriceLists, badTokens, badUploads, jsonBodies, rawBodies } from './campaign-payloads'
import { appOrigin, type Client, demo, uniqueEmail } from './client'

export interface Ids { studio: number; recipe: number; version: number; step: number; episode: number; episodeVersion: number; shoot: number; price: number }
/** One request: method, path, and a body (JSON value, raw text with its type, or a multipart form). */
export type Body = { json: unknown } | { text: string; type: string } | { form: FormData } | null
export interface Target { file: string; method: string; payloads: (ids: Ids) => fc.Arbitrary<{ path: string; body: Body }> }

const server = (schema: z.ZodType) => (v: unknown) => !schema.safeParse(v ?? {}).success
/** JSON bodies from a valid base that the route's schema refuses, and raw bodies that are not JSON. */
function json(file: string, method: string, path: (i: Ids) => string, base: (i: Ids) => Record<string, unknown>, schema: z.ZodType): Target {
  const refused = server(schema)
  return {
    file, method,
    payloads: (i) => fc.oneof(
      { arbitrary: jsonBodies(base(i)).filter(refused).map((v) => ({ path: path(i), body: { json: v } as Body })), weight: 8 },
      // An empty body of any type is read as {} (validate.ts), so it is left out where {} is a valid body.
      { arbitrary: rawBodies.filter((r) => !((r.type === 'application/json' || !r.text.trim()) && parsesValid(r.text, refused))).map((r) => ({ path: path(i), body: r as Body })), weight: 2 },
    ),
  }
}
function parsesValid(text: string, refused: (v: unknown) => boolean): boolean {
  try {
    return !refused(text.trim() ? JSON.parse(text) : {})
  } catch {
    return false
  }
}
/** A route whose payload is its path: ids or tokens that name nothing, with a junk body. */
function path(file: string, method: string, make: (bad: string, i: Ids) => string, bad = badIds): Target {
  return { file, method, payloads: (i) => fc.tuple(bad, rawBodies).map(([b, raw]) => ({ path: make(b, i), body: method === 'DELETE' ? null : raw })) }
}

const importRefused = (text: string) => {
  try {
    return !recipeCreateSchema.safeParse(importSchemaOrgRecipe(text).recipe).success
  } catch {
    return true
  }
}

export const targets: Target[] = [
  json('auth/signup.post.ts', 'POST', () => '/api/auth/signup', () => ({ name: 'Campaign cook', email: uniqueEmail('campaign'), password: 'a long campaign password', studioName: 'Campaign Kitchen' }), signupBodySchema),
  json('auth/login.post.ts', 'POST', () => '/api/auth/login', () => ({ email: demo.host, password: 'not the password' }), loginBodySchema),
  json('auth/password-reset/index.post.ts', 'POST', () => '/api/auth/password-reset', () => ({ email: demo.host }), resetRequestBodySchema),
  // Links never given out: refused whatever the body says.
  { file: 'auth/password-reset/[token].post.ts', method: 'POST', payloads: () => fc.tuple(badTokens, jsonBodies({ password: 'a long new password' })).map(([t, b]) => ({ path: `/api/auth/password-reset/${t}`, body: { json: b } })) },
  { file: 'invites/[token]/accept.post.ts', method: 'POST', payloads: () => fc.tuple(badTokens, jsonBodies({ name: 'Campaign cook', password: 'a long campaign password' })).map(([t, b]) => ({ path: `/api/invites/${t}/accept`, body: { json: b } })) },
  json('join.post.ts', 'POST', () => '/api/join', () => ({ code: 'QQQ-QQQ' }), joinBodySchema),
  json('me/studio.put.ts', 'PUT', () => '/api/me/studio', (i) => ({ studioId: i.studio }), switchStudioBodySchema),
  json('studios/index.post.ts', 'POST', () => '/api/studios', () => ({ name: 'Campaign Kitchen', locale: 'en-GB', currency: 'GBP' }), newStudioBodySchema),
  json('studios/[studioId]/index.patch.ts', 'PATCH', (i) => `/api/studios/${i.studio}`, () => ({ unitSystem: 'metric', currency: 'GBP' }), studioSettingsSchema),
  json('studios/[studioId]/invites/index.post.ts', 'POST', (i) => `/api/studios/${i.studio}/invites`, () => ({ email: uniqueEmail('campaign'), role: 'viewer' }), inviteBodySchema),
  path('studios/[studioId]/invites/[inviteId].delete.ts', 'DELETE', (b, i) => `/api/studios/${i.studio}/invites/${b}`),
  path('studios/[studioId]/invites/[inviteId]/resend.post.ts', 'POST', (b, i) => `/api/studios/${i.studio}/invites/${b}/resend`),
  json('studios/[studioId]/members/[userId].patch.ts', 'PATCH', (i) => `/api/studios/${i.studio}/members/2`, () => ({ role: 'viewer' }), memberBodySchema),
  path('studios/[studioId]/members/[userId].delete.ts', 'DELETE', (b, i) => `/api/studios/${i.studio}/members/${b}`),
  json('studios/[studioId]/prices/index.post.ts', 'POST', (i) => `/api/studios/${i.studio}/prices`, () => ({ item: 'Campaign salt', packageSize: 1, packageUnit: 'kg', priceMinor: 65, currency: 'GBP' }), priceBodySchema),
  json('studios/[studioId]/prices/[priceId].patch.ts', 'PATCH', (i) => `/api/studios/${i.studio}/prices/${i.price}`, () => ({ item: 'Campaign salt', packageSize: 1, packageUnit: 'kg', priceMinor: 65, currency: 'GBP' }), priceBodySchema),
  path('studios/[studioId]/prices/[priceId].delete.ts', 'DELETE', (b, i) => `/api/studios/${i.studio}/prices/${b}`),
  {
    file: 'studios/[studioId]/prices/import.post.ts', method: 'POST',
    payloads: (i) => badPriceLists.filter((t) => parsePriceCsv(t, { defaultCurrency: 'GBP' }).prices.length === 0).map((text) => ({ path: `/api/studios/${i.studio}/prices/import`, body: { text, type: 'text/csv' } })),
  },
  json('studios/[studioId]/recipes/index.post.ts', 'POST', (i) => `/api/studios/${i.studio}/recipes`, () => ({ title: 'Campaign soup', servings: 2 }), recipeCreateSchema),
  {
    file: 'studios/[studioId]/recipes/import.post.ts', method: 'POST',
    payloads: (i) => badImports.filter((b) => importRefused(b.text)).map((body) => ({ path: `/api/studios/${i.studio}/recipes/import`, body })),
  },
  json('recipes/[id]/index.patch.ts', 'PATCH', (i) => `/api/recipes/${i.recipe}`, (i) => ({ version: i.version, title: 'Campaign soup', servings: 2 }), recipeUpdateSchema),
  path('recipes/[id]/index.delete.ts', 'DELETE', (b) => `/api/recipes/${b}`),
  { file: 'recipes/[id]/photo.post.ts', method: 'POST', payloads: (i) => badUploads.map((u) => ({ path: `/api/recipes/${i.recipe}/photo`, body: { form: form(u) } })) },
  path('recipes/[id]/photo.delete.ts', 'DELETE', (b) => `/api/recipes/${b}/photo`),
  { file: 'recipes/[id]/steps/[stepId]/photo.post.ts', method: 'POST', payloads: (i) => badUploads.map((u) => ({ path: `/api/recipes/${i.recipe}/steps/${i.step}/photo`, body: { form: form(u) } })) },
  path('recipes/[id]/steps/[stepId]/photo.delete.ts', 'DELETE', (b, i) => `/api/recipes/${i.recipe}/steps/${b}/photo`),
  json('studios/[studioId]/episodes/index.post.ts', 'POST', (i) => `/api/studios/${i.studio}/episodes`, (i) => ({ title: 'Campaign episode', recipeIds: [i.recipe] }), episodeCreateSchema),
  json('episodes/[id]/index.patch.ts', 'PATCH', (i) => `/api/episodes/${i.episode}`, (i) => ({ version: i.episodeVersion, title: 'Campaign episode' }), episodeUpdateSchema),
  json('episodes/[id]/call-sheet/index.patch.ts', 'PATCH', (i) => `/api/episodes/${i.episode}/call-sheet`, () => ({ version: 0, callTime: '08:30' }), callSheetBodySchema),
  json('episodes/[id]/call-sheet/send.post.ts', 'POST', (i) => `/api/episodes/${i.episode}/call-sheet/send`, () => ({ hash: '0'.repeat(64) }), callSheetSendSchema),
  json('episodes/[id]/publish/index.patch.ts', 'PATCH', (i) => `/api/episodes/${i.episode}/publish`, () => ({ videoUrl: 'https://video.example/v/1' }), publishTakeSchema),
  json('episodes/[id]/publish/recipes/[recipeId].put.ts', 'PUT', (i) => `/api/episodes/${i.episode}/publish/recipes/${i.recipe}`, () => ({ slug: 'campaign-stew' }), publishRecipeSchema),
  path('episodes/[id]/publish/recipes/[recipeId].delete.ts', 'DELETE', (b, i) => `/api/episodes/${i.episode}/publish/recipes/${b}`),
  { ...json('episodes/[id]/shoots.post.ts', 'POST', (i) => `/api/episodes/${i.episode}/shoots`, () => ({ mode: 'rehearsal' }), shootsBody()) },
  // the body schema of the route file: { ticked: boolean }
  json('episodes/[id]/shopping/checks/[key].put.ts', 'PUT', (i) => `/api/episodes/${i.episode}/shopping/checks/onion`, () => ({ ticked: true }), z.object({ ticked: z.boolean() })),
  json('shoots/[id]/join-codes/index.post.ts', 'POST', (i) => `/api/shoots/${i.shoot}/join-codes`, () => ({ role: 'camera' }), joinCodeBodySchema),
  path('shoots/[id]/join-codes/[codeId].delete.ts', 'DELETE', (b, i) => `/api/shoots/${i.shoot}/join-codes/${b}`),
  json('shoots/[id]/report/adopt.post.ts', 'POST', (i) => `/api/shoots/${i.shoot}/report/adopt`, () => ({ recipes: [{ id: 1, version: 1 }] }), adoptActualsSchema),
  json('shoots/[id]/report/undo.post.ts', 'POST', (i) => `/api/shoots/${i.shoot}/report/undo`, () => ({ adoptionId: 1 }), undoAdoptionSchema),
  json('shoots/[id]/commands.post.ts', 'POST', (i) => `/api/shoots/${i.shoot}/commands`, () => ({ type: 'marker.add', kind: 'good' }), shootCommandSchema),
]

/** The body schema of episodes/[id]/shoots.post.ts (declared in the route file). */
function shootsBody(): z.ZodType {
  return { safeParse: (v: unknown) => ({ success: typeof v === 'object' && v !== null && ['rehearsal', 'take'].includes((v as { mode?: unknown }).mode as string) }) } as unknown as z.ZodType
}

function form(u: { field: string; name: string; type: string; bytes: Uint8Array }): FormData {
  const data = new FormData()
  data.append(u.field, new Blob([new Uint8Array(u.bytes)], { type: u.type }), u.name)
  return data
}

/** A valid command of each type, the base the socket payloads are made from (as in the authorisation matrix). */
export const commandBases: Record<ShootCommandType, Record<string, unknown>> = {
  'shoot.start': {}, 'shoot.pause': {}, 'shoot.resume': {}, 'shoot.end': { cancelTimers: true }, 'step.next': {}, 'step.previous': {},
  'step.jump': { segment: 0, step: 0 }, 'timer.start': { label: 'Campaign timer', durationMs: 60_000 }, 'timer.pause': { timerId: 't1' },
  'timer.resume': { timerId: 't1' }, 'timer.addTime': { timerId: 't1', deltaMs: 60_000 }, 'timer.cancel': { timerId: 't1' },
  'timer.acknowledge': { timerId: 't1' }, 'rolling.set': { rolling: true }, 'clock.speed': { speed: 2 }, 'marker.add': { kind: 'good' },
  'wait.start': { stepId: 'campaign-step' },
  'marker.edit': { markerId: 'm1', text: 'Campaign note' }, 'marker.delete': { markerId: 'm1' },
  'camera.set': { name: 'Campaign camera', rate: '25' }, 'camera.remove': { cameraId: 'c1' },
}

/** Sends one payload as `client` (the app's own Origin, its cookie); the reply's status and parsed body. */
export async function send(client: Client, method: string, path: string, body: Body) {
  const headers: Record<string, string> = { origin: appOrigin(), cookie: client.cookie, accept: 'application/json' }
  let payload: BodyInit | undefined
  if (body && 'json' in body) {
    headers['content-type'] = 'application/json'
    payload = JSON.stringify(body.json) ?? 'null'
  } else if (body && 'text' in body) {
    headers['content-type'] = body.type
    payload = body.text
  } else if (body && 'form' in body) {
    payload = body.form
  }
  const res = await fetch(url(path), { method, headers, body: payload, redirect: 'manual' })
  const text = await res.text()
  let parsed: unknown = text
  try {
    parsed = JSON.parse(text)
  } catch {
    // kept as text; checkRefusal reports it
  }
  return { status: res.status, body: parsed }
}

/** The rows the payloads are made around: a recipe with one step, an episode, a rehearsal shoot, a price. */
export async function campaignIds(producer: Client): Promise<Ids> {
  const ids = {} as Ids
  ids.studio = (await producer.get('/api/me')).body.memberships[0].studioId
  const recipe = (await producer.post(`/api/studios/${ids.studio}/recipes`, {
    title: 'Campaign stew', servings: 4, steps: [{ text: 'Simmer the stew for 20 minutes.', handsOn: false, durationMin: 1200, durationMax: 1200, station: 'burner' }],
  })).body
  Object.assign(ids, { recipe: recipe.id, version: recipe.version, step: recipe.steps[0].id })
  const episode = (await producer.post(`/api/studios/${ids.studio}/episodes`, { title: 'Campaign episode', recipeIds: [ids.recipe] })).body
  Object.assign(ids, { episode: episode.id, episodeVersion: episode.version })
  ids.shoot = (await producer.post(`/api/episodes/${ids.episode}/shoots`, { mode: 'rehearsal' })).body.shoot.id
  ids.price = (await producer.post(`/api/studios/${ids.studio}/prices`, { item: 'Campaign flour', packageSize: 1, packageUnit: 'kg', priceMinor: 120, currency: 'GBP' })).body.id
  return ids
}

/** The environment that lifts the attempt limits, so the checks behind them are what answers. */
export const LIMITS_LIFTED = {
  HOBLINE_SOCKET_COMMANDS_PER_SECOND: '100000', HOBLINE_SOCKET_COMMAND_BURST: '100000',
  NUXT_AUTH_LOGIN_PER_EMAIL: '100000', NUXT_AUTH_LOGIN_PER_ADDRESS: '100000', NUXT_AUTH_JOIN_PER_ADDRESS: '100000',
  NUXT_AUTH_SIGNUP_PER_ADDRESS: '100000', NUXT_AUTH_RESET_PER_ADDRESS: '100000', NUXT_AUTH_RESET_PER_EMAIL: '100000',
}
