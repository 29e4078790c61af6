import type { Express } from 'express'

interface RouterLayer {
  rawPath?: unknown
  route?: { path: unknown; methods: Record<string, boolean> }
  handle?: { stack?: RouterLayer[] }
}

function joinPaths(prefix: string, path: unknown): string {
  if (typeof path !== 'string') {
    // A RegExp or array path cannot be listed as a template; make the author choose a string.
    throw new Error(`Route path ${String(path)} under ${prefix || '/'} is not a plain string`)
  }
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/')
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined
}

/**
 * Every `METHOD /path/:param` the app answers, found by walking Express 5's router stack
 * (router 2.x keeps each layer's `rawPath`), so a route added anywhere shows up here.
 */
export function listRoutes(app: Express): string[] {
  const found: string[] = []
  const walk = (stack: RouterLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = joinPaths(prefix, layer.route.path)
        for (const method of Object.keys(layer.route.methods)) {
          found.push(`${method === '_all' ? 'ALL' : method.toUpperCase()} ${path}`)
        }
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, joinPaths(prefix, layer.rawPath ?? '/'))
      }
    }
  }
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, '')
  return found
}
