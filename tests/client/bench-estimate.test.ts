import { beforeEach, describe, expect, it, vi } from 'vitest'
import { useRigDraftStore } from '@/stores/rigDraft'
import { flushPromises } from '@vue/test-utils'
import { benchTestTimeoutMs, mountBench, typeInto } from './bench-helpers'
import { minutesOfRuntimeText } from '../helpers/runtime-text'
import { engineSpy } from './engine-spy'

// Counts engine runs while the whole bench (a dozen panels reading the result) is on screen.
vi.mock('../../shared/engine', async (original) =>
  (await import('./engine-spy')).spiedEngine(original),
)

beforeEach(() => localStorage.clear())

describe('the live estimate', { timeout: benchTestTimeoutMs }, () => {
  it('runs the engine once per change, however many panels show the result', async () => {
    const wrapper = await mountBench()
    expect(engineSpy.runs).toBe(1)
    await typeInto(wrapper, 'programme.peakBelowClipDb', '4')
    expect(engineSpy.runs).toBe(2)
    await typeInto(wrapper, 'pack.count', '3')
    expect(engineSpy.runs).toBe(3)
    wrapper.unmount()
  })

  it('does not run the engine on a draft the schema refuses', async () => {
    const wrapper = await mountBench()
    const runsBefore = engineSpy.runs
    useRigDraftStore().draft.pack.parallelCells = 0
    await flushPromises()
    expect(engineSpy.runs).toBe(runsBefore)
    wrapper.unmount()
  })

  it('shows the runtime with its stop reason, and updates it when the level changes', async () => {
    const wrapper = await mountBench()
    const before = minutesOfRuntimeText(wrapper.get('[data-testid="runtime"]').text())
    expect(wrapper.get('[data-testid="stop-reason"]').text().length).toBeGreaterThan(10)
    // Definition of the decibel: 10 dB further below clipping is a tenth of the average output
    // power, so the same charge must last longer.
    await typeInto(wrapper, 'programme.peakBelowClipDb', '12')
    const after = minutesOfRuntimeText(wrapper.get('[data-testid="runtime"]').text())
    expect(after).toBeGreaterThan(before)
    // The charts arrive in their own chunk.
    const chart = await vi.waitFor(() => wrapper.get('[data-testid="chart-discharge"]'), {
      timeout: 10_000,
    })
    const points = JSON.parse(chart.attributes('data-points')!) as {
      datasets: { data: { x: number }[] }[]
    }
    expect(points.datasets[0]!.data.length).toBeGreaterThan(10)
    wrapper.unmount()
  })

  it('says what must change before the runtime when the rig has a danger', async () => {
    const wrapper = await mountBench()
    expect(wrapper.find('[data-testid="must-change"]').exists()).toBe(false)
    // Source: common practice: a li-ion pack straight off the charger reads 4.20 V per cell, so
    // seven in series (29.4 V) are over the starting board's 26 V maximum supply: a danger.
    useRigDraftStore().draft.pack.seriesCells = 7
    await flushPromises()
    const first = wrapper.get('[data-testid="must-change"]').text()
    expect(first).toMatch(/must change before this rig is used/)
    expect(first).toMatch(/29\.4 V, above the amplifier's maximum supply of 26\.0 V/)
    expect(wrapper.get('[data-testid="runtime-not-valid"]').text()).toMatch(/Not valid/)
    const headline = wrapper.get('[data-testid="runtime-headline"]').html()
    expect(headline.indexOf('must-change')).toBeLessThan(headline.indexOf('data-testid="runtime"'))
    wrapper.unmount()
  })
})
