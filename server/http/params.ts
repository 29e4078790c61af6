import type { Request } from 'express'
import { ApiError } from './errors'

// Row ids are SQLite integers from 1; anything else in the path names nothing.
const rowIdPattern = /^[1-9][0-9]{0,15}$/

/** The numeric id in a path parameter, or undefined when it is missing or not a row id. */
export function parseRowId(raw: unknown): number | undefined {
  return typeof raw === 'string' && rowIdPattern.test(raw) ? Number(raw) : undefined
}

/** A path parameter that must be a row id; otherwise 404 with the given message. */
export function rowIdParam(req: Request, name: string, notFound: string): number {
  const id = parseRowId(req.params[name])
  if (id === undefined) throw new ApiError(404, 'not-found', notFound)
  return id
}

/** The plan named by `:planId` in a path under `/plans/:planId/...`; 404 when it is not a row id. */
export function planIdParam(req: Request): number {
  return rowIdParam(req, 'planId', 'No such plan in this team.')
}
