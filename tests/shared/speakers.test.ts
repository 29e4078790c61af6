import { describe, expect, it } from 'vitest'
import { driversPerChannel, loadOhm, powerPerDriverW } from '../../shared/engine/speakers'

describe('speaker loads', () => {
  it('puts 3 × 8 ohm in parallel at 2.67 ohm and two such banks in series at 5.33 ohm', () => {
    // Source: common practice (facts of the trade); equal resistors in parallel divide, in series add
    expect(loadOhm({ driverOhm: 8, parallel: 3, banks: 1 })).toBeCloseTo(2.667, 3)
    expect(loadOhm({ driverOhm: 8, parallel: 3, banks: 2 })).toBeCloseTo(5.333, 3)
  })

  it('makes four 8 ohm drivers in series-parallel an 8 ohm load', () => {
    // Source: common practice: 2 × 2 series-parallel keeps the driver impedance
    expect(loadOhm({ driverOhm: 8, parallel: 2, banks: 2 })).toBe(8)
  })

  it('shares the channel power equally between identical drivers', () => {
    // Source: docs/model.md §3: power per driver = channel power / driver count
    const wiring = { driverOhm: 8, parallel: 3, banks: 2 }
    expect(driversPerChannel(wiring)).toBe(6)
    expect(powerPerDriverW(30, wiring)).toBe(5)
  })
})
