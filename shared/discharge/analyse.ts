/**
 * What a measured discharge says about a pack: charge and energy delivered down to the cutoff
 * voltage (trapezoid rule), health against the rated capacity, and an internal-resistance
 * estimate from the load steps in the log.
 */
export interface DischargeSample {
  timeS: number
  voltageV: number
  /** Discharge current, positive out of the pack. */
  currentA: number
}

export interface DischargePoint {
  minute: number
  voltageV: number
  currentA: number
  deliveredAh: number
}

export interface DischargeAnalysis {
  deliveredAh: number
  deliveredWh: number
  healthPct: number
  /** False when the log ends above the cutoff: the figures are then a lower bound. */
  reachedCutoff: boolean
  durationS: number
  endVoltageV: number
  averageCurrentA: number
  resistanceOhm?: number
  /** How many load steps the resistance estimate rests on. */
  resistanceSteps: number
  points: DischargePoint[]
}

const secondsPerHour = 3600
// The timeline kept with a log; enough for a chart, small enough to store as JSON.
export const maxStoredPoints = 500
// A load step counts when the current jumps by at least this much between neighbouring samples.
const minimumStepA = 0.1
const minimumStepFraction = 0.1
// Loggers write every 1–60 s (common practice); across a longer gap the discharge itself would
// swamp the step. The voltage on each side is carried to the moment of the step along the trend
// of its own plateau, so the drift of the discharge between two samples does not count as I·R.
const maximumStepGapS = 120
// Samples of a plateau used for its trend: the ones nearest the step, within this time.
const plateauSamples = 5
const plateauWindowS = 300
// Plausible bounds for one pack's internal resistance; outside them a "step" is noise.
const maximumResistanceOhm = 10

function interpolate(a: number, b: number, fraction: number): number {
  return a + (b - a) * fraction
}

export function analyseDischarge(
  samples: readonly DischargeSample[],
  pack: { cutoffV: number; ratedAh: number },
): DischargeAnalysis {
  let deliveredAs = 0
  let deliveredWs = 0
  let reachedCutoff = false
  const kept: { sample: DischargeSample; deliveredAh: number }[] = []
  const first = samples[0]
  if (!first) throw new Error('A discharge log needs at least one sample')
  kept.push({ sample: first, deliveredAh: 0 })

  for (let index = 1; index < samples.length; index += 1) {
    const previous = samples[index - 1]!
    let current = samples[index]!
    if (current.voltageV <= pack.cutoffV) {
      // Stop at the crossing, found by linear interpolation between the two samples.
      const span = previous.voltageV - current.voltageV
      const fraction =
        span > 0 ? Math.min(1, Math.max(0, (previous.voltageV - pack.cutoffV) / span)) : 0
      current = {
        timeS: interpolate(previous.timeS, current.timeS, fraction),
        voltageV: pack.cutoffV,
        currentA: interpolate(previous.currentA, current.currentA, fraction),
      }
      reachedCutoff = true
    }
    const dt = current.timeS - previous.timeS
    deliveredAs += ((previous.currentA + current.currentA) / 2) * dt
    deliveredWs +=
      ((previous.currentA * previous.voltageV + current.currentA * current.voltageV) / 2) * dt
    kept.push({ sample: current, deliveredAh: deliveredAs / secondsPerHour })
    if (reachedCutoff) break
  }

  const last = kept[kept.length - 1]!.sample
  const durationS = last.timeS - first.timeS
  const deliveredAh = deliveredAs / secondsPerHour
  const resistance = resistanceFromSteps(samples.slice(0, kept.length))

  return {
    deliveredAh,
    deliveredWh: deliveredWs / secondsPerHour,
    healthPct: (deliveredAh / pack.ratedAh) * 100,
    reachedCutoff,
    durationS,
    endVoltageV: last.voltageV,
    averageCurrentA: durationS > 0 ? deliveredAs / durationS : 0,
    ...(resistance.ohm !== undefined ? { resistanceOhm: resistance.ohm } : {}),
    resistanceSteps: resistance.steps,
    points: downsample(kept).map(({ sample, deliveredAh: ah }) => ({
      minute: (sample.timeS - first.timeS) / 60,
      voltageV: sample.voltageV,
      currentA: sample.currentA,
      deliveredAh: ah,
    })),
  }
}

