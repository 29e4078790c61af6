/**
 * A part's values as one comparable string (keys sorted, unset fields left out): the bench
 * recognises a library or team part by it, and a rig uses a saved part only while they match.
 */
export function partFingerprint(part: object, ignoredFields: readonly string[] = []): string {
  const entries = Object.entries(part).filter(
    ([key, value]) => value !== undefined && !ignoredFields.includes(key),
  )
  return JSON.stringify(entries.sort(([a], [b]) => a.localeCompare(b)))
}
