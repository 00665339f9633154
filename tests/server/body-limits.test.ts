// Bodies are refused while they arrive, not after: a body sent in chunks (no Content-Length, as
// HTTP/1.1 §7.1 of RFC 9112 allows) is counted as it comes and refused with a 413 that names the
// limit once it passes it. The limits: 2 MB for any JSON body, 512 KB for a recipe import, 1 MB for a
// price list (DEVELOPERS.md, "Recipe import" and "Request bodies").
import { request } from 'node:http'
import { url } from '@nuxt/test-utils/e2e'
import { beforeAll, describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { appOrigin, type Client, demo, type Json, signedIn } from '../support/client'

const KB = 1024

/**
 * Posts `total` bytes of `piece` repeated, in chunks of up to 64 KB, with no Content-Length; the
 * answer is read as soon as it comes (the server may answer and close before all is sent).
 */
function postChunked(client: Client, path: string, type: string, piece: string, total: number) {
  const size = Math.min(64 * KB, total)
  const chunk = Buffer.from(piece.repeat(Math.ceil(size / piece.length)).slice(0, size))
  return new Promise<{ status: number; body: Json }>((resolve, reject) => {
    const req = request(url(path), { method: 'POST', headers: { 'content-type': type, cookie: client.cookie, origin: appOrigin() } }, (res) => {
      let text = ''
      res.setEncoding('utf8').on('data', (d: string) => (text += d)).on('end', () => resolve({ status: res.statusCode!, body: JSON.parse(text) }))
    })
    req.on('error', (error) => (req.writableEnded ? reject(error) : undefined)) // a reset after the answer is expected
    let sent = 0
    const write = () => {
      while (sent < total) {
        sent += chunk.length
        if (!req.write(chunk)) return void req.once('drain', write)
      }
      req.end()
    }
    write()
  })
}

describe('request bodies are read within their limits', async () => {
  await useBuiltApp()
  let producer: Client
  let studioPath: string

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    studioPath = `/api/studios/${(await producer.get('/api/me')).body.memberships[0].studioId}`
  })

  it('a chunked JSON body over 2 MB: 413 saying the limit, and the recipe list is unchanged', async () => {
    const before = (await producer.get(`${studioPath}/recipes`)).body
    const reply = await postChunked(producer, `${studioPath}/recipes`, 'application/json', '{"name":"x"', 3 * 1024 * KB)
    expect(reply.status).toBe(413)
    expect(reply.body.statusMessage).toMatch(/larger than 2 MB; send less at once/)
    expect((await producer.get(`${studioPath}/recipes`)).body).toEqual(before)
  })

  it('a chunked recipe import over 512 KB: 413 saying to paste only the JSON-LD', async () => {
    const reply = await postChunked(producer, `${studioPath}/recipes/import?preview=1`, 'text/html', '<p>', 700 * KB)
    expect(reply.status).toBe(413)
    expect(reply.body.statusMessage).toMatch(/512 KB\. Paste only the recipe's JSON-LD/)
  })

  it('a chunked recipe import under the cap is still read', async () => {
    const recipe = JSON.stringify({ '@context': 'https://schema.org', '@type': 'Recipe', name: 'Chunked toast', recipeYield: '1', recipeIngredient: ['1 slice bread'] })
    const reply = await postChunked(producer, `${studioPath}/recipes/import?preview=1`, 'application/ld+json', recipe, recipe.length)
    expect(reply.status, JSON.stringify(reply.body)).toBe(200)
    expect(reply.body.body.title).toBe('Chunked toast')
  })
})
