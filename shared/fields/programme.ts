// The programme (what plays and how loud), and a plan's segments, which may each set their own.
import { MAX_SCHEDULE_MINUTES } from './limits'
import type { NumberFieldEntry } from './types'

export const programmeFields = {
  'programme.peakBelowClipDb': {
    label: 'Level (peaks below clipping)',
    unit: 'dB',
    min: 0,
    max: 60,
    help: '0 dB: peaks just reach clipping; each 3 dB more halves the average power',
  },
  'programme.crestFactorDb': { label: 'Crest factor', unit: 'dB', min: 0, max: 30, step: 0.5 },
  'programme.playingPct': {
    label: 'Playing share',
    unit: '%',
    min: 0,
    max: 100,
    step: 5,
    decimals: 0,
  },
  'segment.minutes': {
    label: 'Segment length',
    unit: 'min',
    min: 0,
    max: MAX_SCHEDULE_MINUTES,
    aboveMin: true,
  },
  /** Power into the pack after the charger, in a 'charging' segment. */
  'segment.chargeW': {
    label: 'Charging power into the pack',
    unit: 'W',
    min: 0,
    max: 5000,
    aboveMin: true,
  },
  'swapPolicy.belowSocPct': {
    label: 'Swap threshold (state of charge)',
    unit: '%',
    min: 1,
    max: 99,
  },
} as const satisfies Record<string, NumberFieldEntry>
