import type { z } from 'zod'
import type { AppDatabase } from '../db/client'
import type { Queryable } from '../db/queryable'
import type { Clock } from '../clock'
import type { RequestMembership } from '../auth/authenticate'
import type { SavedItemMeta } from '../../shared/schemas/resources'
import type { OwnedRows, OwnedTable, OwnedValues } from './owned-table'

export interface ResourceContext {
  db: AppDatabase
  clock: Clock
}

/** Who writes, and when. */
export interface WriteActor {
  userId: number
  nowMs: number
}

/** Facts a hook may need about the write in progress. */
export interface WriteScope extends WriteActor {
  tx: Queryable
  teamId: number
}

/** A delete hook's answer: nothing (204), or what the delete also did (200 with this body). */
export type DeleteOutcome = Record<string, unknown> | undefined

export type ItemBody = { name: string; notes?: string | undefined }

/** How one team-owned resource is stored and shown; team-resource-router.ts serves it. */
export interface ResourceDefinition<
  Table extends OwnedTable,
  Body extends ItemBody,
  Item extends SavedItemMeta,
  ListItem extends SavedItemMeta = Item,
> {
  /** Reads and writes of the resource's own table (`ownedRowsOf(table)`). */
  rows: OwnedRows<Table>
  /** "pack", "speaker set": used in messages. */
  noun: string
  /** The path parameter naming the item, e.g. `packId` (as in `/packs/:packId/...`). */
  idParam: string
  createSchema: z.ZodType<Body>
  updateSchema: z.ZodType<Body & { version: number }>
  /** The whole row for a body: the shared columns given, and the resource's own (a rig runs the engine). */
  values(body: Body, owned: OwnedValues): Table['$inferInsert']
  /** The body that would recreate the row: duplicates go through create with it. */
  bodyOf(tx: Queryable, row: Table['$inferSelect']): Record<string, unknown>
  toItem(tx: Queryable, row: Table['$inferSelect'], meta: SavedItemMeta): Item
  /** A row of the list, when it shows less than the item (what is stored, nothing worked out). */
  toListItem?(tx: Queryable, row: Table['$inferSelect'], meta: SavedItemMeta): ListItem
  /** Checks inside the write transaction (references to other rows); throw ApiError to refuse. */
  checkBody?(scope: WriteScope, body: Body): void
  /** Writes beside the row, e.g. link tables, after insert or update. */
  afterWrite?(scope: WriteScope, id: number, body: Body): void
  /** Runs before the row is deleted, in the same transaction; may refuse or detach. */
  beforeDelete?(
    scope: WriteScope,
    row: Table['$inferSelect'],
    membership: RequestMembership,
  ): DeleteOutcome
}

/** The shared columns of a new item written by `scope`. */
export function newItemValues(scope: WriteScope, body: ItemBody): OwnedValues {
  return {
    teamId: scope.teamId,
    name: body.name,
    notes: body.notes ?? '',
    createdByUserId: scope.userId,
    updatedByUserId: scope.userId,
    createdAtMs: scope.nowMs,
    updatedAtMs: scope.nowMs,
    version: 1,
  }
}

/**
 * Inserts one item from a parsed body, with its side rows; returns its id. Call inside a
 * transaction: the routes and the demo seed both create items this way.
 */
export function insertOwnedItem<Table extends OwnedTable, Body extends ItemBody>(
  scope: WriteScope,
  definition: ResourceDefinition<Table, Body, SavedItemMeta>,
  body: Body,
): number {
  definition.checkBody?.(scope, body)
  const id = definition.rows.insert(scope.tx, definition.values(body, newItemValues(scope, body)))
  definition.afterWrite?.(scope, id, body)
  return id
}
