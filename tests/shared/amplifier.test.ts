import { describe, expect, it } from 'vitest'
import {
  amplifierInputW,
  classABiasCurrentA,
  classAbSupplyCurrentA,
  clipPowerW,
  outputResistanceOhm,
  ratingExcessDb,
} from '../../shared/engine/amplifier'
import type { AmplifierModel } from '../../shared/engine/amplifier'
import { SINE_BURST_MEAN_TO_RMS } from '../../shared/engine/programme'
import { estimate } from '../../shared/engine/estimate'
import { columnRig, variant } from './rig-fixtures'

const sine = SINE_BURST_MEAN_TO_RMS

describe('class B supply draw', () => {
  it('reaches π/4 at full sine output, bridged and single-ended', () => {
    // Source: Boylestad & Nashelsky, Electronic Devices and Circuit Theory, ch. 12: class B
    // maximum efficiency π/4 ≈ 78.5 %
    const supplyV = 20
    const loadOhm = 8
    const bridgedOutW = supplyV ** 2 / (2 * loadOhm) // peak swing = V_s
    const bridgedInW = supplyV * classAbSupplyCurrentA(bridgedOutW, loadOhm, sine, true)
    expect(bridgedOutW / bridgedInW).toBeCloseTo(Math.PI / 4, 9)
    const singleOutW = (supplyV / 2) ** 2 / (2 * loadOhm) // peak swing = V_s/2
    const singleInW = supplyV * classAbSupplyCurrentA(singleOutW, loadOhm, sine, false)
    expect(singleOutW / singleInW).toBeCloseTo(Math.PI / 4, 9)
  })

  it('falls to (π/4)(Vp/Vcc) below full swing', () => {
    // Source: Boylestad & Nashelsky ch. 12: η = (π/4)(V_L(p)/V_CC)
    const supplyV = 24
    const loadOhm = 4
    for (const peakV of [6, 12, 18]) {
      const outW = peakV ** 2 / (2 * loadOhm)
      const inW = supplyV * classAbSupplyCurrentA(outW, loadOhm, sine, true)
      expect(outW / inW).toBeCloseTo((Math.PI / 4) * (peakV / supplyV), 9)
    }
  })
})

describe('clip power from a datasheet point', () => {
  it('derives R_out so the datasheet point is reproduced', () => {
    // Source: docs/model.md §4: V_pk,r = √(2·50·4) = 20 V, R_out = 4·(21/20 − 1) = 0.2 ohm (bridged)
    const { outputResistanceOhm: rOut, clamped } = outputResistanceOhm(50, 4, 21, true)
    expect(rOut).toBeCloseTo(0.2, 9)
    expect(clamped).toBe(false)
    expect(clipPowerW(21, 4, rOut, true)).toBeCloseTo(50, 9)
    // Into 8 ohm: (21 · 8/8.2)² / 16 = 26.23 W (docs/model.md §4: V_pk = V_s·Z/(Z + R_out))
    expect(clipPowerW(21, 8, rOut, true)).toBeCloseTo(26.23, 2)
  })

  it('swings half the supply single-ended', () => {
    // Source: docs/model.md §4: single-ended, V_pk = (V_s/2)·Z/(Z + R_out); ideal 12 V into 4 ohm is
    // 6² / 8 = 4.5 W
    expect(clipPowerW(12, 4, 0, false)).toBeCloseTo(4.5, 9)
    const { outputResistanceOhm: rOut } = outputResistanceOhm(4, 4, 12, false)
    expect(rOut).toBeCloseTo(4 * (6 / Math.sqrt(32) - 1), 9)
  })

  it('clamps an over-ideal rating to R_out = 0', () => {
    // Source: docs/model.md §4: 100 W into 4 ohm needs a 28.3 V peak, more than a 21 V supply swings
    expect(outputResistanceOhm(100, 4, 21, true)).toEqual({ outputResistanceOhm: 0, clamped: true })
  })

  it('takes about 1 dB off a 10 % THD rating, and takes 10 % when none is given', () => {
    // Source: from memory: a 10 % THD rating is roughly 1 dB above the clean figure; common
    // practice: a board's headline power is usually its 10 % THD figure
    expect(ratingExcessDb(1)).toBe(0)
    expect(ratingExcessDb(10)).toBe(1)
    expect(ratingExcessDb(0.1)).toBe(0)
    const clean = estimate(
      variant(columnRig(), { amplifier: { ...columnRig().amplifier, ratedThdPct: 1 } }),
    )
    const loose = estimate(
      variant(columnRig(), { amplifier: { ...columnRig().amplifier, ratedThdPct: 10 } }),
    )
    expect(10 * Math.log10(clean.clipPowerW.full / loose.clipPowerW.full)).toBeGreaterThan(0.5)
    const unsaid = estimate(columnRig())
    expect(unsaid.clipPowerW.full).toBe(loose.clipPowerW.full)
    expect(unsaid.assumed).toContainEqual(
      expect.objectContaining({ field: 'amplifier.ratedThdPct', value: 10 }),
    )
  })

  it('loses clip power as the pack sags to cutoff', () => {
    // Source: docs/model.md §4: P_clip ∝ V_s², so 15 V at cutoff against 21 V full is about −2.9 dB
    const result = estimate(columnRig())
    expect(result.clipPowerW.cutoff).toBeLessThan(result.clipPowerW.full)
    expect(10 * Math.log10(result.clipPowerW.full / result.clipPowerW.cutoff)).toBeGreaterThan(2.5)
  })
})

describe('supply draw by class', () => {
  const model = (ampClass: AmplifierModel['ampClass']): AmplifierModel => ({
    ampClass,
    channels: 1,
    bridged: true,
    loadOhm: 8,
    outputResistanceOhm: 0,
    clipPowerPerV2: 1 / 16,
    efficiency: ampClass === 'a' ? 0.25 : 0.88,
    idleCurrentA: ampClass === 'a' ? 0 : 0.05,
    biasCurrentA: ampClass === 'a' ? classABiasCurrentA(10, 12, 0.25) : 0,
    lockoutV: null,
    bulkCapacitanceF: 0,
  })

  it('class D draws P_out/η + V_s·I_idle', () => {
    // Source: docs/model.md §4: P_in = P_out/η + V_s·I_idle with η 0.88 and idle 0.05 A by default
    expect(amplifierInputW(model('d'), 12, 10, 1, sine)).toBeCloseTo(10 / 0.88 + 12 * 0.05, 9)
    expect(amplifierInputW(model('d'), 12, 10, 0, sine)).toBeCloseTo(0.6, 9)
  })

  it('class A draws its bias whatever it plays, 25 % efficient at rated output', () => {
    // Source: Boylestad & Nashelsky ch. 12: series-fed class A at most 25 %
    const amplifier = model('a')
    expect(amplifierInputW(amplifier, 12, 10, 1, sine)).toBeCloseTo(40, 9)
    expect(amplifierInputW(amplifier, 12, 0, 1, sine)).toBeCloseTo(40, 9)
    expect(10 / amplifierInputW(amplifier, 12, 10, 1, sine)).toBeCloseTo(0.25, 9)
  })

  it('class AB adds its idle current to the signal current', () => {
    // Source: docs/model.md §4: P_in = V_s·mean|i| + V_s·I_idle
    const signalW = 12 * classAbSupplyCurrentA(4, 8, sine, true)
    expect(amplifierInputW(model('ab'), 12, 4, 1, sine)).toBeCloseTo(signalW + 0.6, 9)
  })
})
