/**
 * The one fetch wrapper of the client. Every API module calls `apiRequest`; components never call
 * fetch. Errors arrive as `ApiRequestError` carrying the server's `{ code, message, issues }`.
 */
export interface ApiFieldIssue {
  path: string
  message: string
}

export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: ApiFieldIssue[] = [],
  ) {
    super(message)
    this.name = 'ApiRequestError'
  }
}

type UnauthorizedListener = () => void
const unauthorizedListeners = new Set<UnauthorizedListener>()

/** Lets the session layer send the user to sign-in when any request answers 401. */
export function onUnauthorized(listener: UnauthorizedListener): () => void {
  unauthorizedListeners.add(listener)
  return () => unauthorizedListeners.delete(listener)
}

/** Tells the session layer a request answered 401 (for requests made without `apiRequest`). */
export function reportUnauthorized(): void {
  for (const listener of unauthorizedListeners) listener()
}

/**
 * The request never reached the server (offline, or the server is down). A change says that
 * nothing was saved, so no one walks away believing the team has it.
 */
export function unreachableError(outcome: 'read' | 'saved' | 'deleted'): ApiRequestError {
  const said = outcome === 'read' ? '' : `, so nothing was ${outcome}`
  return new ApiRequestError(
    0,
    'offline',
    `The server could not be reached${said}. Check the connection and try again.`,
  )
}

export interface ApiRequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  body?: unknown
  query?: Record<string, string | number | boolean | undefined>
  signal?: AbortSignal
  /** Skip the global 401 handling (the sign-in form handles its own 401). */
  quietUnauthorized?: boolean
  /** A POST that writes nothing (a preview, signing in): unreachable, it is not called a save. */
  writesNothing?: boolean
}

function outcomeOf(options: ApiRequestOptions): 'read' | 'saved' | 'deleted' {
  const method = options.method ?? 'GET'
  if (method === 'GET' || options.writesNothing) return 'read'
  return method === 'DELETE' ? 'deleted' : 'saved'
}

export async function apiRequest<T>(path: string, options: ApiRequestOptions = {}): Promise<T> {
  const url = new URL(`/api${path}`, window.location.origin)
  for (const [name, value] of Object.entries(options.query ?? {})) {
    if (value !== undefined) url.searchParams.set(name, String(value))
  }
  const isForm = options.body instanceof FormData
  let response: Response
  try {
    response = await fetch(url, {
      method: options.method ?? 'GET',
      credentials: 'same-origin',
      headers: options.body === undefined || isForm ? {} : { 'Content-Type': 'application/json' },
      body:
        options.body === undefined
          ? undefined
          : isForm
            ? (options.body as FormData)
            : JSON.stringify(options.body),
      signal: options.signal,
    })
  } catch (error) {
    if ((error as Error).name === 'AbortError') throw error
    throw unreachableError(outcomeOf(options))
  }
  if (response.status === 204) return undefined as T
  const payload: unknown = await response.json().catch(() => undefined)
  if (!response.ok) {
    const error = (
      payload as { error?: { code?: string; message?: string; issues?: ApiFieldIssue[] } }
    )?.error
    if (response.status === 401 && !options.quietUnauthorized) reportUnauthorized()
    throw new ApiRequestError(
      response.status,
      error?.code ?? 'http-' + response.status,
      error?.message ?? `The server answered ${response.status}.`,
      error?.issues ?? [],
    )
  }
  return payload as T
}
