import { describe, expect, it } from 'vitest'
import type { z } from 'zod'
import { CHOICES, FIELDS, FLAGS, type FieldKey, type NumberFieldEntry } from '../../shared/fields'
import {
  accessorySchema,
  amplifierSchema,
  estimateRequestSchema,
  leadsSchema,
  packSchema,
  programmeSchema,
  scheduleSegmentSchema,
  speakerLeadsSchema,
  speakersSchema,
  swapPolicySchema,
} from '../../shared/schemas/estimate'
import { eventChargerSchema, eventPoolEntrySchema } from '../../shared/schemas/events'

// The catalogue against the schemas the server checks with: every field's bounds are the ones
// the schema enforces, and every message names the field by the label the forms show. These are
// wiring checks (the schemas are built from the catalogue); the facts behind the bounds follow.

/** The object schema each key's first part names; a key without a dot is the request's own. */
const objectSchemas: Record<string, { shape: Record<string, z.ZodType> }> = {
  pack: packSchema,
  leads: leadsSchema,
  speakerLeads: speakerLeadsSchema,
  amplifier: amplifierSchema,
  speakers: speakersSchema,
  accessory: accessorySchema,
  programme: programmeSchema,
  segment: scheduleSegmentSchema,
  swapPolicy: swapPolicySchema,
  pool: eventPoolEntrySchema,
  charger: eventChargerSchema,
  '': estimateRequestSchema,
}

function schemaOf(key: string): z.ZodType | undefined {
  const [object, property] = key.includes('.') ? key.split('.') : ['', key]
  return objectSchemas[object ?? '']?.shape[property ?? '']
}

function messagesFor(key: string, value: unknown): string[] {
  const parsed = schemaOf(key)!.safeParse(value)
  return parsed.success ? [] : parsed.error.issues.map((issue) => issue.message)
}

const entries = Object.entries(FIELDS) as [FieldKey, NumberFieldEntry][]

