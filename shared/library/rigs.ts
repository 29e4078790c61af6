import { PROGRAMME_PRESETS } from '../engine/programme'
import type { AccessorySpec } from '../schemas/estimate'
import { libraryAccessories } from './accessories'
import { libraryAmplifiers } from './amplifiers'
import { libraryItem } from './find'
import { libraryPacks } from './packs'
import { librarySpeakers } from './speakers'
import type { ExampleRig, LibraryItem } from './types'

// Example rigs of the invented demo crew, built from library parts so that they never drift
// from the library's values.

function part<Part>(items: readonly LibraryItem<Part>[], id: string): Part {
  return structuredClone(libraryItem(items, id).part)
}

function crestFactorDb(presetId: string): number {
  const preset = PROGRAMME_PRESETS.find((candidate) => candidate.id === presetId)
  if (!preset) throw new Error(`Example rig refers to a missing programme preset "${presetId}"`)
  return preset.crestFactorDb
}

/** A library accessory fed through a converter that suits the rig's pack. */
function convertedAccessory(
  id: string,
  feed: AccessorySpec['feed'],
  outputV: number,
): AccessorySpec {
  return { ...part(libraryAccessories, id), feed, outputV }
}

export const exampleRigs: readonly ExampleRig[] = [
  {
    id: 'rig-market-column',
    label: 'Market-stage column pair on 18 V tool packs',
    description:
      'Two columns of six small drivers on a 2 × 50 W class D board, music from a phone over ' +
      'Bluetooth and a wireless microphone for announcements; two 8 Ah packs on hand.',
    rig: {
      pack: { ...part(libraryPacks, 'li-ion-5s-8ah'), count: 2 },
      leads: { awg: 14, lengthM: 0.5 },
      amplifier: part(libraryAmplifiers, 'amp-d-stereo-2x50w'),
      speakers: part(librarySpeakers, 'spk-column-6x-8ohm'),
      accessories: [
        part(libraryAccessories, 'acc-bluetooth-preamp-usb'),
        // An 18 V pack (21 V full) is above the receiver's 15 V: a 12 V step-down feeds it.
        convertedAccessory('acc-wireless-mic-receiver', 'buck', 12),
      ],
      programme: {
        crestFactorDb: crestFactorDb('dense-dance'),
        peakBelowClipDb: 2,
        playingPct: 90,
      },
      temperatureC: 12,
      listenerDistanceM: 6,
      childrenPresent: true,
    },
  },
  {
    id: 'rig-busker-cart',
    label: 'Busker cart on a 12 V lead-acid battery',
    description:
      'A class AB vehicle-supply board driving two 6.5" woofers, a small mixer for voice and ' +
      'guitar and a wireless microphone, on an 18 Ah AGM battery in a hand cart.',
    rig: {
      pack: part(libraryPacks, 'lead-acid-12v-18ah'),
      leads: { areaMm2: 1.5, lengthM: 1 },
      amplifier: part(libraryAmplifiers, 'amp-ab-bridged-2x25w'),
      speakers: part(librarySpeakers, 'spk-1x-4ohm-6in'),
      accessories: [
        // Lead-acid sags below the mixer's 10.5 V and the receiver's 11 V near cutoff under load:
        // buck-boost converters hold both at 12 V.
        convertedAccessory('acc-small-mixer', 'buck-boost', 12),
        convertedAccessory('acc-wireless-mic-receiver', 'buck-boost', 12),
      ],
      programme: { crestFactorDb: crestFactorDb('acoustic'), peakBelowClipDb: 6, playingPct: 90 },
      temperatureC: 18,
      listenerDistanceM: 4,
    },
  },
  {
    id: 'rig-announcer-box',
    label: 'Announcer box on a 12.8 V LiFePO4 battery',
    description:
      'A small class D board and two 4" drivers for announcements from a wireless microphone ' +
      'at a sports day, on a 6 Ah LiFePO4 battery.',
    rig: {
      pack: { ...part(libraryPacks, 'lifepo4-4s-6ah'), count: 2 },
      leads: { awg: 18, lengthM: 0.3 },
      amplifier: part(libraryAmplifiers, 'amp-d-stereo-2x15w'),
      speakers: part(librarySpeakers, 'spk-1x-8ohm-4in'),
      accessories: [convertedAccessory('acc-wireless-mic-receiver', 'buck-boost', 12)],
      programme: { crestFactorDb: crestFactorDb('speech'), peakBelowClipDb: 10, playingPct: 40 },
      temperatureC: 15,
      listenerDistanceM: 5,
      childrenPresent: true,
    },
  },
]
