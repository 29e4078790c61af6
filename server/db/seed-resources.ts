import {
  exampleRigs,
  libraryAccessories,
  libraryAmplifiers,
  libraryItem,
  libraryPacks,
  librarySpeakers,
  type LibraryItem,
} from '../../shared/library'
import { PROGRAMME_PRESETS } from '../../shared/engine'
import type { AccessorySpec, EstimateRequest } from '../../shared/schemas/estimate'
import {
  accessoryBodySchema,
  amplifierBodySchema,
  packBodySchema,
  rigBodySchema,
  speakersBodySchema,
} from '../../shared/schemas/resources'
import { insertOwnedItem, type WriteScope } from '../resources/resource-definition'
import { accessoryDefinition } from '../resources/accessories'
import { amplifierDefinition } from '../resources/amplifiers'
import { packDefinition } from '../resources/packs'
import { rigDefinition } from '../resources/rigs'
import { speakersDefinition } from '../resources/speakers'
import type { DemoSeedStep } from './seed'

// The demo crews' own parts and saved rigs (invented; built from the generic library so their
// values never drift from it). Everything goes through the same insert as the API, so the demo
// rigs carry summaries from the same engine.

function exampleRig(id: string): EstimateRequest {
  const example = exampleRigs.find((rig) => rig.id === id)
  if (!example) throw new Error(`No example rig "${id}"`)
  return structuredClone(example.rig)
}

interface SavedPart<Spec> {
  id: number
  spec: Spec
}

/** Saves a library part under the crew's own name; returns its id and the spec as stored. */
function savePart<Spec extends object>(
  scope: WriteScope,
  kind: 'pack' | 'amplifier' | 'speakers' | 'accessory',
  name: string,
  part: Spec,
  notes = '',
): SavedPart<Spec> {
  const input = { ...part, name, notes }
  const saves = {
    pack: () => insertOwnedItem(scope, packDefinition, packBodySchema.parse(input)),
    amplifier: () => insertOwnedItem(scope, amplifierDefinition, amplifierBodySchema.parse(input)),
    speakers: () => insertOwnedItem(scope, speakersDefinition, speakersBodySchema.parse(input)),
    accessory: () => insertOwnedItem(scope, accessoryDefinition, accessoryBodySchema.parse(input)),
  }
  const labelled = kind === 'pack' || kind === 'accessory' ? { label: name } : {}
  return { id: saves[kind](), spec: { ...part, ...labelled } }
}

const libraryPart = <Part>(items: readonly LibraryItem<Part>[], id: string): Part =>
  structuredClone(libraryItem(items, id).part)

function micReceiver(feed: AccessorySpec['feed']): AccessorySpec {
  // Every pack here leaves the receiver's 11–15 V window at some point: a 12 V converter feeds it.
  return { ...libraryPart(libraryAccessories, 'acc-wireless-mic-receiver'), feed, outputV: 12 }
}

function saveRig(
  scope: WriteScope,
  name: string,
  notes: string,
  spec: EstimateRequest,
  parts: { packId?: number; amplifierId?: number; speakersId?: number; accessoryIds?: number[] },
): void {
  insertOwnedItem(scope, rigDefinition, rigBodySchema.parse({ name, notes, spec, ...parts }))
}

interface RigParts {
  pack: SavedPart<EstimateRequest['pack']>
  amplifier: SavedPart<EstimateRequest['amplifier']>
  speakers: SavedPart<EstimateRequest['speakers']>
  accessories: SavedPart<AccessorySpec>[]
}

/** An example rig's programme and place, on the crew's own saved parts (copied and referenced). */
function saveRigFromParts(
  scope: WriteScope,
  name: string,
  notes: string,
  exampleId: string,
  parts: RigParts,
): void {
  const spec = {
    ...exampleRig(exampleId),
    pack: parts.pack.spec,
    amplifier: parts.amplifier.spec,
    speakers: parts.speakers.spec,
    accessories: parts.accessories.map((accessory) => accessory.spec),
  }
  saveRig(scope, name, notes, spec, {
    packId: parts.pack.id,
    amplifierId: parts.amplifier.id,
    speakersId: parts.speakers.id,
    accessoryIds: parts.accessories.map((accessory) => accessory.id),
  })
}

