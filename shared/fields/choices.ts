// The choice and yes-or-no fields that several forms show (the bench, the parts library, the plans): each one's
// label, help and its options in plain words, once. The schema's message names the field by this
// label; the codes themselves are the request's contract and stay in the schema.
import { CHEMISTRIES, CHEMISTRY_DATA, type Chemistry } from '../engine/chemistry'

/** The request's codes (its contract: extend, rename none); the schema takes them from here. */
export const AMPLIFIER_CLASSES = ['d', 'ab', 'a'] as const
export const ACCESSORY_FEEDS = [
  'direct',
  'buck',
  'boost',
  'buck-boost',
  'isolated',
  'linear',
] as const

export interface ChoiceFieldEntry<Value extends string = string> {
  /** Named at the field and in every message about it: clear without the form around it. */
  label: string
  /** Said under the field. */
  help?: string
  /** Each code in words, in the order a form lists them. */
  options: Record<Value, string>
}

/** The chemistries as the engine's data names them (its messages say "a LiFePO4 cell" too). */
const chemistryWords = Object.fromEntries(
  CHEMISTRIES.map((chemistry) => [chemistry, CHEMISTRY_DATA[chemistry].label]),
) as Record<Chemistry, string>

export const CHOICES = {
  'pack.chemistry': {
    label: 'Chemistry',
    help: 'Li-ion covers NMC and NCA tool packs; lead-acid covers AGM and gel.',
    options: chemistryWords,
  } satisfies ChoiceFieldEntry<Chemistry>,
  'amplifier.class': {
    label: 'Amplifier class',
    options: { d: 'D (switching)', ab: 'AB (linear)', a: 'A' },
  } satisfies ChoiceFieldEntry<(typeof AMPLIFIER_CLASSES)[number]>,
  'accessory.feed': {
    label: 'Accessory feed',
    options: {
      direct: 'Straight from the pack',
      buck: 'Step-down (buck) converter',
      boost: 'Step-up (boost) converter',
      'buck-boost': 'Buck-boost converter',
      isolated: 'Isolated converter',
      linear: 'Linear regulator',
    },
  } satisfies ChoiceFieldEntry<(typeof ACCESSORY_FEEDS)[number]>,
} as const

/** A yes-or-no field: its label and help, as every form and the schema's message say them. */
export interface FlagFieldEntry {
  label: string
  help?: string
}

export const FLAGS = {
  'amplifier.bridged': { label: 'Bridged (BTL) output' },
  childrenPresent: {
    label: 'Children in the audience',
    help: 'Children get a stricter hearing caution.',
  },
} as const satisfies Record<string, FlagFieldEntry>

/** A flag's key in the catalogue: `amplifier.bridged`. */
export type FlagKey = keyof typeof FLAGS

export function flagEntry(key: FlagKey): FlagFieldEntry {
  return FLAGS[key]
}

/** A choice field's key in the catalogue: `pack.chemistry`. */
export type ChoiceKey = keyof typeof CHOICES

export function choiceEntry(key: ChoiceKey): ChoiceFieldEntry {
  return CHOICES[key]
}

/** A choice field's options as a select lists them: each code with its words. */
export function choiceOptions(key: ChoiceKey): { value: string; label: string }[] {
  return Object.entries(choiceEntry(key).options).map(([value, label]) => ({ value, label }))
}

/** A code in words, or the code itself if it is not one of the field's options. */
export function choiceWords(key: ChoiceKey, value: string): string {
  const options: Record<string, string> = choiceEntry(key).options
  return Object.hasOwn(options, value) ? (options[value] ?? value) : value
}
