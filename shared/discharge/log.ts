// Answers and bodies of the discharge-log routes (docs/api.md, "The team's parts, rigs and plans"), shared by the
// server and the client.
import { z } from 'zod'
import type { PersonRef } from '../schemas/resources'
import { versionFieldSchema } from '../schemas/resources'
import type { DischargeAnalysis, DischargePoint } from './analyse'

/** What is kept of an analysis beside its points (which have their own column). */
export type DischargeFigures = Omit<DischargeAnalysis, 'points'> & {
  /** The pack's cutoff and rated capacity the log was read against, at upload. */
  cutoffV: number
  ratedAh: number
  sampleCount: number
}

/** How the log's health was measured: against the model of a new pack in the same run. */
export interface DischargeCalibration {
  /** What the model of a new pack (health 100 %) delivers at the log's current, to its cutoff. */
  newPackAh: number
  /** The model's charge with the measured health applied (the log's own Ah, to within 3 %). */
  calibratedAh: number
  currentA: number
  temperatureC: number
}

/** One log in a pack's list. */
export interface DischargeLogSummary extends DischargeFigures {
  /**
   * Health as the model uses it: delivered Ah ÷ what a new pack of this spec delivers at the log's
   * current and temperature. Falls back to `labelHealthPct` when `calibration` is null.
   */
  healthPct: number
  /** Delivered Ah ÷ the label's rated Ah (includes the rate loss of the run). */
  labelHealthPct: number
  /** Null when a new pack of this spec would deliver nothing at the log's current. */
  calibration: DischargeCalibration | null
  id: number
  packId: number
  fileName: string
  createdAt: string
  uploadedBy: PersonRef | null
  /** When this log's health figure was made the pack's; null if never. */
  acceptedAt: string | null
  /** A plain sentence when the figures need a caveat (a log that stops above the cutoff). */
  note: string | null
}

/** One log with its (downsampled) timeline; also the answer to an upload. */
export interface DischargeLogDetail extends DischargeLogSummary {
  points: DischargePoint[]
}

/** Accepting a log's health figure; `version` (optional) is the pack version the user saw. */
export const acceptDischargeLogSchema = z.object({
  version: versionFieldSchema.shape.version.optional(),
})
export type AcceptDischargeLogInput = z.infer<typeof acceptDischargeLogSchema>

/** The multipart field that carries the file, and the largest file read. */
export const DISCHARGE_LOG_FIELD = 'file'
export const DISCHARGE_LOG_MAX_BYTES = 5 * 1024 * 1024
