// The amplifier with its defaults: the THD of its rating, its lock-out, idle draw, efficiency by
// class and minimum load (docs/model.md §4).
import type { EstimateRequest } from '../schemas/estimate'
import {
  DEFAULT_CLASS_A_EFFICIENCY,
  DEFAULT_CLASS_AB_IDLE_CURRENT_A,
  DEFAULT_CLASS_D_EFFICIENCY,
  DEFAULT_IDLE_CURRENT_A,
  DEFAULT_RATED_THD_PCT,
} from './amplifier'
import type { DefaultPicker } from './resolve-assumed'
import type { ResolvedRequest } from './resolve'

type AmplifierSpec = EstimateRequest['amplifier']

export function resolveAmplifier(
  amplifier: AmplifierSpec,
  pick: DefaultPicker,
): ResolvedRequest['amplifier'] {
  const supplyMinV = amplifier.supplyMinV ?? null
  return {
    ampClass: amplifier.class,
    bridged: amplifier.bridged,
    channels: amplifier.channels,
    ratedPowerW: amplifier.ratedPowerW,
    ratedLoadOhm: amplifier.ratedLoadOhm,
    ratedSupplyV: amplifier.ratedSupplyV,
    ratedThdPct: pick(
      amplifier.ratedThdPct,
      'amplifier.ratedThdPct',
      DEFAULT_RATED_THD_PCT,
      'common practice: headline ratings are usually 10 % THD figures',
    ),
    supplyMinV,
    supplyMaxV: amplifier.supplyMaxV ?? null,
    // Not given: none taken, the safe side for dropouts (a bass note outlasts the capacitors).
    bulkCapacitanceF: (amplifier.bulkCapacitanceUF ?? 0) * 1e-6,
    lockoutV: amplifier.lockoutV ?? lockoutFromSupplyRangeV(supplyMinV, pick),
    idleCurrentA: idleCurrentA(amplifier, pick),
    efficiency: efficiency(amplifier, pick),
    efficiencyGiven: amplifier.efficiency !== undefined,
    minLoadOhm: pick(
      amplifier.minLoadOhm,
      'amplifier.minLoadOhm',
      amplifier.ratedLoadOhm,
      'common practice: the rated load is taken as the lowest the maker supports',
    ),
  }
}

/** No lock-out given: the bottom of the supply range, where there is one. */
function lockoutFromSupplyRangeV(supplyMinV: number | null, pick: DefaultPicker): number | null {
  if (supplyMinV === null) return null
  return pick(
    undefined,
    'amplifier.lockoutV',
    supplyMinV,
    'common practice: the lock-out sits at the bottom of the supply range',
  )
}

function idleCurrentA(amplifier: AmplifierSpec, pick: DefaultPicker): number {
  if (amplifier.class === 'a') return 0 // class A: its bias current is its idle draw
  const ab = amplifier.class === 'ab'
  return pick(
    amplifier.idleCurrentA,
    'amplifier.idleCurrentA',
    ab ? DEFAULT_CLASS_AB_IDLE_CURRENT_A : DEFAULT_IDLE_CURRENT_A,
    ab
      ? 'from memory: class AB power chips idle at 0.1–0.25 A'
      : 'from memory: small class D boards idle at 20–80 mA',
  )
}

function efficiency(amplifier: AmplifierSpec, pick: DefaultPicker): number {
  // Class AB efficiency follows from the supply and the swing (docs/estimate-api.md).
  if (amplifier.class === 'ab') return 1
  const classA = amplifier.class === 'a'
  return pick(
    amplifier.efficiency,
    'amplifier.efficiency',
    classA ? DEFAULT_CLASS_A_EFFICIENCY : DEFAULT_CLASS_D_EFFICIENCY,
    classA
      ? 'Boylestad & Nashelsky ch. 12: series-fed class A at most 25 %'
      : 'from memory: small class D boards convert about 88 % at useful output',
  )
}
