import { describe, expect, it } from 'vitest'
import {
  areaMm2ToAwg,
  awgDiameterMm,
  awgToAreaMm2,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  feetToMetres,
  kilogramsToPounds,
  metresToFeet,
  poundsToKilograms,
} from '../../shared/units'

describe('units', () => {
  it('converts feet and metres', () => {
    // Source: international yard and pound agreement (1959): 1 ft = 0.3048 m exactly
    expect(feetToMetres(1)).toBe(0.3048)
    expect(metresToFeet(3.048)).toBeCloseTo(10, 12)
  })

  it('converts kilograms and pounds', () => {
    // Source: international yard and pound agreement (1959): 1 lb = 0.45359237 kg exactly
    expect(poundsToKilograms(1)).toBe(0.45359237)
    expect(kilogramsToPounds(0.45359237)).toBe(1)
    // A 0.95 kg tool pack weighs about 2.09 lb
    expect(kilogramsToPounds(0.95)).toBeCloseTo(2.0944, 4)
  })

  it('converts degrees Celsius and Fahrenheit', () => {
    // Source: definition of the Fahrenheit scale: water boils at 212 °F, −40 is the same on both
    expect(celsiusToFahrenheit(100)).toBe(212)
    expect(celsiusToFahrenheit(-40)).toBe(-40)
    expect(fahrenheitToCelsius(32)).toBe(0)
  })

  it('gives AWG diameters and areas per ASTM B258', () => {
    // Source: ASTM B258, d = 0.127 mm × 92^((36 − n)/39): 36 AWG is 0.127 mm, 0000 AWG 11.684 mm
    expect(awgDiameterMm(36)).toBeCloseTo(0.127, 6)
    expect(awgDiameterMm(-3)).toBeCloseTo(11.684, 3)
    // Source: ASTM B258 table: 18 AWG is 1.024 mm, 0.823 mm²; 10 AWG is 2.588 mm, 5.26 mm²
    expect(awgDiameterMm(18)).toBeCloseTo(1.024, 3)
    expect(awgToAreaMm2(18)).toBeCloseTo(0.823, 3)
    expect(awgToAreaMm2(10)).toBeCloseTo(5.26, 2)
  })

  it('turns an area back into its gauge', () => {
    // Source: ASTM B258: 0.823 mm² is 18 AWG; every three gauges halve the area (common practice)
    expect(areaMm2ToAwg(0.823)).toBeCloseTo(18, 2)
    expect(areaMm2ToAwg(awgToAreaMm2(12) / 2)).toBeCloseTo(15, 1)
  })
})
