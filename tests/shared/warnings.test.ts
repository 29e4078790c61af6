import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { WARNING_CATALOGUE } from '../../shared/engine/warnings'
import type { WarningCode } from '../../shared/engine/warnings'
import type { EstimateRequest } from '../../shared/schemas/estimate'
import { columnRig, variant } from './rig-fixtures'

function warningFor(request: EstimateRequest, code: WarningCode) {
  return estimate(request).warnings.find((warning) => warning.code === code)
}

describe('warnings', () => {
  it('use stable kebab-case codes with a severity', () => {
    // Source: docs/model.md §9: codes stable, kebab-case
    for (const [code, entry] of Object.entries(WARNING_CATALOGUE)) {
      expect(code).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/)
      expect(['info', 'caution', 'danger']).toContain(entry.severity)
    }
  })

  it('warn when the load is below the amplifier minimum', () => {
    // Source: common practice: 3 × 8 ohm in parallel is 2.67 ohm, below a 4 ohm minimum
    const rig = columnRig()
    const found = warningFor(
      variant(rig, { speakers: { driverOhm: 8, parallel: 3, banks: 1 } }),
      'load-below-minimum',
    )
    expect(found?.severity).toBe('danger')
    expect(found?.message).toMatch(/2\.67 ohm/)
    expect(found?.message).toMatch(/fewer drivers in parallel|more banks in series/)
  })

  it('warn when a full pack is above the maximum supply', () => {
    // Source: common practice: 6 li-ion cells in series are 25.2 V full, above a 24 V maximum
    const rig = columnRig()
    const found = warningFor(
      variant(rig, {
        pack: { ...rig.pack, seriesCells: 6 },
        amplifier: { ...rig.amplifier, supplyMaxV: 24 },
      }),
      'supply-over-max',
    )
    expect(found?.message).toMatch(/25\.2 V/)
    expect(found?.message).toMatch(/fewer cells in series/)
  })

  it('warn when the lock-out strands energy above the pack cutoff', () => {
    // Source: docs/model.md §4: below the lock-out the amplifier mutes; a 17 V lock-out on a pack that
    // cuts off at 15 V (common practice: 5 × 3.0 V) leaves charge unused
    const rig = columnRig()
    const found = warningFor(
      variant(rig, { amplifier: { ...rig.amplifier, lockoutV: 17 } }),
      'lockout-above-cutoff',
    )
    expect(found?.message).toMatch(/stranded/)
    expect(found?.message).toMatch(/more cells in series|lower lock-out/)
  })

  it('warn when the draw exceeds the pack rating', () => {
    // Source: product cautions: do not exceed the pack's discharge rating
    const rig = columnRig()
    const request = variant(rig, {
      pack: { ...rig.pack, maxDischargeA: 1 },
      programme: { crestFactorDb: 9, peakBelowClipDb: 0 },
    })
    expect(warningFor(request, 'current-over-rating')?.severity).toBe('danger')
    // A pack's protection trips on a current over its rating whether it is steady or a bass
    // note's peak (common practice: BMS over-current trips act within milliseconds), so the
    // peaks alone are a danger too.
    const peaksOnly = variant(rig, { pack: { ...rig.pack, maxDischargeA: 2.5 } })
    expect(warningFor(peaksOnly, 'peak-current-over-rating')?.severity).toBe('danger')
  })

  it('warn when the lead carries more than a cord of its size is rated for, naming the size', () => {
    // Source: IEC 60335-1 Table 11 (from memory): 16 AWG (1.3 mm²) is rated 10 A, far more than
    // this rig's ampere or so; 26 AWG (0.13 mm², far below the table's 0.5 mm² for 3 A) is not.
    const rig = columnRig()
    const loud = { programme: { crestFactorDb: 9, peakBelowClipDb: 0 } }
    const thin = estimate(variant(rig, { leads: { awg: 26, lengthM: 1 }, ...loud }))
    const found = thin.warnings.find((warning) => warning.code === 'lead-over-rating')
    expect(found?.severity).toBe('danger')
    expect(thin.averageCurrentA).toBeGreaterThan(0.8)
    expect(found?.message).toMatch(/at least \d+(\.\d+)? mm² \(\d+ AWG\)/)
    expect(found?.message).toMatch(/fuse/)
    expect(
      warningFor(variant(rig, { leads: { awg: 16, lengthM: 1 }, ...loud }), 'lead-over-rating'),
    ).toBeUndefined()
  })

  it('warn when the lead drops more than 3 %', () => {
    // Source: common practice: keep DC supply leads under 3 % drop; 26 AWG over 5 m is about
    // 1.4 ohm round trip (ASTM B258, IEC 60028)
    const rig = columnRig()
    const found = warningFor(
      variant(rig, {
        leads: { awg: 26, lengthM: 5 },
        programme: { crestFactorDb: 9, peakBelowClipDb: 0 },
      }),
      'lead-drop-high',
    )
    expect(found?.message).toMatch(/thicker or shorter lead/)
  })

  it('warn when the pack is cold, and never to charge lithium below 0 °C', () => {
    // Source: from memory: makers forbid charging li-ion below 0 °C; capacity falls in the cold
    const found = warningFor(variant(columnRig(), { temperatureC: -5 }), 'cold-pack')
    expect(found?.message).toMatch(/below 0 °C/)
  })

  it('always carry the usual lithium cautions', () => {
    // Source: product cautions: fuse the lead near the pack; lithium is a fire risk when abused
    expect(warningFor(columnRig(), 'lithium-safety')?.message).toMatch(/fuse the lead/)
  })

  it('say what to change in every message of a troubled rig', () => {
    // Source: docs/model.md §9: messages say what to change
    const rig = columnRig()
    const result = estimate(
      variant(rig, {
        pack: { ...rig.pack, seriesCells: 6, maxDischargeA: 1 },
        leads: { awg: 26, lengthM: 5 },
        amplifier: { ...rig.amplifier, supplyMaxV: 24, lockoutV: 19 },
        speakers: { driverOhm: 8, parallel: 3, banks: 1, sensitivityDb: 92 },
        programme: { crestFactorDb: 9, peakBelowClipDb: 0 },
        schedule: [{ label: 'All day', minutes: 600 }],
        temperatureC: -5,
      }),
    )
    expect(result.warnings.length).toBeGreaterThan(6)
    const actionWords =
      /\b(ask|use|lower|fit|wire|bring|keep|enter|check|measure|move|charge|ship|swap|watch|add|follow|stay|fuse|give)\b/i
    for (const warning of result.warnings) {
      expect(warning.message, warning.code).toMatch(actionWords)
      expect(WARNING_CATALOGUE[warning.code as WarningCode].severity).toBe(warning.severity)
    }
  })
})

describe('warning documentation', () => {
  it('lists every code with its severity and meaning in docs/estimate-api.md', () => {
    // Source: docs/model.md §9: document the rest in the project
    const docs = readFileSync(new URL('../../docs/estimate-api.md', import.meta.url), 'utf8')
    for (const [code, entry] of Object.entries(WARNING_CATALOGUE)) {
      expect(docs, code).toContain(`| \`${code}\` | ${entry.severity} | ${entry.meaning} |`)
    }
  })
})
