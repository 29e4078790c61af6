// The two copper runs: the DC lead from pack to amplifier and the speaker leads. Each gives its
// wire size as AWG or mm² (exactly one) and its one-way length.
import type { NumberFieldEntry } from './types'

type CopperRunKey<Run extends string> = `${Run}.awg` | `${Run}.areaMm2` | `${Run}.lengthM`

function copperRun<Run extends string>(
  run: Run,
  noun: string,
  maxLengthM: number,
): Record<CopperRunKey<Run>, NumberFieldEntry> {
  const entries: Record<string, NumberFieldEntry> = {
    [`${run}.awg`]: {
      label: `${noun} wire gauge`,
      unit: 'AWG',
      min: -3,
      max: 40,
      whole: true,
      decimals: 0,
      // ASTM B258 numbers the gauges above 0 AWG as 1/0, 2/0…; the schema takes them as 0, -1….
      boundsNote: '2/0 is -1, 3/0 is -2, 4/0 is -3',
    },
    [`${run}.areaMm2`]: {
      label: `${noun} wire area`,
      unit: 'mm²',
      min: 0,
      max: 500,
      aboveMin: true,
      step: 0.25,
      decimals: 1,
    },
    [`${run}.lengthM`]: {
      label: `${noun} length, one way`,
      unit: 'm',
      min: 0,
      max: maxLengthM,
      aboveMin: true,
      step: 0.1,
      display: 'length',
    },
  }
  return entries as Record<CopperRunKey<Run>, NumberFieldEntry>
}

export const leadFields = {
  ...copperRun('leads', 'Lead', 100),
  'leads.connectorOhm': {
    label: 'Connector and fuse resistance',
    unit: 'Ω',
    min: 0,
    max: 1,
    display: 'milliOhm',
  },
  // Ours: 200 m one way covers a long outdoor speaker run; further is a typo or a 100 V line system.
  ...copperRun('speakerLeads', 'Speaker lead', 200),
} as const satisfies Record<string, NumberFieldEntry>
