// Request bodies are read within a limit while they arrive, so a body that announces no length
// (chunked) or a false one cannot fill the memory before it is refused. The bytes read are kept on
// the event, where h3's readRawBody, readBody and readMultipartFormData find them.
import type { H3Event } from 'h3'
import { DomainError } from '../../shared/utils/domain-error'

/** Every JSON body: far above the largest recipe a person writes (200 steps of long text). */
export const JSON_BODY_MAX_BYTES = 2 * 1024 * 1024

/** Reads the body, refusing it (413, `message`) as soon as more than `maxBytes` have arrived. */
export async function readBodyWithin(event: H3Event, maxBytes: number, message: string): Promise<Buffer> {
  const held = (event as { _requestBody?: unknown })._requestBody
  if (Buffer.isBuffer(held)) return held
  if (Number(getRequestHeader(event, 'content-length') ?? 0) > maxBytes) throw new DomainError('too-large', message)
  const req = event.node.req
  const body = await new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size <= maxBytes) return void chunks.push(chunk)
      // Over the limit: stop keeping what arrives (the rest is read and dropped, so that the sender
      // gets the 413 instead of a reset connection) and refuse.
      req.off('data', onData).off('end', onEnd)
      chunks.length = 0
      reject(new DomainError('too-large', message))
    }
    const onEnd = () => resolve(Buffer.concat(chunks))
    req.on('data', onData).on('end', onEnd).on('error', reject)
  })
  ;(event as { _requestBody?: unknown })._requestBody = body
  return body
}
