import type { DischargeCalibration, DischargeFigures } from '../../shared/discharge/log'
import { calibrateFromLog } from '../../shared/engine/discharge-model'
import type { PackSpec } from '../../shared/schemas/estimate'

/**
 * A log's health figures against the pack as saved now: `healthPct` measured against the model
 * of a new pack at the log's current (so that the calibrated model reproduces the log), and the
 * label ratio beside it. Worked out on every read, so a pack whose cells are corrected later
 * gets a health figure for the corrected spec. Logs carry no temperature: 25 °C, as rated.
 */
export function calibrationOf(
  figures: DischargeFigures,
  spec: PackSpec,
): { healthPct: number; labelHealthPct: number; calibration: DischargeCalibration | null } {
  const labelHealthPct = (100 * figures.deliveredAh) / figures.ratedAh
  const measured = calibrateFromLog(spec, figures)
  if (!measured) return { healthPct: labelHealthPct, labelHealthPct, calibration: null }
  const { healthPct, ...calibration } = measured
  return { healthPct, labelHealthPct, calibration }
}
