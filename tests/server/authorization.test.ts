import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
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

// One app and one set of accounts for the whole matrix: each call runs inside a transaction
// that is rolled back after it, so one actor's success (a removed member, a spent token, a
// deleted part) cannot change the next actor's answer. The routes' own transactions nest inside
// it as savepoints (better-sqlite3). Each route has its own throttle, and no row calls a route
// more often than its throttle allows.
let fixture: TeamFixture
beforeAll(async () => {
  fixture = await createTeamFixture()
})
afterAll(async () => {
  await fixture.testApp.close()
})

// Source: the rows' own citation (docs/api.md, roles and status codes).
describe.each(authorizationMatrix)('$method $path', (row) => {
  it.each(actors)('as %s', async (actor) => {
    const { sqlite } = fixture.testApp.database
    sqlite.exec('BEGIN')
    try {
      const path = fillPlaceholders(row.path, fixture.placeholders)
      let call = request(fixture.testApp.app)[row.method.toLowerCase() as 'get'](path)
      if (actor !== 'anonymous') call = call.set('Cookie', fixture.cookies[actor])
      if (row.body) call = call.send(fillPlaceholders(row.body, fixture.placeholders))
      const response = await call
      expect(response.status, JSON.stringify(response.body)).toBe(row.expect[actor])
    } finally {
      sqlite.exec('ROLLBACK')
    }
  })
})

describe('the matrix leaves no trace between calls', () => {
  it('rolls back a write, so the next actor meets the fixture as it was', async () => {
    // A control: without the rollback the second delete would answer 404.
    const { sqlite } = fixture.testApp.database
    const path = `/api/v1/teams/${fixture.placeholders.teamId}/members/${fixture.placeholders.userId}`
    for (let attempt = 0; attempt < 2; attempt++) {
      sqlite.exec('BEGIN')
      try {
        await request(fixture.testApp.app)
          .delete(path)
          .set('Cookie', fixture.cookies.admin)
          .expect(204)
      } finally {
        sqlite.exec('ROLLBACK')
      }
    }
    expect(sqlite.inTransaction).toBe(false)
  })
})
