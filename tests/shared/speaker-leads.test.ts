import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { conductorResistanceOhmPerKm } from '../../shared/engine/leads'
import { speakerLeadsModel, speakerShare } from '../../shared/engine/speaker-leads'
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import { awgToAreaMm2 } from '../../shared/units'
import { columnRig, variant } from './rig-fixtures'

describe('speaker leads', () => {
  it('gives 2 × 10 m of 1.5 mm² copper about 0.23 ohm at 20 °C', () => {
    // Source: IEC 60028: annealed copper 1.7241e-8 ohm·m at 20 °C, so 1.5 mm² is 11.49 ohm/km
    // and the 20 m round trip 0.2299 ohm (no connector allowance on speaker terminals).
    const leads = speakerLeadsModel({ areaMm2: 1.5, lengthM: 10, connectorOhm: 0 }, 8, 20)
    expect(conductorResistanceOhmPerKm(1.5, 20)).toBeCloseTo(11.494, 3)
    expect(leads.resistanceOhm).toBeCloseTo(0.2299, 4)
  })

  it('gives 16 AWG 1.31 mm² and 13.2 ohm/km', () => {
    // Source: ASTM B258 (d = 0.127 mm × 92^((36 − n)/39), 1.291 mm for 16 AWG) with IEC 60028
    // resistivity; wire tables list 16 AWG at 4.016 ohm/1000 ft = 13.17 ohm/km.
    expect(awgToAreaMm2(16)).toBeCloseTo(1.309, 3)
    expect(conductorResistanceOhmPerKm(awgToAreaMm2(16), 20)).toBeCloseTo(13.17, 1)
    const result = estimate(
      variant(columnRig(), { speakerLeads: { awg: 16, lengthM: 10 }, temperatureC: 20 }),
    )
    expect(result.speakerLeads.resistanceOhm).toBeCloseTo(0.2634, 3)
  })

  it('sends Z/(Z + R) of the power to the speakers and the rest into the cable', () => {
    // Source: Ohm's law with one current through two resistances in series, P = I²R: an 8 ohm
    // speaker on 0.23 ohm of cable gets 8/8.23 = 97.2 %, the cable 2.8 %.
    expect(speakerShare(8, 0.23)).toBeCloseTo(8 / 8.23, 12)
    const leads = speakerLeadsModel({ areaMm2: 1.5, lengthM: 10, connectorOhm: 0 }, 8, 20)
    expect(leads.lossPct).toBeCloseTo(2.79, 2)
    // A 4 ohm load on the same cable loses about twice the share: 5.4 %.
    expect(
      speakerLeadsModel({ areaMm2: 1.5, lengthM: 10, connectorOhm: 0 }, 4, 20).lossPct,
    ).toBeCloseTo(5.43, 2)
  })

  it('reports the loss on the rig and lowers the level by 0.2 to 0.4 dB', () => {
    // Source: the fact of the trade above: two banks of three 8 ohm drivers are 5.33 ohm, so
    // 0.2299 ohm of cable takes 100·0.2299/5.563 = 4.13 %. With the volume fixed the speaker's
    // voltage falls by Z/(Z + R), so its level by at most 20·log10(5.333/5.563) = 0.37 dB, and by
    // at least the cable's own power share, 10·log10 of it = 0.18 dB.
    const bare = variant(columnRig(), { temperatureC: 20 })
    const cabled = variant(bare, { speakerLeads: { areaMm2: 1.5, lengthM: 10 } })
    const without = estimate(bare)
    const withLeads = estimate(cabled)
    expect(without.speakerLeads).toEqual({ resistanceOhm: 0, lossPct: 0 })
    expect(withLeads.speakerLeads.resistanceOhm).toBeCloseTo(0.2299, 4)
    expect(withLeads.speakerLeads.lossPct).toBeCloseTo(4.13, 2)
    // The load the amplifier's minimum is checked against stays the speakers' own.
    expect(withLeads.loadOhm).toBeCloseTo(16 / 3, 9)
    const dropDb = without.splDb!.average - withLeads.splDb!.average
    expect(dropDb).toBeGreaterThan(0.18)
    expect(dropDb).toBeLessThanOrEqual(0.37)
  })

  it('refuses a lead with two sizes or none, naming the field', () => {
    // Source: the request contract: exactly one of awg and areaMm2
    const parsed = estimateRequestSchema.safeParse({
      ...columnRig(),
      speakerLeads: { awg: 16, areaMm2: 1.5, lengthM: 10 },
    })
    expect(parsed.success).toBe(false)
    expect(parsed.error?.issues[0]?.path).toEqual(['speakerLeads', 'awg'])
    expect(parsed.error?.issues[0]?.message).toMatch(
      /speaker lead wire gauge \(AWG\) or the speaker lead wire area/,
    )
    const tooLong = estimateRequestSchema.safeParse({
      ...columnRig(),
      speakerLeads: { areaMm2: 1.5, lengthM: 2000 },
    })
    expect(tooLong.error?.issues[0]?.path).toEqual(['speakerLeads', 'lengthM'])
  })
})
