import type {
  AccessorySpec,
  AmplifierSpec,
  EstimateRequest,
  PackSpec,
  SpeakersSpec,
} from '../schemas/estimate'

/**
 * One part of the built-in library: a stable id (saved rigs and tests refer to it), a plain label
 * for pickers, and the part itself in the estimate request's own shape, so picking a part is a
 * copy into the draft with nothing to translate.
 */
export interface LibraryItem<Part> {
  id: string
  label: string
  part: Part
}

export type LibraryPack = LibraryItem<PackSpec>
export type LibraryAmplifier = LibraryItem<AmplifierSpec>
export type LibrarySpeakers = LibraryItem<SpeakersSpec>
export type LibraryAccessory = LibraryItem<AccessorySpec>
/** A converter module: an accessory's converter settings (any feed but direct). */
export type LibraryConverter = LibraryItem<
  Pick<
    AccessorySpec,
    'outputV' | 'efficiency' | 'idleW' | 'converterInputMinV' | 'converterInputMaxV'
  > & {
    feed: Exclude<AccessorySpec['feed'], 'direct'>
    outputV: number
  }
>

/** A complete rig the bench can start from. */
export interface ExampleRig {
  id: string
  label: string
  description: string
  rig: EstimateRequest
}