function seedAlderCreek(scope: WriteScope): void {
  const toolPack = savePart(
    scope,
    'pack',
    'Crew tool pack 36 V, 5 Ah',
    { ...libraryPart(libraryPacks, 'li-ion-10s-5ah'), count: 2 },
    'Two of them, marked A and B; charge both the night before.',
  )
  const cartBattery = savePart(
    scope,
    'pack',
    'Cart battery, 12 V 18 Ah AGM',
    libraryPart(libraryPacks, 'lead-acid-12v-18ah'),
    'Sealed lead-acid: keep it upright and recharge the same day.',
  )
  const announcerBattery = savePart(scope, 'pack', 'Announcer battery 12.8 V, 6 Ah', {
    ...libraryPart(libraryPacks, 'lifepo4-4s-6ah'),
    count: 2,
  })
  const columnAmp = savePart(
    scope,
    'amplifier',
    'Column amp, 2 × 150 W board',
    libraryPart(libraryAmplifiers, 'amp-d-stereo-2x150w'),
  )
  const cartAmp = savePart(
    scope,
    'amplifier',
    'Cart amp, AB bridged 2 × 25 W',
    libraryPart(libraryAmplifiers, 'amp-ab-bridged-2x25w'),
  )
  const announcerAmp = savePart(
    scope,
    'amplifier',
    'Announcer amp, 2 × 15 W',
    libraryPart(libraryAmplifiers, 'amp-d-stereo-2x15w'),
  )
  const columns = savePart(
    scope,
    'speakers',
    'Stage columns, six 3" drivers each',
    libraryPart(librarySpeakers, 'spk-column-6x-8ohm'),
  )
  const cartWoofers = savePart(
    scope,
    'speakers',
    'Cart woofers, 6.5"',
    libraryPart(librarySpeakers, 'spk-1x-4ohm-6in'),
  )
  const announcerDrivers = savePart(
    scope,
    'speakers',
    'Announcer drivers, 4"',
    libraryPart(librarySpeakers, 'spk-1x-8ohm-4in'),
  )
  const bluetooth = savePart(
    scope,
    'accessory',
    'Bluetooth receiver (USB)',
    libraryPart(libraryAccessories, 'acc-bluetooth-preamp-usb'),
  )
  const micOnStepDown = savePart(
    scope,
    'accessory',
    'Mic receiver, 12 V step-down',
    micReceiver('buck'),
  )
  const micOnBuckBoost = savePart(
    scope,
    'accessory',
    'Mic receiver, 12 V buck-boost',
    micReceiver('buck-boost'),
  )
  const mixer = savePart(scope, 'accessory', 'Small mixer, 12 V buck-boost', {
    ...libraryPart(libraryAccessories, 'acc-small-mixer'),
    feed: 'buck-boost' as const,
    outputV: 12,
  })

  // The example column rig runs on 18 V packs; the crew's runs on its 36 V packs, whose 30–42 V
  // window needs the 18–50 V board.
  saveRigFromParts(
    scope,
    'Market stage columns',
    'Saturday market: two columns either side of the stage.',
    'rig-market-column',
    {
      pack: toolPack,
      amplifier: columnAmp,
      speakers: columns,
      accessories: [bluetooth, micOnStepDown],
    },
  )
  saveRigFromParts(scope, 'Busker cart', 'Voice and guitar through the mixer.', 'rig-busker-cart', {
    pack: cartBattery,
    amplifier: cartAmp,
    speakers: cartWoofers,
    accessories: [mixer, micOnBuckBoost],
  })
  saveRigFromParts(
    scope,
    'Announcer box',
    'Wireless microphone for the raffle and lost children.',
    'rig-announcer-box',
    {
      pack: announcerBattery,
      amplifier: announcerAmp,
      speakers: announcerDrivers,
      accessories: [micOnBuckBoost],
    },
  )
}

const acousticCrestFactorDb =
  PROGRAMME_PRESETS.find((preset) => preset.id === 'acoustic')?.crestFactorDb ?? 18

/** The second crew has one rig of library parts and no saved parts: it sees none of the first's. */
function seedHarborLane(scope: WriteScope): void {
  saveRig(
    scope,
    'Harbor steps busking amp',
    'Acoustic sets on the harbor steps.',
    {
      pack: libraryPart(libraryPacks, 'li-ion-5s-5ah'),
      leads: { awg: 16, lengthM: 0.5 },
      amplifier: libraryPart(libraryAmplifiers, 'amp-d-stereo-2x50w'),
      speakers: libraryPart(librarySpeakers, 'spk-2x-8ohm-parallel'),
      programme: { crestFactorDb: acousticCrestFactorDb, peakBelowClipDb: 4, playingPct: 80 },
      listenerDistanceM: 3,
    },
    {},
  )
}

export const seedDemoResources: DemoSeedStep = (tx, demo) => {
  const { nowMs } = demo
  seedAlderCreek({ tx, teamId: demo.teamIds.alder, userId: demo.userIds.alderEditor, nowMs })
  seedHarborLane({ tx, teamId: demo.teamIds.harbor, userId: demo.userIds.harborAdmin, nowMs })
}
