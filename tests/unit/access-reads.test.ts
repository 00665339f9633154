// The guard's memory of access reads (server/utils/access-reads.ts): kept until a change, never a
// read that began before a change, nothing kept when switched off (a server database).
import { afterEach, describe, expect, it } from 'vitest'
import { accessMayHaveChanged, accessRead, keepAccessReads, mayChangeAccess } from '../../server/utils/access-reads'

afterEach(() => keepAccessReads(false))

describe('access reads', () => {
  it('reads once per key until something may have changed', async () => {
    keepAccessReads(true)
    let reads = 0
    const role = () => accessRead('role:1:1', async () => (++reads, 'host'))
    expect([await role(), await role()]).toEqual(['host', 'host'])
    expect(reads).toBe(1)
    accessMayHaveChanged()
    await role()
    expect(reads).toBe(2)
  })

  it('does not keep a value read while a change happened', async () => {
    keepAccessReads(true)
    let release!: () => void
    let value = 'producer'
    const slow = accessRead('role:2:1', () => new Promise<string>((r) => { release = () => r(value) }))
    accessMayHaveChanged() // the member is demoted while the old role is being read
    value = 'viewer'
    release()
    expect(await slow).toBe('viewer')
    let reads = 0
    expect(await accessRead('role:2:1', async () => (++reads, 'viewer'))).toBe('viewer')
    expect(reads).toBe(1) // read again, not the value of the read that straddled the change
  })

  it('reads every time when not keeping (a server database shared by several processes)', async () => {
    keepAccessReads(false)
    let reads = 0
    await accessRead('version:1', async () => ++reads)
    await accessRead('version:1', async () => ++reads)
    expect(reads).toBe(2)
  })

  it('names the requests that may change access: every /api method but a read', () => {
    expect(mayChangeAccess('DELETE', '/api/studios/1/members/4')).toBe(true)
    expect(mayChangeAccess('POST', '/api/auth/logout-everywhere')).toBe(true)
    expect(mayChangeAccess('PATCH', '/api/studios/1/members/4')).toBe(true)
    expect(mayChangeAccess('GET', '/api/me')).toBe(false)
    expect(mayChangeAccess('POST', '/socket.io/?EIO=4')).toBe(false)
  })
})
