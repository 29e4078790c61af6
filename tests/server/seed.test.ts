import request from 'supertest'
import { afterEach, describe, expect, it } from 'vitest'
import { demoPassword, demoSignIns, seedDemo } from '../../server/db/seed'
import { signInCookie } from '../helpers/accounts'
import { createTestApp, type TestApp } from '../helpers/test-app'

let testApp: TestApp | undefined
afterEach(async () => {
  await testApp?.close()
  testApp = undefined
})

describe('the demo seed', () => {
  it('creates the teams and sign-ins of docs/api.md once, and they keep apart', async () => {
    testApp = createTestApp()
    expect(await seedDemo(testApp.database, Date.now())).toBe(true)
    expect(await seedDemo(testApp.database, Date.now())).toBe(false)
    // Source: docs/api.md, "Demo sign-ins".
    expect(demoSignIns().map((signIn) => signIn.email)).toEqual([
      'admin@alder-creek.example',
      'editor@alder-creek.example',
      'viewer@alder-creek.example',
      'admin@harbor-lane.example',
    ])
    const viewer = await signInCookie(testApp.app, 'viewer@alder-creek.example', demoPassword)
    const viewerMe = await request(testApp.app).get('/api/v1/auth/me').set('Cookie', viewer)
    expect(viewerMe.body.teams).toEqual([
      expect.objectContaining({ name: 'Alder Creek Market Crew', role: 'viewer' }),
    ])
    const harbor = await signInCookie(testApp.app, 'admin@harbor-lane.example', demoPassword)
    const harborMe = await request(testApp.app).get('/api/v1/auth/me').set('Cookie', harbor)
    expect(harborMe.body.teams).toEqual([
      expect.objectContaining({ name: 'Harbor Lane Buskers', role: 'admin' }),
    ])
    const alderId = viewerMe.body.teams[0].id
    await request(testApp.app)
      .get(`/api/v1/teams/${alderId}/members`)
      .set('Cookie', harbor)
      .expect(404)
  })
})
