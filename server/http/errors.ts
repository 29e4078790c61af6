import type { ErrorRequestHandler, RequestHandler } from 'express'
import { z } from 'zod'
import { securityEvent } from './log'

export interface FieldIssue {
  path: string
  message: string
}

/** The one error type the API throws; the error handler turns it into `{ error: {...} }`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: FieldIssue[],
    readonly headers?: Record<string, string>,
  ) {
    super(message)
    this.name = 'ApiError'
  }
}

export function issuesFromZod(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.'),
    message: issue.message,
  }))
}

export function invalidInput(error: z.ZodError, what = 'request body'): ApiError {
  const issues = issuesFromZod(error)
  const first = issues[0]
  const summary = first ? `${first.path || what}: ${first.message}` : 'Invalid input'
  return new ApiError(400, 'invalid-input', `The ${what} is not valid. ${summary}`, issues)
}

/** Parses untrusted input with a shared schema; a failure becomes a 400 naming each field. */
export function parseInput<S extends z.ZodType>(
  schema: S,
  input: unknown,
  what?: string,
): z.infer<S> {
  const result = schema.safeParse(input)
  if (!result.success) throw invalidInput(result.error, what)
  return result.data
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  const path = req.originalUrl.split('?')[0]
  next(new ApiError(404, 'not-found', `No API route for ${req.method} ${path}`))
}

interface HttpLibraryError {
  type?: string
  status?: number
  expose?: boolean
}

/**
 * Maps the errors Express's own middleware raises (body-parser: malformed JSON, oversized bodies;
 * serve-static: a missing file) onto our error shape.
 */
function fromHttpLibrary(error: HttpLibraryError): ApiError | undefined {
  switch (error.type) {
    case 'entity.parse.failed':
      return new ApiError(400, 'malformed-json', 'The request body is not valid JSON.')
    case 'entity.too.large':
      return new ApiError(413, 'too-large', 'The request body is larger than this route accepts.')
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new ApiError(
        415,
        'unsupported-encoding',
        'The request body encoding is not supported.',
      )
    default:
      if (error.status === 404) return new ApiError(404, 'not-found', 'No such file.')
      if (error.expose && error.status && error.status >= 400 && error.status < 500) {
        return new ApiError(error.status, `http-${error.status}`, 'The request was refused.')
      }
      return undefined
  }
}

// Signed out, not allowed, throttled: the answers an operator watches for probing.
const refusalStatuses = new Set([401, 403, 429])

export function errorHandler(options: { exposeStack: boolean; log: (error: unknown) => void }) {
  const handler: ErrorRequestHandler = (error: unknown, req, res, next) => {
    if (res.headersSent) return next(error)
    const known =
      error instanceof ApiError
        ? error
        : error instanceof z.ZodError
          ? invalidInput(error)
          : typeof error === 'object' && error !== null
            ? fromHttpLibrary(error as HttpLibraryError)
            : undefined
    if (known) {
      if (refusalStatuses.has(known.status))
        securityEvent(req, 'request-refused', { status: known.status, code: known.code })
      for (const [name, value] of Object.entries(known.headers ?? {})) res.setHeader(name, value)
      res.status(known.status).json({
        error: {
          code: known.code,
          message: known.message,
          ...(known.issues ? { issues: known.issues } : {}),
        },
      })
      return
    }
    options.log(error)
    res.status(500).json({
      error: {
        code: 'internal',
        message: 'Something went wrong on the server. Nothing was changed by this request.',
        ...(options.exposeStack && error instanceof Error ? { stack: error.stack } : {}),
      },
    })
  }
  return handler
}
