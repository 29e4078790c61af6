import { availableParallelism } from 'node:os'
import { Piscina } from 'piscina'
import type { DischargeSample } from '../../shared/discharge/analyse'
import { ApiError } from '../http/errors'
import type { ParsedLog } from './parse-task'

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

function samplesOf(parsed: Extract<ParsedLog, { ok: true }>): DischargeSample[] {
  return Array.from(parsed.timeS, (timeS, index) => ({
    timeS,
    voltageV: parsed.voltageV[index]!,
    currentA: parsed.currentA[index]!,
  }))
}

const busy = () =>
  new ApiError(
    503,
    'parsers-busy',
    'The server is reading many logs at the moment. Nothing was stored; send the log again in a minute.',
    undefined,
    { 'Retry-After': '30' },
  )

/** Parses an uploaded log off the event loop; a bad log is the same 400/415 as on it. */
export async function parseLogOffThread(bytes: Uint8Array): Promise<DischargeSample[]> {
  const workers = parserPool()
  if (workers.queueSize >= maxQueuedLogs) throw busy()
  const parsed = (await workers.run(bytes)) as ParsedLog
  if (!parsed.ok) throw new ApiError(parsed.status, parsed.code, parsed.message, parsed.issues)
  return samplesOf(parsed)
}

/** Ends the parser threads (at shutdown); a later upload starts new ones. */
export async function stopLogParsers(): Promise<void> {
  const ending = pool
  pool = undefined
  await ending?.destroy()
}
