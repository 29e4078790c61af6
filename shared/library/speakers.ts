import type { SpeakersSpec } from '../schemas/estimate'
import type { LibrarySpeakers } from './types'

function speakers(id: string, label: string, part: SpeakersSpec): LibrarySpeakers {
  return { id, label, part }
}

// Arrangements per amplifier channel. Load = banks × driver ohms / drivers per bank (docs/model.md §3).
// Sensitivities are typical of each driver size at 1 W, 1 m (from memory of makers' datasheets;
// real drivers differ by a few dB). Every driver faces the listener unless the label says so.
export const librarySpeakers: readonly LibrarySpeakers[] = [
  speakers('spk-1x-8ohm-4in', 'One 4" full-range driver, 8 Ω', {
    driverOhm: 8,
    parallel: 1,
    banks: 1,
    sensitivityDb: 86, // from memory: 4" full-range drivers 84–88 dB
    facingListener: 1,
  }),
  speakers('spk-1x-4ohm-6in', 'One 6.5" woofer, 4 Ω', {
    driverOhm: 4,
    parallel: 1,
    banks: 1,
    sensitivityDb: 89, // from memory: 6.5" woofers 87–91 dB
    facingListener: 1,
  }),
  speakers('spk-1x-8ohm-12in', 'One 12" PA driver, 8 Ω', {
    driverOhm: 8,
    parallel: 1,
    banks: 1,
    sensitivityDb: 96, // from memory: 12" PA woofers 95–98 dB
    facingListener: 1,
  }),
  speakers('spk-2x-8ohm-parallel', 'Two 5" drivers of 8 Ω in parallel (4 Ω)', {
    driverOhm: 8,
    parallel: 2,
    banks: 1,
    sensitivityDb: 87, // from memory: 5" full-range drivers 85–89 dB
    facingListener: 2,
  }),
  speakers('spk-2x-4ohm-series', 'Two 6.5" drivers of 4 Ω in series (8 Ω)', {
    driverOhm: 4,
    parallel: 1,
    banks: 2,
    sensitivityDb: 89,
    facingListener: 2,
  }),
  speakers('spk-3x-8ohm-parallel', 'Three 3" drivers of 8 Ω in parallel (2.67 Ω)', {
    driverOhm: 8,
    parallel: 3, // common practice: 3 × 8 Ω in parallel ≈ 2.67 Ω
    banks: 1,
    sensitivityDb: 85, // from memory: 3" full-range drivers 83–87 dB
    facingListener: 3,
  }),
  speakers('spk-column-6x-8ohm', 'Column of six 3" drivers of 8 Ω, 2 banks of 3 (5.33 Ω)', {
    driverOhm: 8,
    parallel: 3,
    banks: 2, // common practice: two banks of 3 × 8 Ω in series ≈ 5.33 Ω
    sensitivityDb: 85,
    facingListener: 6,
  }),
  speakers('spk-4x-8ohm-series-parallel', 'Four 5" drivers of 8 Ω, 2 banks of 2 (8 Ω)', {
    driverOhm: 8,
    parallel: 2,
    banks: 2,
    sensitivityDb: 87,
    facingListener: 4,
  }),
]
