import { describe, expect, it } from 'vitest'
import {
  analyseDischarge,
  maxStoredPoints,
  type DischargeSample,
} from '../../shared/discharge/analyse'
import { constantCurrentSamples } from '../helpers/discharge-logs'

describe('delivered charge and energy', () => {
  it('gives Ah = I × t exactly for a constant current', () => {
    // Source: definition of the ampere-hour (1 Ah = 3600 C); the trapezoid rule is exact for a constant.
    const log = constantCurrentSamples({
      currentA: 2,
      hours: 2.5,
      startV: 12.8,
      endV: 12.0,
      stepS: 30,
    })
    const result = analyseDischarge(log, { cutoffV: 10.5, ratedAh: 7 })
    expect(result.deliveredAh).toBeCloseTo(5, 10)
    expect(result.reachedCutoff).toBe(false)
    expect(result.healthPct).toBeCloseTo((5 / 7) * 100, 8)
  })

  it('gives Wh = I × mean V × t for a linear voltage fall', () => {
    // Source: trapezoid rule, exact for a linear integrand (any numerical analysis text).
    const log = constantCurrentSamples({ currentA: 1, hours: 1, startV: 4.2, endV: 3.4, stepS: 10 })
    const result = analyseDischarge(log, { cutoffV: 3.0, ratedAh: 1 })
    expect(result.deliveredWh).toBeCloseTo(1 * 3.8 * 1, 8)
  })

  it('stops counting at the cutoff crossing, interpolated between samples', () => {
    // 2 A for 1 h from 13 V to 11 V; cutoff 12 V is crossed halfway: 1 Ah delivered.
    // Source: linear interpolation of the crossing time; Ah = I × t.
    const log = constantCurrentSamples({ currentA: 2, hours: 1, startV: 13, endV: 11, stepS: 60 })
    const result = analyseDischarge(log, { cutoffV: 12, ratedAh: 2 })
    expect(result.reachedCutoff).toBe(true)
    expect(result.deliveredAh).toBeCloseTo(1, 6)
    expect(result.durationS).toBeCloseTo(1800, 6)
    expect(result.endVoltageV).toBe(12)
    expect(result.healthPct).toBeCloseTo(50, 6)
  })
})

describe('internal resistance from load steps', () => {
  it('recovers R from ΔV/ΔI when the current steps between two levels', () => {
    // Thevenin model V = OCV − I·R (any circuit theory text): a 0.05 Ω pack stepping 1 A ↔ 5 A.
    const resistanceOhm = 0.05
    const samples: DischargeSample[] = []
    for (let timeS = 0; timeS < 600; timeS += 1) {
      const currentA = Math.floor(timeS / 60) % 2 === 0 ? 1 : 5
      const ocvV = 12.6 - timeS * 0.0005
      samples.push({ timeS, voltageV: ocvV - currentA * resistanceOhm, currentA })
    }
    const result = analyseDischarge(samples, { cutoffV: 10, ratedAh: 10 })
    expect(result.resistanceOhm).toBeDefined()
    expect(result.resistanceOhm!).toBeCloseTo(resistanceOhm, 3)
    expect(result.resistanceSteps).toBe(9)
  })

  it('recovers R from a log stepping 1 A ↔ 4 A every five minutes, sampled once a minute', () => {
    // Thevenin model V = OCV − I·R (any circuit theory text) with an OCV that falls in proportion
    // to the charge drawn (so it falls four times as fast at 4 A): a 0.12 Ω pack. The current
    // changes midway between two samples, as a logger writing once a minute sees it; the
    // discharge between those samples must not be read as I·R.
    const resistanceOhm = 0.12
    const voltsPerAh = 2 // OCV slope of a 5 Ah, 10 V-swing pack, linear: an invented test pack
    const switchS = (timeS: number) => Math.floor((timeS - 30) / 300)
    const currentAt = (timeS: number) => (timeS < 30 || switchS(timeS) % 2 === 1 ? 1 : 4)
    const samples: DischargeSample[] = []
    let chargeAh = 0
    for (let timeS = 0; timeS <= 3600; timeS += 60) {
      if (timeS > 0) {
        // Exact charge over the minute: the current switches at 30 s past a multiple of 300 s.
        for (let second = timeS - 60; second < timeS; second += 1) {
          chargeAh += currentAt(second + 0.5) / 3600
        }
      }
      const currentA = currentAt(timeS)
      samples.push({
        timeS,
        voltageV: 41 - voltsPerAh * chargeAh - currentA * resistanceOhm,
        currentA,
      })
    }
    const result = analyseDischarge(samples, { cutoffV: 30, ratedAh: 5 })
    expect(result.resistanceOhm).toBeDefined()
    expect(result.resistanceOhm!).toBeCloseTo(resistanceOhm, 4)
    // Steps at 30, 330, 630, …, 3330 s: twelve of them in the hour.
    expect(result.resistanceSteps).toBe(12)
  })

  it('gives no resistance for a log without load steps', () => {
    const log = constantCurrentSamples({
      currentA: 3,
      hours: 1,
      startV: 12.7,
      endV: 12.1,
      stepS: 30,
    })
    const result = analyseDischarge(log, { cutoffV: 10.5, ratedAh: 7 })
    expect(result.resistanceOhm).toBeUndefined()
    expect(result.resistanceSteps).toBe(0)
  })
})

describe('stored points', () => {
  it('keeps at most the stored number of points, first and last included', () => {
    const log = constantCurrentSamples({ currentA: 1, hours: 3, startV: 4.1, endV: 3.5, stepS: 1 })
    const result = analyseDischarge(log, { cutoffV: 3, ratedAh: 3 })
    expect(result.points.length).toBe(maxStoredPoints)
    expect(result.points[0]!.minute).toBe(0)
    expect(result.points[result.points.length - 1]!.minute).toBeCloseTo(180, 6)
    expect(result.points[result.points.length - 1]!.deliveredAh).toBeCloseTo(3, 6)
  })
})
