// Programme and level (docs/model.md §5).

export const SINE_CREST_FACTOR_DB = 20 * Math.log10(Math.SQRT2) // 3.01 dB, by definition

/** Average output of a programme whose peaks sit `peakBelowClipDb` below clipping:
 *  P_avg = 2·P_clip·10^(−(L + CF)/10) (docs/model.md §5). */
export function averagePowerW(clipPowerW: number, peakBelowClipDb: number, crestFactorDb: number) {
  return 2 * clipPowerW * 10 ** (-(peakBelowClipDb + crestFactorDb) / 10)
}

/** The programme's peaks as a sine-equivalent power: P_clip·10^(−L/10). */
export function peakPowerW(clipPowerW: number, peakBelowClipDb: number): number {
  return clipPowerW * 10 ** (-peakBelowClipDb / 10)
}

/** Largest average/clip ratio with peaks at clipping: 2·10^(−CF/10) (1 for a sine). */
export function averageToClipRatioAtClipping(crestFactorDb: number): number {
  return 2 * 10 ** (-crestFactorDb / 10)
}

const SINE_MEAN_TO_RMS = (2 * Math.SQRT2) / Math.PI // 0.900, by definition
const GAUSSIAN_MEAN_TO_RMS = Math.sqrt(2 / Math.PI) // 0.798, by definition
// ours: blend between the sine and the Gaussian figure up to 6 dB of crest factor, so a small
// change in crest factor never makes the class AB draw jump
const GAUSSIAN_FROM_CREST_DB = 6

/** mean|v| / rms of the programme, used for the class AB supply current (docs/model.md §4). */
export function meanToRmsRatio(crestFactorDb: number): number {
  if (crestFactorDb <= SINE_CREST_FACTOR_DB) return SINE_MEAN_TO_RMS
  if (crestFactorDb >= GAUSSIAN_FROM_CREST_DB) return GAUSSIAN_MEAN_TO_RMS
  const share =
    (crestFactorDb - SINE_CREST_FACTOR_DB) / (GAUSSIAN_FROM_CREST_DB - SINE_CREST_FACTOR_DB)
  return SINE_MEAN_TO_RMS + share * (GAUSSIAN_MEAN_TO_RMS - SINE_MEAN_TO_RMS)
}

export const SINE_BURST_MEAN_TO_RMS = SINE_MEAN_TO_RMS

export interface ProgrammePreset {
  id: string
  label: string
  crestFactorDb: number
}

// docs/model.md §5 (common practice, from memory; editable): midpoints of the usual ranges
export const PROGRAMME_PRESETS: readonly ProgrammePreset[] = [
  { id: 'sine-tone', label: 'Sine test tone', crestFactorDb: 3.01 },
  { id: 'dense-dance', label: 'Dense mastered pop and dance', crestFactorDb: 9 },
  { id: 'rock-pop', label: 'Rock and pop', crestFactorDb: 13 },
  { id: 'speech', label: 'Speech and announcements', crestFactorDb: 13.5 },
  { id: 'acoustic', label: 'Acoustic, jazz and classical', crestFactorDb: 18 },
]
