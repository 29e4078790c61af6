import type { LibraryItem } from './types'

/** The item with this id; throws for an unknown id, which is a bug in the caller's constant. */
export function libraryItem<Part>(
  items: readonly LibraryItem<Part>[],
  id: string,
): LibraryItem<Part> {
  const item = items.find((candidate) => candidate.id === id)
  if (!item) throw new Error(`No library item "${id}"`)
  return item
}
