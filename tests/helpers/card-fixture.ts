import request from 'supertest'
import { seedDemo, demoPassword } from '../../server/db/seed'
import { signInCookie } from './accounts'
import { createTestApp, type TestApp } from './test-app'

export interface CardFixture {
  testApp: TestApp
  /** Moves the app's clock on (sessions, link expiry). */
  advanceMs: (ms: number) => void
  nowMs: () => number
  cookies: { editor: string; viewer: string; admin: string; otherTeamAdmin: string }
  teamId: number
  planId: number
  /** `/api/v1/teams/:teamId/plans/:planId` */
  planPath: string
}

/** The demo crew and its Saturday plan on an app whose clock the test moves. */
export async function createCardFixture(
  envOverrides: Record<string, string> = {},
): Promise<CardFixture> {
  let nowMs = Date.parse('2026-06-01T09:00:00Z')
  const testApp = createTestApp(envOverrides, { clock: () => new Date(nowMs) })
  await seedDemo(testApp.database, nowMs)
  const { app } = testApp
  const signIn = (email: string) => signInCookie(app, email, demoPassword)
  const cookies = {
    editor: await signIn('editor@alder-creek.example'),
    viewer: await signIn('viewer@alder-creek.example'),
    admin: await signIn('admin@alder-creek.example'),
    otherTeamAdmin: await signIn('admin@harbor-lane.example'),
  }
  const me = await request(app).get('/api/v1/auth/me').set('Cookie', cookies.editor).expect(200)
  const teamId = (me.body.teams as { id: number; name: string }[]).find(
    (team) => team.name === 'Alder Creek Market Crew',
  )!.id
  const plans = await request(app)
    .get(`/api/v1/teams/${teamId}/plans`)
    .set('Cookie', cookies.editor)
    .expect(200)
  const planId = (plans.body.items as { id: number; name: string }[]).find(
    (plan) => plan.name === 'Saturday market',
  )!.id
  return {
    testApp,
    advanceMs: (ms) => (nowMs += ms),
    nowMs: () => nowMs,
    cookies,
    teamId,
    planId,
    planPath: `/api/v1/teams/${teamId}/plans/${planId}`,
  }
}

/** The token at the end of a share link's address. */
export function tokenOf(url: string): string {
  return url.slice(url.lastIndexOf('/') + 1)
}
