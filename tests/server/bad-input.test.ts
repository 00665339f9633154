// Bad input gets a 400 that names the field by the form's label and says what to fix — never a 500;
// `data.field` keeps the request's key for programs.
import { beforeAll, describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn } from '../support/client'
import { insertShoot } from '../support/shoot-row'
import { wordsProblem } from '../support/refusal-words'
import { fieldLabel, type FieldLabels } from '../../shared/utils/field-labels'
import { JOIN_CODE_LABELS } from '../../shared/utils/account-schemas'

const huge = 'x'.repeat(200_000)

interface Case { label: string; body: unknown; field: string }

const signupOk = { name: 'Ada', email: 'ada@example.test', password: 'long enough password', studioName: 'Ada Kitchen' }

const routes: { name: string; method: string; path: (ids: { studio: number; shoot: number }) => string; as: 'anon' | 'producer'; cases: Case[]; own?: FieldLabels }[] = [
  {
    name: 'sign-up', method: 'POST', path: () => '/api/auth/signup', as: 'anon',
    cases: [
      { label: 'missing name', body: { ...signupOk, name: undefined }, field: 'name' },
      { label: 'name as a number', body: { ...signupOk, name: 42 }, field: 'name' },
      { label: 'huge name', body: { ...signupOk, name: huge }, field: 'name' },
      { label: 'e-mail not an address', body: { ...signupOk, email: 'not-an-address' }, field: 'email' },
      { label: 'e-mail as an array', body: { ...signupOk, email: ['a@b.test'] }, field: 'email' },
      { label: 'huge password', body: { ...signupOk, password: huge }, field: 'password' },
      { label: 'missing studio name', body: { ...signupOk, studioName: '' }, field: 'studioName' },
    ],
  },
  {
    name: 'sign-in', method: 'POST', path: () => '/api/auth/login', as: 'anon',
    cases: [
      { label: 'missing e-mail', body: { password: 'something long' }, field: 'email' },
      { label: 'password as an object', body: { email: demo.host, password: { a: 1 } }, field: 'password' },
    ],
  },
  {
    name: 'invite', method: 'POST', path: (i) => `/api/studios/${i.studio}/invites`, as: 'producer',
    cases: [
      { label: 'unknown role', body: { email: 'new@example.test', role: 'director' }, field: 'role' },
      { label: 'role as a number', body: { email: 'new@example.test', role: 3 }, field: 'role' },
      { label: 'missing e-mail', body: { role: 'host' }, field: 'email' },
      { label: 'huge e-mail', body: { email: `${huge}@example.test`, role: 'host' }, field: 'email' },
    ],
  },
  {
    name: 'role change', method: 'PATCH', path: (i) => `/api/studios/${i.studio}/members/1`, as: 'producer',
    cases: [{ label: 'unknown role', body: { role: 'owner' }, field: 'role' }],
  },
  {
    name: 'join code', method: 'POST', path: (i) => `/api/shoots/${i.shoot}/join-codes`, as: 'producer', own: JOIN_CODE_LABELS,
    cases: [
      { label: 'studio role on a device', body: { role: 'viewer' }, field: 'role' },
      { label: 'minutes as text', body: { role: 'host', minutes: 'ten' }, field: 'minutes' },
      { label: 'minutes too long', body: { role: 'host', minutes: 100000 }, field: 'minutes' },
    ],
  },
  {
    name: 'join', method: 'POST', path: () => '/api/join', as: 'anon',
    cases: [
      { label: 'missing code', body: {}, field: 'code' },
      { label: 'huge code', body: { code: huge }, field: 'code' },
    ],
  },
  {
    name: 'studio switch', method: 'PUT', path: () => '/api/me/studio', as: 'producer',
    cases: [{ label: 'studio id as text', body: { studioId: 'one' }, field: 'studioId' }],
  },
]

describe('bad input', async () => {
  const { databasePath } = await useBuiltApp()
  const ids = { studio: 0, shoot: 0 }
  let producer: Client
  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    ids.studio = (await producer.get('/api/me')).body.memberships[0].studioId
    ids.shoot = await insertShoot(databasePath, ids.studio, 'Bad input shoot')
  })

  for (const route of routes) {
    for (const c of route.cases) {
      it(`${route.name}: ${c.label} → 400 naming ${c.field} by its label`, async () => {
        const client = route.as === 'producer' ? producer : new Client()
        const res = await client.call(route.method, route.path(ids), c.body)
        expect(res.status).toBe(400)
        expect(res.body.statusMessage.startsWith(`${fieldLabel(c.field, route.own)}: `), res.body.statusMessage).toBe(true)
        expect(wordsProblem(res.body.statusMessage)).toBeNull()
        expect(res.body.data.field).toBe(c.field)
      })
    }
  }

  it('a body that is not JSON is a 400 that says so', async () => {
    const res = await new Client().call('POST', '/api/auth/login', '{"email": "a@b', { 'content-type': 'application/json' })
    expect(res.status).toBe(400)
    expect(res.body.statusMessage).toMatch(/^The request is not readable JSON; send the fields as a JSON object/)
    expect(res.body.data.field).toBe('body')
  })

  it('an id in the path that is not a number is a 400 saying what the address should hold', async () => {
    const res = await producer.get('/api/studios/abc/members')
    expect(res.status).toBe(400)
    expect(res.body.statusMessage).toBe('This address names no studio: the studio number in it must be a whole number such as 12. Check the link.')
    expect(res.body.data.field).toBe('studioId')
  })

  it('nothing saved is lost: the account still signs in after every refusal', async () => {
    expect((await signedIn(demo.producer)).cookie).not.toBe('')
  })
})
