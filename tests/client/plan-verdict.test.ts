import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import PlanVerdict from '@/components/plan/PlanVerdict.vue'
import { estimate } from '../../shared/engine'
import { columnRig, variant } from '../shared/rig-fixtures'

// The plan's verdict: what must change comes before whether the day lasts.

const verdictFor = (request: ReturnType<typeof columnRig>) =>
  mount(PlanVerdict, {
    props: { result: estimate(request), swaps: [], startTime: '08:00', chemistry: 'li-ion' },
  })

describe('the plan verdict', () => {
  it('puts the dangers first and marks the day as not valid until they are fixed', () => {
    // Source: common practice: 5 li-ion cells straight off the charger are 5 × 4.20 = 21.0 V,
    // above a 20 V maximum supply.
    const rig = columnRig()
    const request = variant(rig, {
      amplifier: { ...rig.amplifier, ratedSupplyV: 18, supplyMaxV: 20 },
      schedule: [{ label: 'Set', minutes: 60 }],
    })
    const wrapper = verdictFor(request)
    const mustChange = wrapper.get('[data-testid="plan-must-change"]')
    expect(mustChange.text()).toMatch(/21\.0 V, above the amplifier's maximum supply of 20\.0 V/)
    expect(wrapper.get('[data-testid="plan-lasts"]').text()).toMatch(/Not valid until/)
    const html = wrapper.html()
    expect(html.indexOf('plan-must-change')).toBeLessThan(html.indexOf('plan-lasts'))
  })

  it("says a charging break below 0 °C gives no charge, on the plan's clock", () => {
    // Source: common practice (makers' datasheets): never charge lithium below 0 °C. The plan
    // starts at 08:00 and breaks to charge after an hour's set: at 09:00.
    const request = variant(columnRig(), {
      temperatureC: -5,
      schedule: [
        { label: 'Set', minutes: 60 },
        { label: 'Car charger', minutes: 30, state: 'charging', chargeW: 40 },
        { label: 'Set', minutes: 60 },
      ],
    })
    const refused = verdictFor(request).get(
      '[data-testid="plan-warning-charge-temperature-out-of-range"]',
    )
    expect(refused.text()).toMatch(/The charging break at about 09:00 gives it no charge/)
    expect(refused.text()).toMatch(/bring a charged pack instead/)
  })

  it('shows the day alone when nothing must change', () => {
    // Source: the column rig's 26 V maximum is above its 21.0 V pack off the charger.
    const request = variant(columnRig(), { schedule: [{ label: 'Set', minutes: 60 }] })
    const wrapper = verdictFor(request)
    expect(wrapper.find('[data-testid="plan-must-change"]').exists()).toBe(false)
    expect(wrapper.get('[data-testid="plan-lasts"]').text()).not.toMatch(/Not valid/)
  })
})
