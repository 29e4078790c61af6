import request from 'supertest'
import { afterAll, describe, expect, it } from 'vitest'
import { listRoutes } from '../helpers/route-list'
import {
  createTeamFixture,
  fillPlaceholders,
  type Actor,
  type TeamFixture,
} from '../helpers/team-fixture'
import { createTestApp } from '../helpers/test-app'
import { authorizationMatrix } from './authorization-matrix'

const actors: Actor[] = ['anonymous', 'viewer', 'editor', 'admin', 'other-team-admin']
const rowKey = (method: string, path: string) => `${method} ${path}`

describe('the authorization matrix covers the app', () => {
  it('has a row for every route the app declares, and none for a route it lacks', async () => {
    const testApp = createTestApp()
    const declared = listRoutes(testApp.app).filter((route) =>
      route.split(' ')[1]?.startsWith('/api'),
    )
    await testApp.close()
    // A walk that found nothing would make this test pass vacuously.
    expect(declared).toContain('GET /api/v1/auth/me')
    const inMatrix = authorizationMatrix.map((row) => rowKey(row.method, row.path))
    expect(
      declared.filter((route) => !inMatrix.includes(route)),
      'routes missing from the matrix',
    ).toEqual([])
    expect(
      inMatrix.filter((route) => !declared.includes(route)),
      'matrix rows for no route',
    ).toEqual([])
    expect(new Set(inMatrix).size, 'duplicate rows').toBe(inMatrix.length)
  })
})

// Reads change nothing, so they share one fixture; building one per request dominated the run.
let readFixture: Promise<TeamFixture> | undefined
afterAll(async () => {
  if (readFixture) await (await readFixture).testApp.close()
})

// Source: the rows' own citation (design/api.md). Each write runs on a fresh fixture, so one
// actor's success (a removed member, a spent token) cannot change the next actor's answer.
describe.each(authorizationMatrix)('$method $path', (row) => {
  it.each(actors)('as %s', async (actor) => {
    const isRead = row.method === 'GET'
    const fixture = isRead ? await (readFixture ??= createTeamFixture()) : await createTeamFixture()
    try {
      const path = fillPlaceholders(row.path, fixture.placeholders)
      let call = request(fixture.testApp.app)[row.method.toLowerCase() as 'get'](path)
      if (actor !== 'anonymous') call = call.set('Cookie', fixture.cookies[actor])
      if (row.body) call = call.send(fillPlaceholders(row.body, fixture.placeholders))
      const response = await call
      expect(response.status, JSON.stringify(response.body)).toBe(row.expect[actor])
    } finally {
      if (!isRead) await fixture.testApp.close()
    }
  })
})
