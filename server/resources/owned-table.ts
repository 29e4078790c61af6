import { and, count, eq, inArray, type SQL } from 'drizzle-orm'
import type { SQLiteUpdateSetSource } from 'drizzle-orm/sqlite-core'
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

/** The shared columns a write sets: everything of `OwnedRow` but the id. */
export type OwnedValues = Omit<OwnedRow, 'id'>

/** Which rows of a list, in which order (the router builds these from the query). */
export interface RowSelection {
  where: SQL | undefined
  orderBy: SQL[]
  limit: number
  offset: number
}

/**
 * Reads and writes of one owned table, typed by that table: a definition holds the rows of its
 * own table (`ownedRowsOf(packs)`), so a wrong column or value does not compile.
 */
export interface OwnedRows<Table extends OwnedTable> {
  table: Table
  find(tx: Queryable, teamId: number, id: number): Table['$inferSelect'] | undefined
  list(tx: Queryable, selection: RowSelection): Table['$inferSelect'][]
  count(tx: Queryable, where: SQL | undefined): number
  insert(tx: Queryable, values: Table['$inferInsert']): number
  /** Replaces the row's values if it is still at `version`. */
  update(
    tx: Queryable,
    teamId: number,
    id: number,
    version: number,
    values: Table['$inferInsert'],
  ): void
  remove(tx: Queryable, teamId: number, id: number): void
}

export function ownedRowsOf<Table extends OwnedTable>(table: Table) {
  const whereOwned = (teamId: number, id: number) => and(eq(table.teamId, teamId), eq(table.id, id))
  return {
    table,
    find: (tx: Queryable, teamId: number, id: number) =>
      tx.select().from(table).where(whereOwned(teamId, id)).get(),
    list: (tx: Queryable, selection: RowSelection) =>
      tx
        .select()
        .from(table)
        .where(selection.where)
        .orderBy(...selection.orderBy)
        .limit(selection.limit)
        .offset(selection.offset)
        .all(),
    count: (tx: Queryable, where: SQL | undefined) =>
      tx.select({ total: count() }).from(table).where(where).get()?.total ?? 0,
    insert: (tx: Queryable, values: Table['$inferInsert']) =>
      tx.insert(table).values(values).returning({ id: table.id }).get().id,
    update: (
      tx: Queryable,
      teamId: number,
      id: number,
      version: number,
      values: SQLiteUpdateSetSource<Table>,
    ) => {
      tx.update(table)
        .set(values)
        .where(and(whereOwned(teamId, id), eq(table.version, version)))
        .run()
    },
    remove: (tx: Queryable, teamId: number, id: number) => {
      tx.delete(table).where(whereOwned(teamId, id)).run()
    },
  }
}

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
