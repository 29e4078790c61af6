// The rig in one line, for people who carry it rather than build it.
import { CHEMISTRY_DATA } from '../engine/chemistry'
import type { EstimateRequest, EstimateResult } from '../schemas/estimate'
import { figure } from './format'

const amplifierClassWords: Record<EstimateRequest['amplifier']['class'], string> = {
  d: 'class D',
  ab: 'class AB',
  a: 'class A',
}

/**
 * "Crew tool pack: 36 V Li-ion, 10S2P, 5 Ah, 180 Wh": the label figures, not the day's usable
 * share (the runtime already counts the cold and the pack's health).
 */
export function packLine(request: EstimateRequest, result: EstimateResult): string {
  const { pack } = request
  // The chemistry's short name, without the cell families in brackets.
  const chemistry = CHEMISTRY_DATA[pack.chemistry].label.split(' (')[0]
  const figures = `${figure(result.pack.nominalV)} V ${chemistry}, ${pack.seriesCells}S${pack.parallelCells}P, ${figure(result.pack.ratedCapacityAh)} Ah, ${Math.round(result.pack.nominalWh)} Wh`
  return `${pack.label ?? 'Pack'}: ${figures}`
}

function amplifierWords(request: EstimateRequest): string {
  const { amplifier } = request
  const bridged = amplifier.bridged ? ' bridged' : ''
  return `${amplifierClassWords[amplifier.class]}${bridged} amplifier ${amplifier.channels} × ${figure(amplifier.ratedPowerW, 0)} W`
}

function speakerWords(request: EstimateRequest, result: EstimateResult): string {
  const { speakers } = request
  const drivers = speakers.parallel * speakers.banks
  const wiring =
    drivers === 1
      ? `one ${figure(speakers.driverOhm)} ohm driver`
      : `${drivers} × ${figure(speakers.driverOhm)} ohm drivers (${speakers.banks} in series, ${speakers.parallel} in parallel each)`
  return `${wiring} per channel, ${figure(result.speakers.loadOhm, 2)} ohm load`
}

export function rigLine(request: EstimateRequest, result: EstimateResult): string {
  const parts = [packLine(request, result), amplifierWords(request), speakerWords(request, result)]
  const accessories = request.accessories ?? []
  if (accessories.length > 0) parts.push(accessories.map((accessory) => accessory.label).join(', '))
  return parts.join(' · ')
}
