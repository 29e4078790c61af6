/** Linear interpolation in rows of [x, y] sorted by x; clamped to the first and last rows. */
export function interpolate(rows: readonly (readonly [number, number])[], x: number): number {
  const first = rows[0]
  const last = rows[rows.length - 1]
  if (!first || !last) return 0
  if (x <= first[0]) return first[1]
  if (x >= last[0]) return last[1]
  for (let i = 1; i < rows.length; i++) {
    const upper = rows[i]!
    if (x <= upper[0]) {
      const lower = rows[i - 1]!
      const share = (x - lower[0]) / (upper[0] - lower[0])
      return lower[1] + share * (upper[1] - lower[1])
    }
  }
  return last[1]
}