describe('the field catalogue', () => {
  it.each(entries.map(([key]) => key))('has a schema field for %s', (key) => {
    expect(schemaOf(key)).toBeDefined()
  })

  it.each(entries)('bounds %s as the schema does, naming its label', (key, entry) => {
    const step = entry.step ?? 1
    expect(messagesFor(key, entry.max)).toEqual([])
    const over = messagesFor(key, entry.max + step)
    expect(over).toHaveLength(1)
    expect(over[0]).toMatch(new RegExp(`^${escape(entry.label)} must be `))
    if (entry.unit) expect(over[0]).toContain(` ${entry.unit}`)

    if (entry.aboveMin) {
      expect(messagesFor(key, entry.min)).toEqual(over)
    } else {
      expect(messagesFor(key, entry.min)).toEqual([])
      expect(messagesFor(key, entry.min - step)).toEqual(over)
    }
    // Text is never a number, whatever a form would make of it.
    expect(messagesFor(key, 'abc')).toEqual(over)
    if (entry.whole) expect(messagesFor(key, entry.min + 0.5)).toEqual(over)
  })

  it('gives every field a label of its own, so a message names one field', () => {
    const labels = entries.map(([, entry]) => entry.label)
    expect(new Set(labels).size).toBe(labels.length)
  })

  it.each(entries)('names %s in words, never by a path or a code name', (key, entry) => {
    // The label is shown on screen and in messages ("What the estimate assumed" too): a path
    // such as `pack.cutoffCellV` or `accessories.0.idleW` means nothing to the crew.
    for (const text of [entry.label, entry.help ?? '']) {
      expect(text).not.toMatch(/\b[A-Za-z]+\.(\d+|[A-Za-z]+)\b/)
      expect(text).not.toMatch(/\b[a-z]+[A-Z][a-z]+/)
    }
  })

  it('says the whole range and unit in one sentence', () => {
    expect(messagesFor('pack.seriesCells', 0)).toEqual([
      'Cells in series must be a whole number from 1 to 100',
    ])
    expect(messagesFor('pack.cellCapacityAh', 0)).toEqual([
      'Cell capacity must be more than 0 and at most 1000 Ah',
    ])
    expect(messagesFor('temperatureC', 71)).toEqual([
      'Temperature must be a number from -40 to 70 °C',
    ])
    // Source: ASTM B258: the gauges above 0 AWG are written 1/0, 2/0, 3/0 and 4/0.
    expect(messagesFor('leads.awg', -4)).toEqual([
      'Lead wire gauge must be a whole number from -3 to 40 AWG (2/0 is -1, 3/0 is -2, 4/0 is -3)',
    ])
  })

  it('names both fields of a cross-field message by their labels', () => {
    // Wiring checks: a message that compares two fields reads both names from the catalogue.
    const amplifier = {
      class: 'd',
      bridged: false,
      channels: 1,
      ratedPowerW: 20,
      ratedLoadOhm: 4,
      ratedSupplyV: 12,
      supplyMaxV: 14,
      lockoutV: 15,
    }
    const issues = amplifierSchema.safeParse(amplifier).error?.issues ?? []
    expect(issues.map((issue) => issue.message)).toContain(
      `${FIELDS['amplifier.lockoutV'].label} must be below the maximum supply voltage`,
    )
    const mixer = {
      label: 'Mixer',
      powerW: 5,
      inputMinV: 15,
      inputMaxV: 9,
      feed: 'isolated',
      converterInputMinV: 30,
      converterInputMaxV: 10,
    }
    expect(accessorySchema.safeParse(mixer).error?.issues.map((issue) => issue.message)).toEqual([
      'Accessory "Mixer": converter minimum input voltage must not be above the converter maximum input voltage',
      'Accessory "Mixer": accessory minimum input voltage must not be above the accessory maximum input voltage',
    ])
    const charging = { label: 'Lunch', minutes: 60, state: 'charging' }
    expect(scheduleSegmentSchema.safeParse(charging).error?.issues[0]?.message).toBe(
      'Segment "Lunch" is a charging break: give the charging power into the pack in W',
    )
  })

  it('keeps the physical bounds', () => {
    // Source: conservation of energy: no amplifier or converter gives out more than it takes in.
    expect(FIELDS['amplifier.efficiency'].max).toBe(1)
    expect(FIELDS['accessory.efficiency'].max).toBe(1)
    // Source: a state of charge lies between empty (0 %) and full (100 %); a swap threshold at
    // either end would never or always swap.
    expect(FIELDS['swapPolicy.belowSocPct'].min).toBeGreaterThan(0)
    expect(FIELDS['swapPolicy.belowSocPct'].max).toBeLessThan(100)
    // Source: Peukert's law: an exponent of 1 is an ideal cell, and no real cell does better.
    expect(FIELDS['pack.peukertExponent'].min).toBe(1)
    // Source: an ideal conductor and a cell without resistance do not exist: zero is refused.
    expect(FIELDS['pack.cellResistanceOhm'].aboveMin).toBe(true)
    expect(FIELDS['leads.areaMm2'].aboveMin).toBe(true)
  })
})

describe('the choice fields of the catalogue', () => {
  const choices = [
    ['pack.chemistry', packSchema.shape.chemistry],
    ['amplifier.class', amplifierSchema.shape.class],
    ['accessory.feed', accessorySchema.shape.feed],
  ] as const

  it.each(choices)(
    'lists every code %s takes, in words, named as its message names it',
    (key, schema) => {
      // A wiring check: the schema's codes and the catalogue's options are the same list.
      const entry = CHOICES[key]
      expect(Object.keys(entry.options)).toEqual(schema.options)
      const refused = schema.safeParse('none of these').error?.issues[0]?.message ?? ''
      expect(refused.startsWith(`${entry.label} must be one of: `)).toBe(true)
      for (const [code, words] of Object.entries(entry.options)) {
        // Words, not the code: a code such as "buck-boost" or "lifepo4" is the API's, not the crew's.
        expect(words).not.toBe(code)
        expect(words).toMatch(/^\p{Lu}/u)
      }
    },
  )

  it('names each yes-or-no field in its message as the forms do', () => {
    // A wiring check: the schema's message reads the flag's label from the catalogue.
    expect(amplifierSchema.shape.bridged.safeParse('yes').error?.issues[0]?.message).toBe(
      `${FLAGS['amplifier.bridged'].label} must be true or false`,
    )
    const children = estimateRequestSchema.shape.childrenPresent.safeParse('yes')
    expect(children.error?.issues[0]?.message).toBe(
      `${FLAGS.childrenPresent.label} must be true or false`,
    )
  })
})

function escape(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
}
