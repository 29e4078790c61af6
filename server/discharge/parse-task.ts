import { ApiError, type FieldIssue } from '../http/errors'
import { decodeLogBytes, parseDischargeCsv } from './parse-log'

/*
 * What a parser thread does with one uploaded file. Errors cannot cross a thread as our ApiError
 * (structured cloning keeps only name and message), so a refusal travels as plain data and the
 * samples as three columns of numbers (typed arrays copy in one piece, not 200,000 objects).
 */

export type ParsedLog =
  | { ok: true; timeS: Float64Array; voltageV: Float64Array; currentA: Float64Array }
  | { ok: false; status: number; code: string; message: string; issues?: FieldIssue[] }

export function parseLogTask(bytes: Uint8Array): ParsedLog {
  try {
    const samples = parseDischargeCsv(decodeLogBytes(bytes))
    return {
      ok: true,
      timeS: Float64Array.from(samples, (sample) => sample.timeS),
      voltageV: Float64Array.from(samples, (sample) => sample.voltageV),
      currentA: Float64Array.from(samples, (sample) => sample.currentA),
    }
  } catch (error) {
    if (!(error instanceof ApiError)) throw error
    const { status, code, message, issues } = error
    return { ok: false, status, code, message, ...(issues ? { issues } : {}) }
  }
}
