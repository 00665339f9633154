// Reads recipe imports in a worker thread, one at a time, so that no import holds the event loop
// that serves every live shoot (DEVELOPERS.md, "Recipe import"). The worker starts on the first
// import and is kept (unreferenced, so it never keeps the process alive). An import that takes
// longer than IMPORT_READ_LIMIT_MS is stopped: its worker is ended and the caller told what to fix.
import { Worker } from 'node:worker_threads'
import workerCode from '#recipe-import-worker'
import { DomainError } from '../../shared/utils/domain-error'
import type { QuantityParseOptions } from '../../shared/utils/quantity'
import type { ImportRead } from '../workers/recipe-import'
import { IMPORT_TOO_LARGE } from '../../shared/utils/schemaorg-read'

export const IMPORT_READ_LIMIT_MS = 5000

interface Pending { id: number; text: string; options: QuantityParseOptions; resolve: (r: ImportRead) => void; reject: (e: unknown) => void }
type Reply = { id: number; result?: ImportRead; refused?: string; failed?: string }

let worker: Worker | null = null
let busy: Pending | null = null
let timer: NodeJS.Timeout | null = null
let lastId = 0
const queue: Pending[] = []

function startWorker(): Worker {
  const w = new Worker(workerCode, { eval: true, resourceLimits: { maxOldGenerationSizeMb: 256 } })
  w.unref()
  w.on('message', (reply: Reply) => finish(reply))
  // Only the current worker's end fails the import in hand (a worker ended for its time is not).
  w.on('error', (error: Error & { code?: string }) => {
    if (worker !== w) return
    worker = null
    fail(error.code === 'ERR_WORKER_OUT_OF_MEMORY' ? new DomainError('too-large', IMPORT_TOO_LARGE) : error)
  })
  w.on('exit', () => {
    if (worker !== w) return
    worker = null
    fail(new Error('The import reader stopped.'))
  })
  return w
}

function next() {
  if (busy || queue.length === 0) return
  busy = queue.shift()!
  worker ??= startWorker()
  timer = setTimeout(() => {
    const w = worker
    worker = null
    fail(new DomainError('invalid', `The page took longer than ${IMPORT_READ_LIMIT_MS / 1000} s to read. Paste only the recipe's JSON-LD.`, { field: 'body' }))
    void w?.terminate()
  }, IMPORT_READ_LIMIT_MS)
  timer.unref()
  worker.postMessage({ id: busy.id, text: busy.text, options: busy.options })
}

function settle(): Pending | null {
  const task = busy
  busy = null
  if (timer) clearTimeout(timer)
  timer = null
  return task
}

function finish(reply: Reply) {
  if (busy?.id !== reply.id) return
  const task = settle()!
  if (reply.result) task.resolve(reply.result)
  else if (reply.refused !== undefined) task.reject(new DomainError('invalid', reply.refused, { field: 'body' }))
  else task.reject(new Error(`The import reader failed: ${reply.failed}`))
  next()
}

function fail(error: unknown) {
  const task = settle()
  task?.reject(error)
  next()
}

/** `importSchemaOrgRecipe(text, options)` and its recipe checked, off the event loop; refusals are DomainErrors. */
export function readImportOffLoop(text: string, options: QuantityParseOptions): Promise<ImportRead> {
  return new Promise((resolve, reject) => {
    queue.push({ id: ++lastId, text, options, resolve, reject })
    next()
  })
}
