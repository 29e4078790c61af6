// Upper bounds are "absurd magnitude" guards for portable sound, far above any real rig, so a
// typo (an extra zero or two) is caught while every real pack, amplifier and lead passes.

/** Above any battery rig; 100 cells of li-ion are 420 V. */
export const MAX_SUPPLY_V = 1000
/** 7 days: an event plan, not a season. */
export const MAX_SCHEDULE_MINUTES = 10080

/** A supply or input voltage: positive, up to the absurd-magnitude guard. */
export function voltageField(label: string) {
  return { label, unit: 'V', min: 0, max: MAX_SUPPLY_V, aboveMin: true, decimals: 1 } as const
}

/**
 * An efficiency, as the fraction the engine takes and in % on screen. Output can never exceed
 * input (conservation of energy), so it is at most 1; zero would be no output at all.
 */
export function efficiencyField(label: string) {
  return {
    label,
    min: 0,
    max: 1,
    aboveMin: true,
    display: 'percentOfOne',
    boundsNote: '1 is 100 %',
  } as const
}
