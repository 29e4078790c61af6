import type { AmplifierSpec } from '../schemas/estimate'
import type { LibraryAmplifier } from './types'

function amplifier(id: string, label: string, part: AmplifierSpec): LibraryAmplifier {
  return { id, label, part }
}

// Generic boards described by the datasheet class of the chips they use (no makers named). Each
// rating point is what such datasheets print; 10 % THD points are the usual headline figure.
// Check on every entry: the clean peak swing sqrt(2·P·R) stays below the supply (bridged) or half
// of it (single-ended), so the output resistance the engine derives is positive.
export const libraryAmplifiers: readonly LibraryAmplifier[] = [
  amplifier('amp-d-stereo-2x15w', 'Class D stereo board, 2 × 15 W (8–26 V)', {
    class: 'd',
    bridged: true, // datasheet class: filterless bridged outputs on small class D chips
    channels: 2,
    ratedPowerW: 15, // datasheet class: 15 W into 8 Ω at 16 V, 10 % THD
    ratedLoadOhm: 8,
    ratedSupplyV: 16,
    ratedThdPct: 10,
    supplyMinV: 8, // datasheet class: 8–26 V operating range
    supplyMaxV: 26,
    lockoutV: 7, // datasheet class: undervoltage lock-out a little below the minimum supply
    idleCurrentA: 0.02, // datasheet class: about 20 mA quiescent, no signal
    minLoadOhm: 4,
  }),
  amplifier('amp-d-stereo-2x50w', 'Class D stereo board, 2 × 50 W (8–26 V)', {
    class: 'd',
    bridged: true,
    channels: 2,
    ratedPowerW: 50, // datasheet class: 50 W into 4 Ω at 24 V, 10 % THD
    ratedLoadOhm: 4,
    ratedSupplyV: 24,
    ratedThdPct: 10,
    supplyMinV: 8,
    supplyMaxV: 26, // datasheet class: absolute maximum about 30 V; 26 V recommended
    lockoutV: 7.5,
    idleCurrentA: 0.05, // datasheet class: 30–60 mA quiescent
    efficiency: 0.9, // datasheet class: about 90 % near full power into 4 Ω
    minLoadOhm: 4,
  }),
  amplifier('amp-d-mono-100w', 'Class D mono board, 1 × 100 W (parallel bridged, 8–26 V)', {
    class: 'd',
    bridged: true, // parallel bridge-tied load: both halves of a stereo chip drive one speaker
    channels: 1,
    ratedPowerW: 100, // datasheet class: 100 W into 2 Ω at 24 V, 10 % THD
    ratedLoadOhm: 2,
    ratedSupplyV: 24,
    ratedThdPct: 10,
    supplyMinV: 8,
    supplyMaxV: 26,
    lockoutV: 7.5,
    idleCurrentA: 0.05,
    efficiency: 0.88, // docs/model.md §4 default; matches the datasheet class at 2 Ω
    minLoadOhm: 2,
  }),
  amplifier('amp-d-stereo-2x150w', 'Class D stereo board, 2 × 150 W (18–50 V)', {
    class: 'd',
    bridged: true,
    channels: 2,
    ratedPowerW: 150, // datasheet class: 150 W into 4 Ω at 36 V, 10 % THD
    ratedLoadOhm: 4,
    ratedSupplyV: 36,
    ratedThdPct: 10,
    supplyMinV: 18, // datasheet class: 18–50 V boards for 36 V packs
    supplyMaxV: 50,
    lockoutV: 16,
    idleCurrentA: 0.08, // datasheet class: larger output stages idle near 80 mA
    efficiency: 0.9,
    minLoadOhm: 3,
  }),
  amplifier('amp-d-mono-250w', 'Class D mono board, 1 × 250 W (30–70 V)', {
    class: 'd',
    bridged: true,
    channels: 1,
    ratedPowerW: 250, // datasheet class: 250 W into 4 Ω at 56 V, 1 % THD
    ratedLoadOhm: 4,
    ratedSupplyV: 56,
    ratedThdPct: 1,
    supplyMinV: 30, // datasheet class: high-voltage modules for 48–60 V supplies
    supplyMaxV: 70,
    lockoutV: 28,
    idleCurrentA: 0.06,
    efficiency: 0.92, // datasheet class: high-voltage stages reach 90–93 %
    minLoadOhm: 4,
  }),
  amplifier('amp-ab-bridged-2x25w', 'Class AB bridged board, 2 × 25 W (vehicle-supply class)', {
    class: 'ab',
    bridged: true, // datasheet class: 12 V vehicle-audio chips bridge each channel
    channels: 2,
    ratedPowerW: 25, // datasheet class: 25 W into 4 Ω at 14.4 V, 10 % THD
    ratedLoadOhm: 4,
    ratedSupplyV: 14.4, // common practice: vehicle supply with the engine running
    ratedThdPct: 10,
    supplyMinV: 8,
    supplyMaxV: 18,
    lockoutV: 7.5,
    idleCurrentA: 0.12, // datasheet class: 100–150 mA quiescent for class AB output stages
    minLoadOhm: 2,
  }),
  amplifier('amp-ab-single-1w', 'Class AB single-ended chip, 1 × 1 W (4–12 V)', {
    class: 'ab',
    bridged: false, // one output with a coupling capacitor, fed from one supply
    channels: 1,
    ratedPowerW: 1, // datasheet class: about 1 W into 8 Ω at 9 V, 10 % THD
    ratedLoadOhm: 8,
    ratedSupplyV: 9,
    ratedThdPct: 10,
    supplyMinV: 4,
    supplyMaxV: 12,
    idleCurrentA: 0.004, // datasheet class: 4 mA quiescent
    minLoadOhm: 4,
  }),
]
