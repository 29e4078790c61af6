import { Router, type Request } from 'express'
import { and, asc, desc, eq, sql, type SQL } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import { ApiError, parseInput } from '../http/errors'
import { rowIdParam } from '../http/params'
import {
  RESOURCE_NAME_MAX,
  SORT_FIELDS,
  listQuerySchema,
  type ListQuery,
  type ListResponse,
  type SavedItemMeta,
  type SortField,
} from '../../shared/schemas/resources'
import { itemMeta, peopleOf, type OwnedTable } from '../resources/owned-table'
import {
  insertOwnedItem,
  type ItemBody,
  type ResourceContext,
  type ResourceDefinition,
  type WriteScope,
} from '../resources/resource-definition'

/*
 * The one way to serve a team-owned, versioned resource (docs/api.md, "The team's parts, rigs and plans"):
 *
 *   GET    /            viewer  ?limit&offset&sort&q → { items, total } (list items)
 *   POST   /            editor  → 201 item
 *   GET    /:id         viewer  → item                       (:id is e.g. :packId)
 *   PUT    /:id         editor  body + version → item (409 when the version is stale)
 *   DELETE /:id         editor  → 204 (a resource may refuse, or say what else it did)
 *   POST   /:id/duplicate editor → 201 item
 *
 * Each resource says how a body becomes a row of its own table and how a row becomes an item
 * (server/resources/resource-definition.ts). Every write runs in one synchronous transaction.
 */

function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (character) => `\\${character}`)}%`
}

export function teamResourceRouter<
  Table extends OwnedTable,
  Body extends ItemBody,
  Item extends SavedItemMeta,
  ListItem extends SavedItemMeta,
>(context: ResourceContext, definition: ResourceDefinition<Table, Body, Item, ListItem>): Router {
  const { db, clock } = context
  const { rows, noun, idParam: idName } = definition
  const { table } = rows
  type Row = Table['$inferSelect']
  const router = Router({ mergeParams: true })

  const notFound = `No such ${noun} in this team.`
  const idParam = (req: Request) => rowIdParam(req, idName, notFound)

  function requireRow(tx: Queryable, teamId: number, id: number): Row {
    const row = rows.find(tx, teamId, id)
    if (!row) throw new ApiError(404, 'not-found', notFound)
    return row
  }

  /** The list's rows: the resource's list form where it has one (events: stored, not worked out). */
  function presentList(tx: Queryable, found: Row[]): SavedItemMeta[] {
    const people = peopleOf(tx, found)
    return found.map((row) => {
      const meta = itemMeta(row, people)
      return definition.toListItem
        ? definition.toListItem(tx, row, meta)
        : definition.toItem(tx, row, meta)
    })
  }

  function presentOne(tx: Queryable, row: Row): Item {
    return definition.toItem(tx, row, itemMeta(row, peopleOf(tx, [row])))
  }

  const sortColumns: Record<SortField, SQL> = {
    name: sql`${table.name} collate nocase`,
    createdAt: sql`${table.createdAtMs}`,
    updatedAt: sql`${table.updatedAtMs}`,
  }

  function orderOf(sort: ListQuery['sort']): SQL[] {
    const field = SORT_FIELDS.find((name) => sort === name || sort === `-${name}`) ?? 'name'
    const column = sortColumns[field]
    return [sort?.startsWith('-') ? desc(column) : asc(column), asc(table.id)]
  }

  function list(teamId: number, query: ListQuery): ListResponse<SavedItemMeta> {
    const conditions = [eq(table.teamId, teamId)]
    if (query.q) conditions.push(sql`${table.name} like ${likePattern(query.q)} escape '\\'`)
    const where = and(...conditions)
    const found = rows.list(db, {
      where,
      orderBy: orderOf(query.sort),
      limit: query.limit,
      offset: query.offset,
    })
    return { items: presentList(db, found), total: rows.count(db, where) }
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
      return presentOne(tx, requireRow(tx, actor.teamId, id))
    })
  }

  function update(actor: Omit<WriteScope, 'tx'>, id: number, version: number, body: Body): Item {
    return db.transaction((tx) => {
      const scope = { ...actor, tx }
      const current = requireRow(tx, actor.teamId, id)
      if (current.version !== version) {
        throw new ApiError(
          409,
          'stale-version',
          `Someone else saved this ${noun} after you opened it: you sent version ${version}, the saved one is version ${current.version}. Nothing was written.`,
        )
      }
      definition.checkBody?.(scope, body)
      const owned = {
        teamId: current.teamId,
        name: body.name,
        notes: body.notes ?? '',
        createdByUserId: current.createdByUserId,
        updatedByUserId: actor.userId,
        createdAtMs: current.createdAtMs,
        updatedAtMs: actor.nowMs,
        version: current.version + 1,
      }
      rows.update(tx, actor.teamId, id, current.version, definition.values(body, owned))
      definition.afterWrite?.(scope, id, body)
      return presentOne(tx, requireRow(tx, actor.teamId, id))
    })
  }

  router.get('/', requireTeamRole('viewer'), (req, res) => {
    const query = parseInput(listQuerySchema, req.query, 'query')
    res.json(list(teamMembership(req).teamId, query))
  })

  router.get(`/:${idName}`, requireTeamRole('viewer'), (req, res) => {
    const { teamId } = teamMembership(req)
    res.json(presentOne(db, requireRow(db, teamId, idParam(req))))
  })

  router.post('/', requireTeamRole('editor'), (req, res) => {
    const body = parseInput(definition.createSchema, req.body)
    res.status(201).json(create(writer(req), body))
  })

  router.put(`/:${idName}`, requireTeamRole('editor'), (req, res) => {
    const id = idParam(req)
    const { version } = parseInput(definition.updateSchema, req.body)
    // The same body without `version` (the create schema drops what it does not name).
    const body = parseInput(definition.createSchema, req.body)
    res.json(update(writer(req), id, version, body))
  })

  router.delete(`/:${idName}`, requireTeamRole('editor'), (req, res) => {
    const actor = writer(req)
    const id = idParam(req)
    const outcome = db.transaction((tx) => {
      const row = requireRow(tx, actor.teamId, id)
      const result = definition.beforeDelete?.({ ...actor, tx }, row, teamMembership(req))
      rows.remove(tx, actor.teamId, id)
      return result
    })
    if (outcome) res.json(outcome)
    else res.status(204).end()
  })

  router.post(`/:${idName}/duplicate`, requireTeamRole('editor'), (req, res) => {
    const actor = writer(req)
    const original = requireRow(db, actor.teamId, idParam(req))
    const copyName = `${original.name} (copy)`.slice(0, RESOURCE_NAME_MAX)
    const body = parseInput(definition.createSchema, {
      ...definition.bodyOf(db, original),
      name: copyName,
    })
    res.status(201).json(create(actor, body))
  })

  return router
}
