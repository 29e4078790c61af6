import type { AirlineClass } from '../schemas/estimate'

/** Nominal energy = nominal V × rated Ah, the figure airline rules use (docs/model.md §1). */
export function nominalWh(nominalV: number, ratedCapacityAh: number): number {
  return nominalV * ratedCapacityAh
}

/** IATA Dangerous Goods Regulations (lithium batteries): ≤ 100 Wh carry-on, over 100 and up to
 *  160 Wh with the airline's approval, over 160 Wh not in passenger baggage. */
export function airlineClass(packNominalWh: number, isLithium: boolean): AirlineClass {
  // The Wh classes are the lithium battery rules; other chemistries fall under other rules.
  if (!isLithium) return 'not-lithium'
  if (packNominalWh <= 100) return 'up-to-100wh'
  if (packNominalWh <= 160) return '100-to-160wh'
  return 'over-160wh'
}
