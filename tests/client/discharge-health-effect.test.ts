import { flushPromises, mount } from '@vue/test-utils'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h, ref } from 'vue'
import DischargeHealthEffect from '@/components/discharge/DischargeHealthEffect.vue'
import { useHealthEffect } from '@/composables/useHealthEffect'
import type { PackHealthEffect } from '@shared/discharge/health-effect'
import type { DischargeLogDetail } from '@shared/discharge/log'

// The pack page says, before a measured health figure is applied and after, which rigs and plans
// take it and which do not, and why.

vi.mock('@/api/dischargeLogs', () => ({ previewAcceptDischargeLog: vi.fn() }))
const api = await import('@/api/dischargeLogs')
const preview = vi.mocked(api.previewAcceptDischargeLog)
afterEach(() => preview.mockReset())

const effect: PackHealthEffect = {
  healthPct: 87.3,
  fromHealthPct: null,
  rigs: {
    changing: [
      { id: 1, name: 'Market stage column', fromHealthPct: null },
      { id: 2, name: 'Busking column', fromHealthPct: 92 },
    ],
    keeping: [
      {
        id: 3,
        name: 'Column on other cells',
        reason: { kind: 'copy-differs', fields: ['cellCapacityAh', 'cutoffCellV'] },
      },
      { id: 4, name: 'Spare column', reason: { kind: 'other-pack', packId: 9, packName: 'Spare' } },
      { id: 5, name: 'Sports day column', reason: { kind: 'no-saved-pack' } },
      { id: 6, name: 'Twin column', reason: { kind: 'same-health' } },
    ],
  },
  plans: {
    changing: [{ id: 11, name: 'Market Saturday', rigId: 1, rigName: 'Market stage column' }],
    keeping: [
      { id: 12, name: 'School sports day', rigId: 5, rigName: 'Sports day column' },
      { id: 13, name: 'Sports day, far field', rigId: 5, rigName: 'Sports day column' },
    ],
  },
}

const mountEffect = (props: Partial<InstanceType<typeof DischargeHealthEffect>['$props']>) =>
  mount(DischargeHealthEffect, { props: { effect, applied: false, error: undefined, ...props } })

describe('what applying a measured health changes', () => {
  it('lists the rigs that will take it and those that will not, each with the reason', () => {
    const panel = mountEffect({})
    expect(panel.get('h3').text()).toBe('What applying it changes')
    expect(panel.text()).toContain('These rigs will use the measured health:')
    const taking = panel.get('[data-testid="health-effect-taking"]').findAll('li')
    expect(taking.map((item) => item.text())).toEqual([
      'Market stage column (now as labelled)',
      'Busking column (now 92.0\u00a0%)',
    ])
    expect(panel.text()).toContain('These will not:')
    const keeping = panel.get('[data-testid="health-effect-keeping"]').findAll('li')
    expect(keeping.map((item) => item.text())).toEqual([
      // The pack form's own labels for the fields that differ.
      'Column on other cells, because it has its own copy of the pack, which differs in cell capacity, cutoff voltage per cell: the log was read against the pack as saved.',
      'Twin column, because it already uses this figure.',
      'Spare column (on "Spare"), Sports day column, because they use other packs.',
    ])
    const plans = panel.get('[data-testid="health-effect-plans"]').findAll('li')
    expect(plans.map((item) => item.text())).toEqual(['Market Saturday (rig Market stage column)'])
    expect(panel.get('[data-testid="health-effect-kept-plans"]').text()).toBe(
      '2 plans keep their figures, because their rigs keep their own: School sports day, Sports day, far field.',
    )
  })

  it('says the same in the past once the figure was applied', () => {
    const panel = mountEffect({ applied: true })
    expect(panel.get('h3').text()).toBe('What applying it changed')
    expect(panel.text()).toContain('These rigs now use the measured health:')
    expect(panel.text()).toContain('Market stage column (was as labelled)')
    expect(panel.text()).toContain('These did not:')
  })

  it('says when no rig takes the figure, and names one kept plan alone', () => {
    const panel = mountEffect({
      effect: {
        ...effect,
        rigs: { changing: [], keeping: [effect.rigs.keeping[1]!] },
        plans: { changing: [], keeping: [effect.plans.keeping[0]!] },
      },
    })
    expect(panel.get('[data-testid="health-effect-taking"]').text()).toBe(
      'No rig will take the figure: only the pack gets it.',
    )
    expect(panel.text()).toContain('Spare column (on "Spare"), because it uses another pack.')
    expect(panel.find('[data-testid="health-effect-plans"]').exists()).toBe(false)
    expect(panel.get('[data-testid="health-effect-kept-plans"]').text()).toBe(
      'The plan School sports day keeps its figures, because its rig keeps its own.',
    )
  })

  it("shows the server's reason when the log gives no figure, and waits politely otherwise", () => {
    const refused = mountEffect({ effect: undefined, error: 'The log ends above the cutoff.' })
    expect(refused.text()).toContain('The log ends above the cutoff.')
    const waiting = mountEffect({ effect: undefined })
    expect(waiting.text()).toContain('Looking up the rigs and plans…')
    expect(waiting.get('section').attributes('aria-live')).toBe('polite')
  })
})

describe('asking what a log would change', () => {
  const logOf = (id: number, reachedCutoff = true) => ({ id, reachedCutoff }) as DischargeLogDetail

  function harness() {
    const selected = ref<DischargeLogDetail | undefined>()
    let state!: ReturnType<typeof useHealthEffect>
    mount(
      defineComponent({
        setup() {
          state = useHealthEffect(() => ({ team: 1, pack: 2 }), selected)
          return () => h('div')
        },
      }),
    )
    return { selected, state: () => state }
  }

  it('asks for the log on show, and drops an answer for a log no longer on show', async () => {
    let answerFirst!: (value: PackHealthEffect) => void
    preview.mockImplementationOnce(() => new Promise((resolve) => (answerFirst = resolve)))
    preview.mockResolvedValueOnce({ ...effect, healthPct: 90 })
    const { selected, state } = harness()
    selected.value = logOf(7)
    await flushPromises()
    selected.value = logOf(8)
    await flushPromises()
    answerFirst(effect)
    await flushPromises()
    expect(preview.mock.calls).toEqual([
      [1, 2, 7],
      [1, 2, 8],
    ])
    expect(state().effect.value?.healthPct).toBe(90)
  })

  it('asks nothing for a log that stops above its cutoff, and shows what an accept did', async () => {
    const { selected, state } = harness()
    selected.value = logOf(9, false)
    await flushPromises()
    expect(preview).not.toHaveBeenCalled()
    expect(state().effect.value).toBeUndefined()
    state().showApplied(effect)
    expect(state().applied.value).toBe(true)
    expect(state().effect.value).toEqual(effect)
  })
})
