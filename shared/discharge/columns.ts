// The column names a discharge log may use (case-insensitive, unit in the name), read by the
// server's parser and listed in the upload help.

export type LogQuantity = 'time' | 'voltage' | 'current' | 'power' | 'capacity'

export interface ColumnRule {
  quantity: LogQuantity
  /** Multiplies the cell's number into SI (s, V, A, W, Ah); `clock` allows hh:mm:ss. */
  toSi: number
  clock?: boolean
}

// Header names after normalising (lower case, brackets and spaces to underscores).
export const columnRules: Record<string, ColumnRule> = {
  time: { quantity: 'time', toSi: 1, clock: true },
  time_s: { quantity: 'time', toSi: 1 },
  time_sec: { quantity: 'time', toSi: 1 },
  seconds: { quantity: 'time', toSi: 1 },
  elapsed_s: { quantity: 'time', toSi: 1 },
  time_ms: { quantity: 'time', toSi: 1e-3 },
  time_min: { quantity: 'time', toSi: 60 },
  time_h: { quantity: 'time', toSi: 3600 },
  time_hms: { quantity: 'time', toSi: 1, clock: true },
  voltage: { quantity: 'voltage', toSi: 1 },
  voltage_v: { quantity: 'voltage', toSi: 1 },
  volts: { quantity: 'voltage', toSi: 1 },
  voltage_mv: { quantity: 'voltage', toSi: 1e-3 },
  current: { quantity: 'current', toSi: 1 },
  current_a: { quantity: 'current', toSi: 1 },
  amps: { quantity: 'current', toSi: 1 },
  current_ma: { quantity: 'current', toSi: 1e-3 },
  power: { quantity: 'power', toSi: 1 },
  power_w: { quantity: 'power', toSi: 1 },
  watts: { quantity: 'power', toSi: 1 },
  power_mw: { quantity: 'power', toSi: 1e-3 },
  capacity_ah: { quantity: 'capacity', toSi: 1 },
  charge_ah: { quantity: 'capacity', toSi: 1 },
  capacity_mah: { quantity: 'capacity', toSi: 1e-3 },
  charge_mah: { quantity: 'capacity', toSi: 1e-3 },
  mah: { quantity: 'capacity', toSi: 1e-3 },
}

/** The recognised header names of one quantity, in table order. */
export function columnNamesFor(quantity: LogQuantity): string[] {
  return Object.entries(columnRules)
    .filter(([, rule]) => rule.quantity === quantity)
    .map(([name]) => name)
}
