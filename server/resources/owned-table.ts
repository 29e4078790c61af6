import { inArray } from 'drizzle-orm'
import { users } from '../db/schema'
import { accessories, amplifiers, packs, plans, rigs, speakers } from '../db/schema-resources'
import type { events } from '../db/schema-events'
import type { Queryable } from '../db/queryable'
import type { PersonRef, SavedItemMeta } from '../../shared/schemas/resources'

/** Every team-owned, versioned table (they share `ownedItemColumns`). */
export type OwnedTable =
  | typeof packs
  | typeof amplifiers
  | typeof speakers
  | typeof accessories
  | typeof rigs
  | typeof plans
  | typeof events

/** The columns all owned tables share, as read from any of them. */
export interface OwnedRow {
  id: number
  teamId: number
  name: string
  notes: string
  createdByUserId: number | null
  updatedByUserId: number | null
  createdAtMs: number
  updatedAtMs: number
  version: number
}

/** Names of the people behind `created_by` and `updated_by` of these rows, by user id. */
export function peopleOf(db: Queryable, rows: readonly OwnedRow[]): Map<number, PersonRef> {
  const ids = new Set<number>()
  for (const row of rows) {
    if (row.createdByUserId !== null) ids.add(row.createdByUserId)
    if (row.updatedByUserId !== null) ids.add(row.updatedByUserId)
  }
  if (ids.size === 0) return new Map()
  const found = db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(inArray(users.id, [...ids]))
    .all()
  return new Map(found.map((person) => [person.id, person]))
}

export function itemMeta(row: OwnedRow, people: Map<number, PersonRef>): SavedItemMeta {
  const person = (id: number | null) => (id === null ? null : (people.get(id) ?? null))
  return {
    id: row.id,
    version: row.version,
    name: row.name,
    notes: row.notes,
    createdAt: new Date(row.createdAtMs).toISOString(),
    updatedAt: new Date(row.updatedAtMs).toISOString(),
    createdBy: person(row.createdByUserId),
    updatedBy: person(row.updatedByUserId),
  }
}
