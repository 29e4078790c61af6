import { describe, expect, it } from 'vitest'
import { estimate } from '../../shared/engine'
import {
  exampleRigs,
  libraryAccessories,
  libraryConverters,
  libraryAmplifiers,
  libraryItem,
  libraryPacks,
  librarySpeakers,
  type LibraryPack,
} from '../../shared/library'
import {
  accessorySchema,
  amplifierSchema,
  estimateRequestSchema,
  packSchema,
  speakersSchema,
  type EstimateRequest,
} from '../../shared/schemas/estimate'

// A plain rig around one part, so the engine reports that part's derived figures.
const baseRig: EstimateRequest = exampleRigs[0]!.rig

function withPack(pack: LibraryPack['part']): EstimateRequest {
  return { ...baseRig, pack, leads: undefined, accessories: [] }
}

function packsOfClass(label: string): LibraryPack[] {
  return libraryPacks.filter((item) => item.label.includes(label))
}

describe('the built-in library', () => {
  it('passes the shared schemas, item by item', () => {
    for (const item of libraryPacks)
      expect(packSchema.safeParse(item.part).success, item.id).toBe(true)
    for (const item of libraryAmplifiers)
      expect(amplifierSchema.safeParse(item.part).success, item.id).toBe(true)
    for (const item of librarySpeakers)
      expect(speakersSchema.safeParse(item.part).success, item.id).toBe(true)
    for (const item of libraryAccessories)
      expect(accessorySchema.safeParse(item.part).success, item.id).toBe(true)
    for (const rig of exampleRigs)
      expect(estimateRequestSchema.safeParse(rig.rig).success, rig.id).toBe(true)
  })

  it('gives converter modules efficiencies in the range their datasheets give', () => {
    // Source: common practice: small switching modules are 75–95 % efficient at a few watts;
    // a linear regulator has none of its own (V_out/V_in, docs/model.md §6).
    for (const { id, part } of libraryConverters) {
      if (part.feed === 'linear') expect(part.efficiency, id).toBeUndefined()
      else {
        expect(part.efficiency, id).toBeGreaterThanOrEqual(0.75)
        expect(part.efficiency, id).toBeLessThanOrEqual(0.95)
      }
    }
  })

  it('gives every item a unique stable id and a plain label without trade marks', () => {
    const all = [
      ...libraryPacks,
      ...libraryAmplifiers,
      ...librarySpeakers,
      ...libraryAccessories,
      ...libraryConverters,
      ...exampleRigs,
    ]
    const ids = all.map((item) => item.id)
    expect(new Set(ids).size).toBe(ids.length)
    for (const item of all) {
      expect(item.id).toMatch(/^[a-z0-9-]+$/)
      expect(item.label).not.toMatch(/[™®©]/)
    }
    expect(() => libraryItem(libraryPacks, 'no-such-pack')).toThrow(/no-such-pack/)
  })

  // Source: common practice for tool packs: "12 V max" = 3 Li-ion cells in series (10.8 V
  // nominal, 12.6 V full), "20 V max" = 5 cells (18 V, 21 V), "40 V max" = 10 cells (36 V,
  // 42 V), "60 V max" = 15 cells (54 V, 63 V); 3.6 V nominal and 4.2 V full per cell.
  it.each([
    ['"12 V max"', 3, 10.8, 12.6],
    ['"20 V max"', 5, 18, 21],
    ['"40 V max"', 10, 36, 42],
    ['"60 V max"', 15, 54, 63],
  ])('keeps the tool-pack voltage class %s', (label, seriesCells, nominalV, fullV) => {
    const packs = packsOfClass(label)
    expect(packs.length).toBeGreaterThanOrEqual(3)
    for (const item of packs) {
      expect(item.part.chemistry).toBe('li-ion')
      expect(item.part.seriesCells).toBe(seriesCells)
      const result = estimate(withPack(item.part))
      expect(result.pack.nominalV).toBeCloseTo(nominalV, 6)
      expect(result.pack.fullV).toBeCloseTo(fullV, 6)
    }
  })

  it('spans tool packs from 2 to 12 Ah', () => {
    const capacitiesAh = libraryPacks
      .filter((item) => item.label.startsWith('Tool pack'))
      .map((item) => item.part.cellCapacityAh * item.part.parallelCells)
    expect(Math.min(...capacitiesAh)).toBeCloseTo(2, 6)
    expect(Math.max(...capacitiesAh)).toBeCloseTo(12, 6)
  })

  // Source: common practice: a "12 V" LiFePO4 battery is 4 cells of 3.2 V (12.8 V); a "12 V"
  // lead-acid battery is 6 cells of 2 V.
  it('keeps the 12 V battery classes', () => {
    const lifepo4 = libraryPacks.filter((item) => item.part.chemistry === 'lifepo4')
    const leadAcid = libraryPacks.filter((item) => item.part.chemistry === 'lead-acid')
    expect(lifepo4.length).toBeGreaterThanOrEqual(2)
    expect(leadAcid.length).toBeGreaterThanOrEqual(2)
    for (const item of lifepo4)
      expect(estimate(withPack(item.part)).pack.nominalV).toBeCloseTo(12.8, 6)
    for (const item of leadAcid)
      expect(estimate(withPack(item.part)).pack.nominalV).toBeCloseTo(12, 6)
    expect(libraryPacks.some((item) => item.part.chemistry === 'nimh')).toBe(true)
  })

  // Source: from memory, usual specific energy of whole packs and batteries: Li-ion tool packs
  // 90–200 Wh/kg, LiFePO4 batteries 70–160 Wh/kg, AGM lead-acid 25–45 Wh/kg, NiMH packs 40–100 Wh/kg.
  it.each([
    ['li-ion', 90, 200],
    ['lifepo4', 70, 160],
    ['lead-acid', 25, 45],
    ['nimh', 40, 100],
  ] as const)(
    'gives %s packs a mass and price that make sense together',
    (chemistry, low, high) => {
      for (const item of libraryPacks.filter((pack) => pack.part.chemistry === chemistry)) {
        expect(item.part.price, item.id).toBeGreaterThan(0)
        const { whPerKg } = estimate(withPack(item.part)).pack
        expect(whPerKg, item.id).toBeGreaterThanOrEqual(low)
        expect(whPerKg, item.id).toBeLessThanOrEqual(high)
      }
    },
  )

  // Source: IATA lithium battery guidance: 100 Wh and 160 Wh limits on nominal Wh.
  it('puts an 18 V 5 Ah pack (90 Wh) in the carry-on class and a 54 V 12 Ah pack above 160 Wh', () => {
    const small = libraryItem(libraryPacks, 'li-ion-5s-5ah').part
    const large = libraryItem(libraryPacks, 'li-ion-15s-12ah').part
    expect(estimate(withPack(small)).airlineClass).toBe('up-to-100wh')
    expect(estimate(withPack(large)).airlineClass).toBe('over-160wh')
  })

  // Source: common practice: 3 × 8 Ω in parallel ≈ 2.67 Ω; two such banks in series ≈ 5.33 Ω.
  it('wires the speaker arrangements to the loads their labels state', () => {
    const rig = (id: string) => ({
      ...baseRig,
      speakers: libraryItem(librarySpeakers, id).part,
    })
    expect(estimate(rig('spk-3x-8ohm-parallel')).loadOhm).toBeCloseTo(8 / 3, 2)
    expect(estimate(rig('spk-column-6x-8ohm')).loadOhm).toBeCloseTo(16 / 3, 2)
    expect(estimate(rig('spk-2x-4ohm-series')).loadOhm).toBeCloseTo(8, 6)
  })

  it('gives every amplifier a datasheet point that a real output stage can reach', () => {
    // docs/model.md §4: the clean peak swing √(2·P·R) must fit in the supply (bridged) or half of it,
    // otherwise the derived output resistance is clamped to 0.
    for (const item of libraryAmplifiers) {
      const amp = item.part
      const swingV = amp.bridged ? amp.ratedSupplyV : amp.ratedSupplyV / 2
      expect(Math.sqrt(2 * amp.ratedPowerW * amp.ratedLoadOhm), item.id).toBeLessThan(swingV)
      const result = estimate({ ...baseRig, amplifier: amp })
      expect(result.amplifier.outputResistanceOhm, item.id).toBeGreaterThan(0)
    }
    const classes = new Set(libraryAmplifiers.map((item) => item.part.class))
    expect(classes.has('d') && classes.has('ab')).toBe(true)
    expect(libraryAmplifiers.some((item) => !item.part.bridged)).toBe(true)
  })

  // Source: USB 2.0 specification, VBUS 4.75–5.25 V.
  it('feeds every USB accessory through a 5 V converter inside the USB window', () => {
    const usb = libraryAccessories.filter((item) => item.label.includes('USB'))
    expect(usb.length).toBeGreaterThanOrEqual(3)
    for (const item of usb) {
      expect(item.part.feed).toBe('buck')
      expect(item.part.outputV).toBe(5)
      expect(item.part.inputMinV).toBe(4.75)
      expect(item.part.inputMaxV).toBe(5.25)
    }
  })

  it('starts the bench from example rigs that run for a while on their own packs', () => {
    for (const example of exampleRigs) {
      const result = estimate(example.rig)
      expect(result.runtimeHours, example.id).toBeGreaterThan(1)
      for (const converter of result.converters) expect(converter.fits, converter.label).toBe(true)
      // ours: a demo rig shows a safe build, so nothing in it is a danger
      const dangers = result.warnings.filter((warning) => warning.severity === 'danger')
      expect(
        dangers.map((warning) => warning.code),
        example.id,
      ).toEqual([])
    }
  })
})
