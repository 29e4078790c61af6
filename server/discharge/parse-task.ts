import { ApiError, type FieldIssue } from '../http/errors'
import type { DischargePoint } from '../../shared/discharge/analyse'
import type { DischargeFigures } from '../../shared/discharge/log'
import { decodeLogBytes, parseDischargeCsv } from './parse-log'
import { storedAnalysis } from './stored-analysis'

/*
 * What a parser thread does with one uploaded file: parse it and work out its figures against
 * the pack's limits, so that neither the parse nor the analysis of a large log runs on the thread
 * that answers requests. Errors cannot cross a thread as our ApiError (structured cloning keeps
 * only name and message), so a refusal travels as plain data; the answer is the stored columns.
 */

export interface AnalyseLogTask {
  bytes: Uint8Array
  limits: { cutoffV: number; ratedAh: number }
}

export type AnalysedLog =
  | { ok: true; analysis: DischargeFigures; points: DischargePoint[] }
  | { ok: false; status: number; code: string; message: string; issues?: FieldIssue[] }

export function analyseLogTask({ bytes, limits }: AnalyseLogTask): AnalysedLog {
  try {
    return { ok: true, ...storedAnalysis(parseDischargeCsv(decodeLogBytes(bytes)), limits) }
  } catch (error) {
    if (!(error instanceof ApiError)) throw error
    const { status, code, message, issues } = error
    return { ok: false, status, code, message, ...(issues ? { issues } : {}) }
  }
}
