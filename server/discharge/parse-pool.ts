import { availableParallelism } from 'node:os'
import { Piscina } from 'piscina'
import { ApiError } from '../http/errors'
import type { AnalyseLogTask, AnalysedLog } from './parse-task'

/*
 * Discharge logs are parsed on worker threads, never on the thread that answers requests: a
 * 3.7 MB log takes a few hundred milliseconds of CPU, which would stall every other request.
 * One thread fewer than the machine's cores (at least one) leaves a core for the event loop;
 * uploads beyond what the threads can take wait in a short queue, and past it are refused.
 */
const maxParserThreads = Math.max(1, availableParallelism() - 1)
const maxQueuedLogs = 8
// A thread idle this long ends; the next upload starts one again (≈ 0.3 s).
const idleThreadMs = 60_000

let pool: Piscina | undefined

function parserPool(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./parse-worker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: maxParserThreads,
    maxQueue: maxQueuedLogs,
    idleTimeout: idleThreadMs,
  })
  return pool
}

const busy = () =>
  new ApiError(
    503,
    'parsers-busy',
    'The server is reading many logs at the moment. Nothing was stored; send the log again in a minute.',
    undefined,
    { 'Retry-After': '30' },
  )

/**
 * Parses an uploaded log and works out its stored figures off the event loop; a bad log is the
 * same 400/415 as on it.
 */
export async function analyseLogOffThread(
  bytes: Uint8Array,
  limits: AnalyseLogTask['limits'],
): Promise<Extract<AnalysedLog, { ok: true }>> {
  const workers = parserPool()
  if (workers.queueSize >= maxQueuedLogs) throw busy()
  const task: AnalyseLogTask = { bytes, limits }
  const analysed = (await workers.run(task)) as AnalysedLog
  if (!analysed.ok) {
    throw new ApiError(analysed.status, analysed.code, analysed.message, analysed.issues)
  }
  return analysed
}

/** Ends the parser threads (at shutdown); a later upload starts new ones. */
export async function stopLogParsers(): Promise<void> {
  const ending = pool
  pool = undefined
  await ending?.destroy()
}
