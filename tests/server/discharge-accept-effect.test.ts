import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { dischargeLogs } from '../../server/db/schema-resources'
import { constantCurrentSamples, csvOf, plainCells, plainHeader } from '../helpers/discharge-logs'
import { planBody } from '../helpers/plan-fixture'
import { packBody, plainRigSpec, teamApi } from '../helpers/resource-fixture'
import { createTeamFixture, type SignedInActor, type TeamFixture } from '../helpers/team-fixture'

/*
 * What accepting a log's health figure does to the team's rigs and plans, shown before (the
 * preview) and in the accept's answer. A measured health holds for the pack the log was read
 * against (definition of state of health: measured capacity of that pack ÷ its rated capacity),
 * so it reaches a rig only while the rig's copy of the pack is that pack.
 *
 * The team fixture holds the pack (10S2P of 2.5 Ah cells), the rig "Market stage column" saved
 * with it, and the rig "Sports day column" with the same values but saved without the pack, which
 * carries the plans "School sports day" and "Sports day, far field".
 */

let fixture: TeamFixture
let teamId: string
let packId: string
beforeEach(async () => {
  fixture = await createTeamFixture()
  teamId = fixture.placeholders.teamId!
  packId = fixture.placeholders.packId!
  fixture.testApp.database.db.delete(dischargeLogs).run()
})
afterEach(() => fixture.testApp.close())

const api = (actor: SignedInActor = 'editor') =>
  teamApi(fixture.testApp.app, teamId, fixture.cookies[actor])
const logsPath = () => `/packs/${packId}/discharge-logs`

// 2 A for 2 h down to the pack's 30 V cutoff (10 cells × 3 V): 4 Ah of 5 Ah rated.
const twoAmpsTwoHours = csvOf(
  constantCurrentSamples({ currentA: 2, hours: 2, startV: 41, endV: 30, stepS: 60 }),
  plainHeader,
  plainCells,
)

async function uploadLog(text = twoAmpsTwoHours): Promise<{ id: number; healthPct: number }> {
  const created = await request(fixture.testApp.app)
    .post(`/api/v1/teams/${teamId}${logsPath()}`)
    .set('Cookie', fixture.cookies.editor)
    .attach('file', Buffer.from(text), 'run.csv')
    .expect(201)
  return created.body
}

/** A rig of the fixture's values with its pack changed by `pack`, saved with `packId`. */
async function saveRig(name: string, packIdOfRig: number | null, pack: object = {}) {
  const rig = await api()
    .post('/rigs', {
      name,
      spec: { ...plainRigSpec, pack: { ...plainRigSpec.pack, ...pack } },
      packId: packIdOfRig,
    })
    .expect(201)
  return rig.body as { id: number; name: string; version: number }
}

const rigNamed = async (name: string) => {
  const list = await api().get('/rigs?pageSize=100').expect(200)
  return (list.body.items as { id: number; name: string }[]).find((rig) => rig.name === name)!
}

