// The usual cautions (README "Cautions"), worded for the crew on
// the day and filled in with this rig's figures. They defer to local codes and licensed practice.
import { CHEMISTRY_DATA } from '../engine/chemistry'
import { CHILDREN_CAUTION_DB, NIOSH_REL_DBA } from '../engine/sound'
import type { EstimateRequest, EstimateResult } from '../schemas/estimate'
import type { CardCaution } from './model'
import { durationWords, figure } from './format'

function hearing(request: EstimateRequest, result: EstimateResult): CardCaution {
  const exposure = result.exposure
  const loud = exposure !== undefined && exposure.levelDb > NIOSH_REL_DBA
  const aboveChildren = exposure !== undefined && exposure.levelDb > CHILDREN_CAUTION_DB
  const children = !request.childrenPresent
    ? ''
    : aboveChildren
      ? ` Children expected: ${Math.round(exposure.levelDb)} dB is above the ${CHILDREN_CAUTION_DB} dB aimed at for them, so keep them further back.`
      : ` Children expected: keep the level near them below about ${CHILDREN_CAUTION_DB} dB.`
  const permitted = loud
    ? ` At about ${Math.round(exposure.levelDb)} dB, keep anyone's time near the speakers under ${durationWords(exposure.permittedMinutes)} a day, or offer hearing protection.`
    : ''
  return {
    topic: 'hearing',
    title: 'Hearing',
    text: `Above ${NIOSH_REL_DBA} dBA, safe listening time halves with every 3 dB more.${permitted}${children} These are estimates: check with a sound level meter.`,
  }
}

function battery(request: EstimateRequest): CardCaution {
  const chemistry = request.pack.chemistry
  // The pack's own charge range (chemistry.ts, from makers' datasheets), where it has one.
  const range = CHEMISTRY_DATA[chemistry].chargeTemperatureC
  const within = range ? ` between ${range.minC} and ${range.maxC} °C,` : ''
  const charging = (request.schedule ?? []).some((segment) => segment.state === 'charging')
    ? ` Charging at a break: only${within} with the maker's charger, on a hard non-flammable surface, in sight, and never a damaged, hot or cold pack.`
    : ''
  const rating =
    (request.pack.maxDischargeA === undefined
      ? ''
      : ` Stay within its ${figure(request.pack.maxDischargeA)} A discharge rating.`) + charging
  if (CHEMISTRY_DATA[chemistry].isLithium) {
    return {
      topic: 'battery',
      title: 'Lithium packs',
      text: `A crushed, shorted, wet or hot pack can catch fire: move it outdoors, away from people. Never charge below 0 °C. Fuse close to the pack; cover spare packs' terminals.${rating}`,
    }
  }
  if (chemistry === 'lead-acid') {
    return {
      topic: 'battery',
      title: 'Lead-acid batteries',
      text: `They vent flammable gas while charging: charge where air moves, away from sparks. Fuse close to the battery; cover the terminals; carry it upright.${rating}`,
    }
  }
  return {
    topic: 'battery',
    title: 'Battery packs',
    text: `Fuse close to the pack; cover spare packs' terminals; keep packs dry and out of the sun.${rating}`,
  }
}

function wiring(result: EstimateResult): CardCaution {
  return {
    topic: 'wiring',
    title: 'Wiring',
    text: `Use the planned leads (peaks draw about ${figure(result.peakCurrentA)} A): thinner or longer ones drop voltage and heat up. Add no speakers: the load (${figure(result.speakers.loadOhm, 2)} ohm) must stay at or above the amplifier's minimum. Tape cables down or keep them out of walkways.`,
  }
}

export function cardCautions(request: EstimateRequest, result: EstimateResult): CardCaution[] {
  return [hearing(request, result), battery(request), wiring(result)]
}

export const CARD_DISCLAIMER =
  'Estimates, not measurements: check levels with a meter and packs before use, and follow local codes and licensed practice.'
