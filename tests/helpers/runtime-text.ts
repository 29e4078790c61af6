/**
 * Minutes in a runtime as the bench shows it ("3 h 05 min", "1,204 h 00 min", "45 min",
 * "under 1 min"), so a test can compare two runtimes by size rather than by text.
 */
export function minutesOfRuntimeText(text: string): number {
  const flat = text.replace(/\s+/g, ' ').trim()
  if (flat.startsWith('under')) return 0
  const match = /^(?:([\d,]+) h )?(\d+) min$/.exec(flat)
  if (!match) throw new Error(`Not a runtime as the bench writes it: "${text}"`)
  const hours = match[1] === undefined ? 0 : Number(match[1].replace(/,/g, ''))
  return hours * 60 + Number(match[2])
}