describe('the effect of accepting a log, shown before it is applied', () => {
  it('names the rigs and plans that take the figure, and those that keep theirs with the reason', async () => {
    // 3 Ah cells instead of 2.5 Ah: a pack of other cells is another pack (common practice), so a
    // figure measured on the 2.5 Ah pack says nothing of it.
    const otherCells = await saveRig('Column on other cells', Number(packId), {
      cellCapacityAh: 3,
    })
    const spare = await api()
      .post('/packs', { ...packBody, name: 'Spare pack', parallelCells: 1 })
      .expect(201)
    const spareRig = await saveRig('Spare column', spare.body.id, {
      parallelCells: 1,
      label: 'Spare pack',
    })
    const market = await rigNamed('Market stage column')
    const marketPlan = await api()
      .post('/plans', {
        ...planBody,
        name: 'Market Saturday',
        rigId: market.id,
        // One pack for a day it cannot last: the plan's figure is the pack's runtime.
        packCount: 1,
        schedule: [{ label: 'All day', minutes: 1440, state: 'on', peakBelowClipDb: 0 }],
      })
      .expect(201)
    const sportsDay = await rigNamed('Sports day column')
    const keptPlanBefore = (await api().get(`/plans/${fixture.placeholders.planId}`).expect(200))
      .body
    const log = await uploadLog()
    const healthPct = Math.round(log.healthPct * 10) / 10

    const preview = await api('viewer').get(`${logsPath()}/${log.id}/accept-preview`).expect(200)
    expect(preview.body).toEqual({
      healthPct,
      fromHealthPct: null,
      rigs: {
        changing: [{ id: market.id, name: 'Market stage column', fromHealthPct: null }],
        keeping: [
          {
            id: otherCells.id,
            name: 'Column on other cells',
            reason: { kind: 'copy-differs', fields: ['cellCapacityAh'] },
          },
          {
            id: spareRig.id,
            name: 'Spare column',
            reason: { kind: 'other-pack', packId: spare.body.id, packName: 'Spare pack' },
          },
          { id: sportsDay.id, name: 'Sports day column', reason: { kind: 'no-saved-pack' } },
        ],
      },
      plans: {
        changing: [
          {
            id: marketPlan.body.id,
            name: 'Market Saturday',
            rigId: market.id,
            rigName: 'Market stage column',
          },
        ],
        keeping: [
          {
            id: Number(fixture.placeholders.planId),
            name: 'School sports day',
            rigId: sportsDay.id,
            rigName: 'Sports day column',
          },
          expect.objectContaining({ name: 'Sports day, far field', rigId: sportsDay.id }),
        ],
      },
    })
    // A preview writes nothing.
    expect((await api().get(`/packs/${packId}`).expect(200)).body.version).toBe(1)
    expect((await api().get(`/rigs/${market.id}`).expect(200)).body.version).toBe(1)

    const accepted = await api().post(`${logsPath()}/${log.id}/accept`, { version: 1 }).expect(200)
    expect(accepted.body.effect).toEqual(preview.body)
    expect(accepted.body.updatedRigs).toEqual([{ id: market.id, name: 'Market stage column' }])

    const marketAfter = (await api().get(`/rigs/${market.id}`).expect(200)).body
    expect(marketAfter).toMatchObject({ version: 2, spec: { pack: { healthPct } } })
    const otherAfter = (await api().get(`/rigs/${otherCells.id}`).expect(200)).body
    expect(otherAfter.version).toBe(otherCells.version)
    expect(otherAfter.spec.pack.healthPct).toBeUndefined()
    // Source: definition of state of health: less charge than rated shortens the run.
    const marketPlanAfter = (await api().get(`/plans/${marketPlan.body.id}`).expect(200)).body
    expect(marketPlanAfter.summary.runtimeHours).toBeLessThan(marketPlan.body.summary.runtimeHours)
    // A plan on a rig that keeps its figure keeps its summary to the digit.
    expect(
      (await api().get(`/plans/${fixture.placeholders.planId}`).expect(200)).body.summary,
    ).toEqual(keptPlanBefore.summary)

    // Asked again, the rig already has the figure: nothing would change.
    const again = await api('viewer').get(`${logsPath()}/${log.id}/accept-preview`).expect(200)
    expect(again.body.fromHealthPct).toBe(healthPct)
    expect(again.body.rigs.changing).toEqual([])
    expect(again.body.rigs.keeping).toContainEqual({
      id: market.id,
      name: 'Market stage column',
      reason: { kind: 'same-health' },
    })
    expect(again.body.plans.changing).toEqual([])
  })

  it('leaves a rig whose copy no longer matches the pack as saved (the pack was edited since)', async () => {
    // A new cell resistance changes the pack's sag under load (Ohm's law), so the log is read
    // against another pack than the rig's copy; a new name changes nothing of a discharge.
    await api()
      .put(`/packs/${packId}`, {
        ...packBody,
        name: 'Tool pack, renamed',
        cellResistanceOhm: 0.03,
        version: 1,
      })
      .expect(200)
    const log = await uploadLog()
    const preview = await api().get(`${logsPath()}/${log.id}/accept-preview`).expect(200)
    expect(preview.body.rigs.changing).toEqual([])
    expect(preview.body.rigs.keeping).toContainEqual({
      id: Number(fixture.placeholders.rigId),
      name: 'Market stage column',
      reason: { kind: 'copy-differs', fields: ['cellResistanceOhm'] },
    })
    const accepted = await api().post(`${logsPath()}/${log.id}/accept`, { version: 2 }).expect(200)
    expect(accepted.body.updatedRigs).toEqual([])
    const rig = (await api().get(`/rigs/${fixture.placeholders.rigId}`).expect(200)).body
    expect(rig.version).toBe(1)
    expect(rig.spec.pack.healthPct).toBeUndefined()
    expect(rig.spec.pack.cellResistanceOhm).toBe(0.022)
  })

  it('takes a renamed pack as the same pack: the name enters no discharge', async () => {
    await api()
      .put(`/packs/${packId}`, { ...packBody, name: 'Tool pack, renamed', version: 1 })
      .expect(200)
    const log = await uploadLog()
    const preview = await api().get(`${logsPath()}/${log.id}/accept-preview`).expect(200)
    expect(preview.body.rigs.changing).toEqual([
      { id: Number(fixture.placeholders.rigId), name: 'Market stage column', fromHealthPct: null },
    ])
  })

  it('gives the same refusal as the accept for a log that yields no health figure', async () => {
    // Stops at 36 V, above the 30 V cutoff: the pack was not run down, so no health figure.
    const short = csvOf(
      constantCurrentSamples({ currentA: 2, hours: 1, startV: 41, endV: 36, stepS: 60 }),
      plainHeader,
      plainCells,
    )
    const log = await uploadLog(short)
    const preview = await api('viewer').get(`${logsPath()}/${log.id}/accept-preview`)
    expect(preview.status).toBe(400)
    expect(preview.body.error.code).toBe('log-incomplete')
    const accept = await api().post(`${logsPath()}/${log.id}/accept`)
    expect(accept.body.error).toEqual(preview.body.error)
  })

  it('lets a viewer preview but not accept; another team and another pack find nothing', async () => {
    const log = await uploadLog()
    await api('viewer').get(`${logsPath()}/${log.id}/accept-preview`).expect(200)
    const refused = await api('viewer').post(`${logsPath()}/${log.id}/accept`)
    expect(refused.status).toBe(403)
    expect((await api().get(`/packs/${packId}`).expect(200)).body.version).toBe(1)

    const outsider = await api('other-team-admin').get(`${logsPath()}/${log.id}/accept-preview`)
    expect(outsider.status).toBe(404)
    expect(JSON.stringify(outsider.body)).not.toContain('Market stage column')
    const second = await api()
      .post('/packs', { ...packBody, name: 'Second pack' })
      .expect(201)
    const elsewhere = await api().get(
      `/packs/${second.body.id}/discharge-logs/${log.id}/accept-preview`,
    )
    expect(elsewhere.status).toBe(404)
    expect(elsewhere.body.error.message).toBe('No such discharge log for this pack.')
  })

  it('refuses an accept with 409 when the pack was saved after the preview, and writes nothing', async () => {
    const log = await uploadLog()
    await api().get(`${logsPath()}/${log.id}/accept-preview`).expect(200)
    await api()
      .put(`/packs/${packId}`, { ...packBody, notes: 'relabelled', version: 1 })
      .expect(200)
    const stale = await api().post(`${logsPath()}/${log.id}/accept`, { version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale-version')
    const rig = (await api().get(`/rigs/${fixture.placeholders.rigId}`).expect(200)).body
    expect(rig.version).toBe(1)
    expect(rig.spec.pack.healthPct).toBeUndefined()
  })
})
