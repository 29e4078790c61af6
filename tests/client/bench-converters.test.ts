import { describe, expect, it } from 'vitest'
import { benchTestTimeoutMs, mountBench } from './bench-helpers'

describe('the accessory supply panel', { timeout: benchTestTimeoutMs }, () => {
  it('reads a fitted converter as done, not as a job still to do', async () => {
    const wrapper = await mountBench()
    // The starting rig feeds a 5 V USB receiver from an 18 V (5S li-ion) pack through a
    // step-down converter. Source: common practice: 15–21 V is above a 5 V input the whole
    // time, so a buck converter is what fits.
    const fitted = wrapper.get('[data-testid="converter-0"]').text()
    expect(fitted).toContain('Bluetooth receiver')
    expect(fitted).toContain('Converter fitted: done')
    expect(fitted).toContain('Nothing to fit')
    expect(fitted).not.toContain('Fit a step-down')
    wrapper.unmount()
  })
})
