import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import PlanVerdictStrip from '@/components/plan/PlanVerdictStrip.vue'

// The phone's strip under a plan: the day's answer on the event clock, and the swap times.

describe('the plan verdict strip', () => {
  it('says the day lasts to its end and when to swap', () => {
    // Source: clock arithmetic: 08:00 plus 360 minutes is 14:00.
    const strip = mount(PlanVerdictStrip, {
      props: {
        schedule: {
          lasts: true,
          packsUsed: 2,
          swaps: [],
          totalMinutes: 360,
          stoppedAtMinute: null,
          segments: [],
          endSocPct: 40,
          sparePacks: 0,
        },
        swaps: [{ atTime: '11:00' }],
        startTime: '08:00',
      },
    })
    expect(strip.text()).toContain('Lasts the day, to 14:00.')
    expect(strip.text()).toContain('Swap at 11:00.')
    expect(strip.get('a').attributes('href')).toBe('#plan-results')
  })

  it('says when the sound stops on a day that does not last', () => {
    // Source: clock arithmetic: 08:00 plus 240 minutes is 12:00, two hours before 14:00.
    const strip = mount(PlanVerdictStrip, {
      props: {
        schedule: {
          lasts: false,
          packsUsed: 1,
          swaps: [],
          totalMinutes: 360,
          stoppedAtMinute: 240,
          segments: [],
          endSocPct: 0,
          sparePacks: 0,
        },
        swaps: [],
        startTime: '08:00',
      },
    })
    expect(strip.text()).toContain('Does not last: the sound stops at 12:00')
    expect(strip.text()).toContain('before 14:00')
    expect(strip.text()).not.toContain('Swap at')
  })
})
