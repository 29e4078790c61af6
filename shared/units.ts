// Edge conversions for forms and display. The engine itself works in SI (docs/model.md, "Units").

const METRES_PER_FOOT = 0.3048 // exact, international yard and pound agreement (1959)

export function metresToFeet(lengthM: number): number {
  return lengthM / METRES_PER_FOOT
}

export function feetToMetres(lengthFt: number): number {
  return lengthFt * METRES_PER_FOOT
}

export function celsiusToFahrenheit(temperatureC: number): number {
  return (temperatureC * 9) / 5 + 32
}

export function fahrenheitToCelsius(temperatureF: number): number {
  return ((temperatureF - 32) * 5) / 9
}

// Source: ASTM B258, d = 0.127 mm × 92^((36 − n)/39); 0/0 (2/0) is n = −1, 000 is −2, 0000 is −3.
export function awgDiameterMm(awg: number): number {
  return 0.127 * 92 ** ((36 - awg) / 39)
}

export function awgToAreaMm2(awg: number): number {
  const diameterMm = awgDiameterMm(awg)
  return (Math.PI / 4) * diameterMm * diameterMm
}

/** The (fractional) gauge of a round conductor of this area; round it for display. */
export function areaMm2ToAwg(areaMm2: number): number {
  const diameterMm = Math.sqrt((4 * areaMm2) / Math.PI)
  return 36 - 39 * (Math.log(diameterMm / 0.127) / Math.log(92))
}

const KILOGRAMS_PER_POUND = 0.45359237 // exact, international yard and pound agreement (1959)

export function kilogramsToPounds(massKg: number): number {
  return massKg / KILOGRAMS_PER_POUND
}

export function poundsToKilograms(massLb: number): number {
  return massLb * KILOGRAMS_PER_POUND
}
