import { Router } from 'express'
import {
  libraryAccessories,
  libraryAmplifiers,
  libraryConverters,
  libraryPacks,
  librarySpeakers,
} from '../../shared/library'

// The built-in parts never change while the server runs, so clients may keep them for an hour.
const cacheControl = 'public, max-age=3600'

/**
 * Public, read-only: the built-in generic parts, `{ items: [{ id, label, part }] }`. `converters`
 * (an extension of the four lists in the design) holds converter modules: an accessory's `feed`,
 * `outputV`, `efficiency` and `idleW`.
 */
export function libraryRouter(): Router {
  const router = Router()
  const lists = {
    packs: libraryPacks,
    amplifiers: libraryAmplifiers,
    speakers: librarySpeakers,
    accessories: libraryAccessories,
    converters: libraryConverters,
  }
  for (const [kind, items] of Object.entries(lists)) {
    router.get(`/${kind}`, (_req, res) => {
      res.setHeader('Cache-Control', cacheControl)
      res.json({ items })
    })
  }
  return router
}
