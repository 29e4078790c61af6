/**
 * A problem with one field, as the shared zod schemas report it (`path` as a list of keys) or as
 * the API sends it (`path` already dotted: `pack.seriesCells`, `accessories.0.powerW`).
 */
export interface PathMessage {
  readonly path: string | readonly PropertyKey[]
  readonly message: string
}

/** The dotted name of a field (`accessories.0.powerW`), the key every form looks messages up by. */
export function dottedPath(path: string | readonly PropertyKey[]): string {
  return typeof path === 'string' ? path : path.map(String).join('.')
}

/**
 * Field path → the message to show beside that field. A field keeps its first message, the one to
 * fix first; `first` holds messages that go ahead of every issue (text that is not a number: what
 * the field shows, or what the server said of a field).
 */
export function messagesByPath(
  issues: readonly PathMessage[],
  first: ReadonlyMap<string, string> = new Map(),
): Map<string, string> {
  const messages = new Map(first)
  for (const issue of issues) {
    const path = dottedPath(issue.path)
    if (!messages.has(path)) messages.set(path, issue.message)
  }
  return messages
}
