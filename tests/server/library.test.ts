import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { z } from 'zod'
import {
  accessorySchema,
  amplifierSchema,
  packSchema,
  speakersSchema,
} from '../../shared/schemas/estimate'
import { createTestApp, type TestApp } from '../helpers/test-app'

let testApp: TestApp
beforeAll(() => {
  testApp = createTestApp()
})
afterAll(() => testApp.close())

// A converter module is an accessory's converter settings: fitted to a device made for its output
// voltage (±5 %), it must pass the accessory schema.
const converterSchema = z.preprocess((part) => {
  const outputV = (part as { outputV: number }).outputV
  return {
    label: 'Device',
    powerW: 1,
    inputMinV: outputV * 0.95,
    inputMaxV: outputV * 1.05,
    ...(part as object),
  }
}, accessorySchema)

const lists: [string, z.ZodType][] = [
  ['packs', packSchema],
  ['amplifiers', amplifierSchema],
  ['speakers', speakersSchema],
  ['accessories', accessorySchema],
  ['converters', converterSchema],
]

describe('GET /api/v1/library/*', () => {
  it.each(lists)(
    'serves %s without sign-in, each part valid for the estimate',
    async (kind, schema) => {
      const response = await request(testApp.app).get(`/api/v1/library/${kind}`).expect(200)
      expect(response.headers['content-type']).toMatch(/application\/json/)
      expect(response.headers['cache-control']).toContain('max-age=')
      const items = response.body.items as { id: string; label: string; part: unknown }[]
      expect(items.length).toBeGreaterThanOrEqual(5)
      for (const item of items) {
        expect(item.id).toMatch(/^[a-z0-9-]+$/)
        expect(item.label.length).toBeGreaterThan(0)
        // The JSON round trip must keep every part usable as an estimate input.
        expect(schema.safeParse(item.part).success, item.id).toBe(true)
      }
    },
  )

  it('answers an unknown list with the JSON 404 of the API', async () => {
    const response = await request(testApp.app).get('/api/v1/library/chargers').expect(404)
    expect(response.body.error.code).toBe('not-found')
  })

  it('is read-only: writing to a list is not a route', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/library/packs')
      .send({ id: 'x', label: 'x', part: {} })
      .expect(404)
    expect(response.body.error.code).toBe('not-found')
  })
})
