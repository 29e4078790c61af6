import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine/estimate'
import { estimateRequestSchema, estimateResultSchema } from '../../shared/schemas/estimate'
import { columnRig } from './rig-fixtures'

// Source for every check here: docs/model.md §9 (the contract): reject what is not
// physical, with a message that names the field in plain words.
function issuesFor(change: (request: Record<string, unknown>) => void) {
  const request = structuredClone(columnRig()) as unknown as Record<string, unknown>
  change(request)
  const parsed = estimateRequestSchema.safeParse(request)
  return parsed.success ? [] : parsed.error.issues
}

const pack = (request: Record<string, unknown>) => request.pack as Record<string, unknown>
const amplifier = (request: Record<string, unknown>) => request.amplifier as Record<string, unknown>

describe('estimate request schema', () => {
  it('accepts a sound rig and keeps the contract names', () => {
    const parsed = estimateRequestSchema.parse(columnRig())
    expect(Object.keys(parsed.pack)).toEqual(
      expect.arrayContaining(['chemistry', 'seriesCells', 'parallelCells', 'cellCapacityAh']),
    )
    expect(parsed.amplifier.class).toBe('d')
  })

  // Source: RFC 5322 §2.2 (a CR or LF ends a header line) and Unicode's C0 controls U+0000–U+001F:
  // a name is one line of plain text wherever it is shown, printed or mailed.
  it.each(['Main\npack', 'Main\rpack', 'Main\u0000', 'Main\tpack'])(
    'refuses a control character in a pack name (%j), naming the field',
    (label) => {
      const issues = issuesFor((request) => (pack(request).label = label))
      expect(issues.map((issue) => issue.path)).toEqual([['pack', 'label']])
      expect(issues[0]?.message).toBe(
        'Pack name: use no line breaks, tabs or other control characters',
      )
    },
  )

  it.each([0, -1, 1.5, 101])('rejects %s cells in series with a plain message', (value) => {
    const issues = issuesFor((request) => (pack(request).seriesCells = value))
    expect(issues[0]?.path).toEqual(['pack', 'seriesCells'])
    expect(issues[0]?.message).toBe('Cells in series must be a whole number from 1 to 100')
  })

  it.each([0, -2, Number.NaN, Number.POSITIVE_INFINITY, 5000])(
    'rejects a cell capacity of %s',
    (value) => {
      const issues = issuesFor((request) => (pack(request).cellCapacityAh = value))
      expect(issues[0]?.path).toEqual(['pack', 'cellCapacityAh'])
      expect(issues[0]?.message).toMatch(/^Cell capacity must be more than 0/)
    },
  )

  it('rejects a text where a number belongs', () => {
    const issues = issuesFor((request) => (pack(request).parallelCells = '2'))
    expect(issues[0]?.message).toMatch(/Cells in parallel/)
  })

  it.each([0, 1.2, -0.5])('rejects an efficiency of %s outside (0, 1]', (value) => {
    const issues = issuesFor((request) => (amplifier(request).efficiency = value))
    expect(issues[0]?.path).toEqual(['amplifier', 'efficiency'])
    expect(issues[0]?.message).toBe(
      'Amplifier efficiency must be more than 0 and at most 1 (1 is 100 %)',
    )
  })

  it('accepts an efficiency of exactly 1', () => {
    expect(issuesFor((request) => (amplifier(request).efficiency = 1))).toEqual([])
  })

  it('rejects unknown chemistry and class', () => {
    expect(issuesFor((request) => (pack(request).chemistry = 'sodium'))[0]?.message).toMatch(
      /^Chemistry must be one of: li-ion, lifepo4, lead-acid, nimh/,
    )
    expect(issuesFor((request) => (amplifier(request).class = 'h'))[0]?.message).toMatch(
      /^Amplifier class must be one of: d, ab, a/,
    )
  })

  it('rejects a zero driver impedance', () => {
    const issues = issuesFor(
      (request) => ((request.speakers as Record<string, unknown>).driverOhm = 0),
    )
    expect(issues[0]?.path).toEqual(['speakers', 'driverOhm'])
    expect(issues[0]?.message).toMatch(/^Driver impedance/)
  })

  it('rejects a cutoff at or above the full-charge voltage', () => {
    // Source: common practice: a li-ion cell is full at 4.2 V
    const issues = issuesFor((request) => (pack(request).cutoffCellV = 4.3))
    expect(issues[0]?.path).toEqual(['pack', 'cutoffCellV'])
    expect(issues[0]?.message).toMatch(/below the full-charge voltage/)
  })

  it('rejects a lock-out above the maximum supply and a minimum above the maximum', () => {
    const lockout = issuesFor((request) => (amplifier(request).lockoutV = 30))
    expect(lockout.map((issue) => issue.path.join('.'))).toContain('amplifier.lockoutV')
    expect(lockout[0]?.message).toMatch(/^Lock-out \(undervoltage mute\) voltage must be below/)
    const range = issuesFor((request) => {
      amplifier(request).supplyMinV = 30
      amplifier(request).supplyMaxV = 20
    })
    expect(range.map((issue) => issue.message)).toContain(
      'Minimum supply voltage must not be above the maximum supply voltage',
    )
  })

  it('asks for exactly one wire size on the lead', () => {
    const both = issuesFor((request) => (request.leads = { awg: 16, areaMm2: 1.5, lengthM: 1 }))
    expect(both[0]?.path).toEqual(['leads', 'awg'])
    const neither = issuesFor((request) => (request.leads = { lengthM: 1 }))
    expect(neither[0]?.message).toBe(
      'Give either the lead wire gauge (AWG) or the lead wire area (mm²), exactly one of them',
    )
    expect(issuesFor((request) => (request.leads = { areaMm2: 1.5, lengthM: 1 }))).toEqual([])
  })

  it('rejects an accessory whose converter output lies outside its input range', () => {
    const issues = issuesFor((request) => {
      request.accessories = [
        {
          label: 'Receiver',
          powerW: 2,
          inputMinV: 4.75,
          inputMaxV: 5.25,
          feed: 'buck',
          outputV: 12,
        },
      ]
    })
    expect(issues[0]?.path).toEqual(['accessories', 0, 'outputV'])
    expect(issues[0]?.message).toMatch(/Receiver/)
  })

  it('limits a schedule to 7 days and segments to positive lengths', () => {
    expect(
      issuesFor(
        (request) =>
          (request.schedule = [
            { label: 'Week', minutes: 6000 },
            { label: 'More', minutes: 6000 },
          ]),
      )[0]?.message,
    ).toMatch(/at most 7 days/)
    expect(
      issuesFor((request) => (request.schedule = [{ label: 'None', minutes: 0 }]))[0]?.path,
    ).toEqual(['schedule', 0, 'minutes'])
  })

  it('rejects a request that is not an object', () => {
    const parsed = estimateRequestSchema.safeParse(null)
    expect(parsed.success).toBe(false)
    expect(parsed.error?.issues[0]?.message).toMatch(/must be a JSON object/)
  })

  it('applies no defaults: the engine lists what it assumed', () => {
    const parsed = estimateRequestSchema.parse(columnRig())
    expect(parsed.pack.cellResistanceOhm).toBeUndefined()
    const result = estimate(parsed)
    expect(result.assumed.map((entry) => entry.field)).toEqual(
      expect.arrayContaining(['pack.cellResistanceOhm', 'amplifier.efficiency', 'temperatureC']),
    )
    // docs/model.md §4: class D efficiency 0.88 by default
    expect(result.assumed.find((entry) => entry.field === 'amplifier.efficiency')?.value).toBe(0.88)
    for (const entry of result.assumed) expect(entry.source.length).toBeGreaterThan(0)
  })
})

describe('estimate result schema', () => {
  it('describes what the engine returns', () => {
    const result = estimate(columnRig())
    expect(estimateResultSchema.parse(result)).toEqual(result)
  })
})

describe('drivers facing the listener', () => {
  it('refuses more than the rig has, naming the field', () => {
    // Source: docs/estimate-api.md: facingListener counts drivers of all channels, so 2 channels
    // of 3 × 2 drivers are 12 at most.
    const rig = columnRig()
    const result = estimateRequestSchema.safeParse({
      ...rig,
      speakers: { ...rig.speakers, facingListener: 13 },
    })
    expect(result.success).toBe(false)
    expect(result.error!.issues.map((issue) => issue.path.join('.'))).toEqual([
      'speakers.facingListener',
    ])
    const twelve = { ...rig, speakers: { ...rig.speakers, facingListener: 12 } }
    expect(estimateRequestSchema.safeParse(twelve).success).toBe(true)
  })
})
