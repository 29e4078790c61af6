import { Router, type Request } from 'express'
import { and, asc, count, desc, eq, sql, type SQL } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import { ApiError, parseInput } from '../http/errors'
import { rowIdParam } from '../http/params'
import {
  RESOURCE_NAME_MAX,
  listQuerySchema,
  type ListQuery,
  type ListResponse,
  type SavedItemMeta,
  type SortField,
} from '../../shared/schemas/resources'
import { itemMeta, peopleOf, type OwnedRow, type OwnedTable } from '../resources/owned-table'
import {
  insertOwnedItem,
  ownedColumnsOf,
  type ItemBody,
  type ResourceContext,
  type ResourceDefinition,
  type WriteScope,
} from '../resources/resource-definition'

/*
 * The one way to serve a team-owned, versioned resource (api.md, "Team-owned resources"):
 *
 *   GET    /            viewer  ?limit&offset&sort&q → { items, total }
 *   POST   /            editor  → 201 item
 *   GET    /:id         viewer  → item                       (:id is e.g. :packId)
 *   PUT    /:id         editor  body + version → item (409 when the version is stale)
 *   DELETE /:id         editor  → 204 (a resource may refuse, or say what else it did)
 *   POST   /:id/duplicate editor → 201 item
 *
 * Each resource says how a body becomes columns and how a row becomes an item
 * (resource-definition.ts). Every write runs in one synchronous transaction.
 */

function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (character) => `\\${character}`)}%`
}

export function teamResourceRouter<
  Table extends OwnedTable,
  Body extends ItemBody,
  Item extends SavedItemMeta,
>(context: ResourceContext, definition: ResourceDefinition<Table, Body, Item>): Router {
  const { db, clock } = context
  const { table, noun, idParam: idName } = definition
  const owned = ownedColumnsOf(table)
  type Row = Table['$inferSelect']
  const router = Router({ mergeParams: true })

  const notFound = `No such ${noun} in this team.`
  const idParam = (req: Request) => rowIdParam(req, idName, notFound)

  function whereOwned(teamId: number, id: number): SQL {
    return and(eq(owned.teamId, teamId), eq(owned.id, id)) as SQL
  }

  function findRow(tx: Queryable, teamId: number, id: number): Row | undefined {
    return tx.select().from(owned).where(whereOwned(teamId, id)).get() as Row | undefined
  }

  function requireRow(tx: Queryable, teamId: number, id: number): Row {
    const row = findRow(tx, teamId, id)
    if (!row) throw new ApiError(404, 'not-found', notFound)
    return row
  }

  function present(tx: Queryable, rows: Row[]): Item[] {
    const people = peopleOf(tx, rows as OwnedRow[])
    return rows.map((row) => definition.toItem(tx, row, itemMeta(row as OwnedRow, people)))
  }

  const sortColumns: Record<SortField, SQL> = {
    name: sql`${owned.name} collate nocase`,
    createdAt: sql`${owned.createdAtMs}`,
    updatedAt: sql`${owned.updatedAtMs}`,
  }

  function list(teamId: number, query: ListQuery): ListResponse<Item> {
    const conditions = [eq(owned.teamId, teamId)]
    if (query.q) conditions.push(sql`${owned.name} like ${likePattern(query.q)} escape '\\'`)
    const where = and(...conditions)
    const sort = query.sort ?? 'name'
    const descending = sort.startsWith('-')
    const column = sortColumns[(descending ? sort.slice(1) : sort) as SortField]
    const rows = db
      .select()
      .from(owned)
      .where(where)
      .orderBy(descending ? desc(column) : asc(column), asc(owned.id))
      .limit(query.limit)
      .offset(query.offset)
      .all() as Row[]
    const total = db.select({ total: count() }).from(owned).where(where).get()?.total ?? 0
    return { items: present(db, rows), total }
  }

  /** The team, the signed-in user and the time of a write request. */
  function writer(req: Request): Omit<WriteScope, 'tx'> {
    return {
      teamId: teamMembership(req).teamId,
      userId: signedInUser(req).user.id,
      nowMs: clock().getTime(),
    }
  }

  function create(actor: Omit<WriteScope, 'tx'>, body: Body): Item {
    return db.transaction((tx) => {
      const id = insertOwnedItem({ ...actor, tx }, definition, body)
      return present(tx, [requireRow(tx, actor.teamId, id)])[0] as Item
    })
  }

  function update(
    actor: Omit<WriteScope, 'tx'>,
    id: number,
    body: Body & { version: number },
  ): Item {
    return db.transaction((tx) => {
      const scope = { ...actor, tx }
      const current = requireRow(tx, actor.teamId, id) as OwnedRow
      if (current.version !== body.version) {
        throw new ApiError(
          409,
          'stale-version',
          `Someone else saved this ${noun} after you opened it: you sent version ${body.version}, the saved one is version ${current.version}. Nothing was written.`,
        )
      }
      definition.checkBody?.(scope, body)
      tx.update(owned)
        .set({
          ...(definition.columns(body) as object),
          name: body.name,
          notes: body.notes ?? '',
          updatedByUserId: actor.userId,
          updatedAtMs: actor.nowMs,
          version: current.version + 1,
        } as Partial<typeof owned.$inferInsert>)
        .where(and(whereOwned(actor.teamId, id), eq(owned.version, current.version)))
        .run()
      definition.afterWrite?.(scope, id, body)
      return present(tx, [requireRow(tx, actor.teamId, id)])[0] as Item
    })
  }

  router.get('/', requireTeamRole('viewer'), (req, res) => {
    const query = parseInput(listQuerySchema, req.query, 'query')
    res.json(list(teamMembership(req).teamId, query))
  })

  router.get(`/:${idName}`, requireTeamRole('viewer'), (req, res) => {
    const { teamId } = teamMembership(req)
    res.json(present(db, [requireRow(db, teamId, idParam(req))])[0])
  })

  router.post('/', requireTeamRole('editor'), (req, res) => {
    const body = parseInput(definition.createSchema, req.body)
    res.status(201).json(create(writer(req), body))
  })

  router.put(`/:${idName}`, requireTeamRole('editor'), (req, res) => {
    const id = idParam(req)
    const body = parseInput(definition.updateSchema, req.body)
    res.json(update(writer(req), id, body))
  })

  router.delete(`/:${idName}`, requireTeamRole('editor'), (req, res) => {
    const actor = writer(req)
    const id = idParam(req)
    const outcome = db.transaction((tx) => {
      const row = requireRow(tx, actor.teamId, id)
      const result = definition.beforeDelete?.({ ...actor, tx }, row, teamMembership(req))
      tx.delete(owned).where(whereOwned(actor.teamId, id)).run()
      return result
    })
    if (outcome) res.json(outcome)
    else res.status(204).end()
  })

  router.post(`/:${idName}/duplicate`, requireTeamRole('editor'), (req, res) => {
    const actor = writer(req)
    const original = requireRow(db, actor.teamId, idParam(req))
    const source = definition.bodyOf(db, original) as Record<string, unknown>
    const copyName = `${(original as OwnedRow).name} (copy)`.slice(0, RESOURCE_NAME_MAX)
    const body = parseInput(definition.createSchema, { ...source, name: copyName })
    res.status(201).json(create(actor, body))
  })

  return router
}
