// Plain names and shown values for the defaults the engine lists in `result.assumed`, so the
// "What the estimate assumed" table never shows a field path or a bare fraction.
import type { AssumedValue, EstimateRequest } from '@shared/schemas/estimate'
import { formatNumber, withUnit } from '@/display/format'
import { milliOhm, percentOfOne, showQuantity, type DisplayQuantity } from '@/display/units'

interface AssumedField {
  label: string
  /** How the value is shown; a plain number when absent. */
  show?: (value: number) => string
}

const plain = (decimals: number, unit: string) => (value: number) =>
  withUnit(formatNumber(value, decimals), unit)
const inQuantity = (quantity: DisplayQuantity) => (value: number) => showQuantity(value, quantity)

const fields: Record<string, AssumedField> = {
  'programme.playingPct': { label: 'Share of the time music plays', show: plain(0, '%') },
  'pack.cellResistanceOhm': { label: 'Internal resistance per cell', show: inQuantity(milliOhm) },
  'pack.cutoffCellV': { label: 'Cutoff voltage per cell', show: plain(2, 'V') },
  'pack.healthPct': { label: 'Pack health', show: plain(0, '%') },
  'pack.peukertExponent': { label: 'Peukert exponent', show: (value) => formatNumber(value, 2) },
  'pack.count': { label: 'Charged packs on hand', show: (value) => formatNumber(value) },
  'leads.connectorOhm': { label: 'Connectors and fuse', show: inQuantity(milliOhm) },
  'amplifier.ratedThdPct': { label: 'Distortion at the rated power', show: plain(1, '%') },
  'amplifier.lockoutV': { label: 'Amplifier mutes below', show: plain(1, 'V') },
  'amplifier.idleCurrentA': { label: 'Amplifier idle current', show: plain(2, 'A') },
  'amplifier.efficiency': { label: 'Amplifier efficiency', show: inQuantity(percentOfOne) },
  'amplifier.minLoadOhm': { label: 'Lowest load the amplifier takes', show: plain(1, 'Ω') },
  'speakers.facingListener': {
    label: 'Drivers facing the listener',
    show: (value) => formatNumber(value),
  },
  boundaryGainDb: { label: 'Gain from nearby surfaces', show: plain(0, 'dB') },
}

const accessoryFields: Record<string, AssumedField> = {
  outputV: { label: 'converter output', show: plain(1, 'V') },
  efficiency: { label: 'converter efficiency', show: inQuantity(percentOfOne) },
  idleW: { label: 'converter idle draw', show: plain(2, 'W') },
}

/**
 * The plain label and shown value of one assumed default. Temperatures and distances are shown
 * in the units chosen in the header (`temperature`, `length`).
 */
export function assumedRow(
  entry: AssumedValue,
  request: EstimateRequest | null,
  units: { temperature: DisplayQuantity; length: DisplayQuantity },
): { label: string; value: string } {
  const accessory = /^accessories\.(\d+)\.(\w+)$/.exec(entry.field)
  const known = accessory
    ? accessoryFields[accessory[2] ?? '']
    : entry.field === 'temperatureC'
      ? { label: 'Temperature', show: inQuantity(units.temperature) }
      : entry.field === 'listenerDistanceM'
        ? { label: 'Listener distance', show: inQuantity(units.length) }
        : fields[entry.field]
  let label = known?.label ?? 'Other setting'
  if (accessory) {
    const name = request?.accessories?.[Number(accessory[1])]?.label ?? 'Accessory'
    label = `${name}: ${label}`
  }
  const value =
    typeof entry.value === 'number'
      ? (known?.show ?? ((shown: number) => formatNumber(shown, 2)))(entry.value)
      : typeof entry.value === 'boolean'
        ? entry.value
          ? 'yes'
          : 'no'
        : entry.value
  return { label, value }
}