/** Straight-line fit V = a + b·t by least squares; one sample gives a flat line. */
function lineThrough(samples: readonly DischargeSample[]): (timeS: number) => number {
  const n = samples.length
  const meanT = samples.reduce((sum, sample) => sum + sample.timeS, 0) / n
  const meanV = samples.reduce((sum, sample) => sum + sample.voltageV, 0) / n
  let covariance = 0
  let variance = 0
  for (const sample of samples) {
    covariance += (sample.timeS - meanT) * (sample.voltageV - meanV)
    variance += (sample.timeS - meanT) ** 2
  }
  const slope = variance > 0 ? covariance / variance : 0
  return (timeS) => meanV + slope * (timeS - meanT)
}

/** The samples on one side of a step that stay at that side's current, nearest first. */
function plateau(
  samples: readonly DischargeSample[],
  from: number,
  direction: 1 | -1,
  thresholdA: number,
): DischargeSample[] {
  const edge = samples[from]!
  const kept: DischargeSample[] = []
  for (
    let index = from;
    index >= 0 && index < samples.length && kept.length < plateauSamples;
    index += direction
  ) {
    const sample = samples[index]!
    if (Math.abs(sample.currentA - edge.currentA) >= thresholdA) break
    if (Math.abs(sample.timeS - edge.timeS) > plateauWindowS) break
    kept.push(sample)
  }
  return kept
}

/**
 * R = −ΔV/ΔI at each step of the current (Thevenin model of the pack, V = OCV − I·R), with each
 * side's voltage taken on its plateau's trend at the middle of the step; the median of the steps
 * resists outliers (docs/estimate-api.md, "Discharge logs").
 */
function resistanceFromSteps(samples: readonly DischargeSample[]): { ohm?: number; steps: number } {
  const meanCurrentA = samples.reduce((sum, sample) => sum + sample.currentA, 0) / samples.length
  const stepThresholdA = Math.max(minimumStepA, minimumStepFraction * meanCurrentA)
  const estimates: number[] = []
  for (let index = 1; index < samples.length; index += 1) {
    const before = samples[index - 1]!
    const after = samples[index]!
    const deltaA = after.currentA - before.currentA
    if (Math.abs(deltaA) < stepThresholdA || after.timeS - before.timeS > maximumStepGapS) continue
    const stepTimeS = (before.timeS + after.timeS) / 2
    const beforeV = lineThrough(plateau(samples, index - 1, -1, stepThresholdA))(stepTimeS)
    const afterV = lineThrough(plateau(samples, index, 1, stepThresholdA))(stepTimeS)
    const ohm = -(afterV - beforeV) / deltaA
    if (ohm > 0 && ohm < maximumResistanceOhm) estimates.push(ohm)
  }
  if (estimates.length === 0) return { steps: 0 }
  estimates.sort((a, b) => a - b)
  const middle = Math.floor(estimates.length / 2)
  const median =
    estimates.length % 2 === 1
      ? estimates[middle]!
      : (estimates[middle - 1]! + estimates[middle]!) / 2
  return { ohm: median, steps: estimates.length }
}

/** Keeps evenly spaced samples, always including the first and the last. */
function downsample<T>(items: readonly T[]): T[] {
  if (items.length <= maxStoredPoints) return [...items]
  const stride = (items.length - 1) / (maxStoredPoints - 1)
  return Array.from({ length: maxStoredPoints }, (_, index) => items[Math.round(index * stride)]!)
}
