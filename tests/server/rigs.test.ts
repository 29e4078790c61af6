import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import request from 'supertest'
import { ENGINE_VERSION } from '../../shared/engine'
import { appMeta } from '../../server/db/schema'
import { plans, rigAccessories, rigs } from '../../server/db/schema-resources'
import { recomputeSummaries, summariesEngineVersionKey } from '../../server/db/recompute-summaries'
import { clockTimeAfter } from '../../server/resources/summaries'
import { packBody, plainRigSpec, rigSpecWithAccessory, teamApi } from '../helpers/resource-fixture'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'

// Saved rigs: /api/v1/teams/:teamId/rigs. The server validates the spec with the engine's own
// schema, runs the engine at every save and stores the headline.

let fixture: TeamFixture
let editor: ReturnType<typeof teamApi>
let secondEditor: ReturnType<typeof teamApi>
beforeEach(async () => {
  fixture = await createTeamFixture()
  const teamId = fixture.placeholders.teamId!
  editor = teamApi(fixture.testApp.app, teamId, fixture.cookies.editor)
  // An admin can do all an editor can: the second person in the race.
  secondEditor = teamApi(fixture.testApp.app, teamId, fixture.cookies.admin)
})
afterEach(() => fixture.testApp.close())

const rigBody = { name: 'Busker cart', notes: 'left wheel squeaks', spec: plainRigSpec }

describe('saving a rig runs the engine', () => {
  it('stores the summary of the same engine the browser runs', async () => {
    const created = await editor.post('/rigs', rigBody).expect(201)
    // Relation: the stored headline is what the public estimate answers for the same spec.
    const { body: result } = await request(fixture.testApp.app)
      .post('/api/v1/estimate')
      .send(plainRigSpec)
      .expect(200)
    expect(created.body).toMatchObject({
      name: 'Busker cart',
      notes: 'left wheel squeaks',
      version: 1,
      specSchemaVersion: 1,
      packId: null,
      accessoryIds: [],
      summary: {
        engineVersion: ENGINE_VERSION,
        runtimeHours: result.runtimeHours,
        stopReason: result.stopReason,
        averageDrawW: result.averageDrawW,
        warningCount: result.warnings.length,
      },
    })
  })

  it('gives a runtime that the pack energy can account for', async () => {
    const created = await editor.post('/rigs', rigBody).expect(201)
    const { runtimeHours, averageDrawW } = created.body.summary
    // Source: common practice, nominal Wh = nominal V × Ah; 10 Li-ion cells in series are 36 V
    // nominal, so a 10S2P pack of 2.5 Ah cells holds 36 V × 5 Ah = 180 Wh.
    const nominalWh = 36 * 5
    const deliveredWh = runtimeHours * averageDrawW
    // From memory: a Li-ion pack at a light load run to a 3.0 V per cell cutoff gives about its
    // nominal energy, within some 15 % either way (its resting voltage averages near 3.7 V).
    expect(deliveredWh).toBeGreaterThan(0.85 * nominalWh)
    expect(deliveredWh).toBeLessThan(1.15 * nominalWh)
  })

  it('recomputes the summary when the spec changes: 6 dB louder, four times the power', async () => {
    const created = await editor.post('/rigs', rigBody).expect(201)
    const louder = await editor
      .put(`/rigs/${created.body.id}`, {
        ...rigBody,
        spec: { ...plainRigSpec, programme: { crestFactorDb: 12, peakBelowClipDb: 0 } },
        version: 1,
      })
      .expect(200)
    expect(louder.body.version).toBe(2)
    // Source: docs/model.md §5, P_avg = 2·P_clip·10^(−(L + CF)/10): L from 6 dB to 0 dB is 10^0.6
    // ≈ 4 × the output power, so the draw rises and the runtime falls.
    expect(louder.body.summary.averageDrawW).toBeGreaterThan(created.body.summary.averageDrawW * 2)
    expect(louder.body.summary.runtimeHours).toBeLessThan(created.body.summary.runtimeHours / 2)
  })

  it('refuses an invalid spec with 400 naming the field inside it, and writes nothing', async () => {
    const { db } = fixture.testApp.database
    const before = await db.$count(rigs)
    const response = await editor
      .post('/rigs', {
        ...rigBody,
        spec: { ...plainRigSpec, pack: { ...plainRigSpec.pack, seriesCells: 0 } },
      })
      .expect(400)
    expect(response.body.error.issues.map((issue: { path: string }) => issue.path)).toContain(
      'spec.pack.seriesCells',
    )
    expect(await db.$count(rigs)).toBe(before)
  })
})

describe('part references', () => {
  it('records the parts a rig was built from, accessories in order', async () => {
    const second = await editor
      .post('/accessories', {
        name: 'Mixer',
        powerW: 2,
        inputMinV: 9,
        inputMaxV: 18,
        feed: 'buck',
        outputV: 12,
      })
      .expect(201)
    const { packId, accessoryId } = fixture.placeholders
    const created = await editor
      .post('/rigs', {
        ...rigBody,
        spec: rigSpecWithAccessory,
        packId: Number(packId),
        accessoryIds: [second.body.id, Number(accessoryId)],
      })
      .expect(201)
    expect(created.body.packId).toBe(Number(packId))
    expect(created.body.accessoryIds).toEqual([second.body.id, Number(accessoryId)])
  })

  it("refuses references to parts that are not the team's, naming each field", async () => {
    const response = await editor
      .post('/rigs', {
        ...rigBody,
        packId: 9999,
        accessoryIds: [Number(fixture.placeholders.accessoryId), 8888],
      })
      .expect(400)
    expect(response.body.error.issues).toEqual([
      { path: 'packId', message: 'No pack with id 9999 in this team' },
      { path: 'accessoryIds.1', message: 'No accessory with id 8888 in this team' },
    ])
  })

  it('copies references and accessory links on duplicate', async () => {
    const copy = await editor.post(`/rigs/${fixture.placeholders.rigId}/duplicate`).expect(201)
    expect(copy.body).toMatchObject({
      name: 'Market stage column (copy)',
      version: 1,
      packId: Number(fixture.placeholders.packId),
      accessoryIds: [Number(fixture.placeholders.accessoryId)],
      spec: rigSpecWithAccessory,
    })
  })

  it('drops the link rows with the rig and leaves the parts alone', async () => {
    const { db } = fixture.testApp.database
    await editor.delete(`/rigs/${fixture.placeholders.rigId}`).expect(204)
    expect(await db.$count(rigAccessories)).toBe(0)
    await editor.get(`/packs/${fixture.placeholders.packId}`).expect(200)
    // Nothing uses the pack now, so an editor may delete it.
    await editor.delete(`/packs/${fixture.placeholders.packId}`).expect(204)
  })

  it('refuses to delete a rig an event plan uses, naming the plan', async () => {
    const { db } = fixture.testApp.database
    const nowMs = Date.now()
    db.insert(plans)
      .values({
        teamId: Number(fixture.placeholders.teamId),
        name: 'Saturday market',
        rigId: Number(fixture.placeholders.rigId),
        date: '2026-06-06',
        startTime: '08:00',
        schedule: [{ label: 'Morning', minutes: 240 }],
        createdAtMs: nowMs,
        updatedAtMs: nowMs,
      })
      .run()
    const response = await editor.delete(`/rigs/${fixture.placeholders.rigId}`).expect(409)
    expect(response.body.error).toMatchObject({ code: 'rig-in-use' })
    expect(response.body.error.message).toContain('"Saturday market"')
  })
})

describe('two editors saving one rig', () => {
  it('lets the first save win, answers the second with 409, and loses nothing', async () => {
    const path = `/rigs/${fixture.placeholders.rigId}`
    const opened = await editor.get(path).expect(200)
    const base = { name: opened.body.name, spec: opened.body.spec, version: opened.body.version }
    const quieter = { ...base, notes: 'quieter for the morning' }
    const louder = { ...base, notes: 'louder for the dance' }

    const [first, second] = await Promise.all([
      editor.put(path, quieter),
      secondEditor.put(path, louder),
    ])
    const statuses = [first.status, second.status].sort()
    expect(statuses).toEqual([200, 409])
    const winner = first.status === 200 ? quieter : louder
    const loser = first.status === 200 ? louder : quieter

    const saved = await editor.get(path).expect(200)
    expect(saved.body).toMatchObject({ notes: winner.notes, version: base.version + 1 })

    // The one who lost keeps their work as a copy (what the bench offers after a 409).
    const { version: _version, ...loserBody } = loser
    const copy = await secondEditor
      .post('/rigs', { ...loserBody, name: `${loser.name} (my copy)` })
      .expect(201)
    const kept = await editor.get(`/rigs/${copy.body.id}`).expect(200)
    expect(kept.body).toMatchObject({ notes: loser.notes, spec: loser.spec, version: 1 })
  })
})

describe('listing rigs', () => {
  it('lists the latest change first with sort=-updatedAt', async () => {
    const before = await editor.get('/rigs').expect(200)
    await editor.post('/rigs', rigBody).expect(201)
    const list = await editor.get('/rigs?sort=-updatedAt').expect(200)
    expect(list.body.total).toBe(before.body.total + 1)
    expect(list.body.items[0].name).toBe('Busker cart')
    expect(list.body.items[0].summary.warningCount).toBeGreaterThanOrEqual(0)
  })
})

describe('recomputing summaries when the engine version changes', () => {
  it('rewrites every stored rig summary in one go and records the new version', async () => {
    const { db } = fixture.testApp.database
    const rigId = Number(fixture.placeholders.rigId)
    const real = db.select().from(rigs).where(eq(rigs.id, rigId)).get()!.summary!
    // As if an older engine had computed it.
    db.update(rigs)
      .set({
        summary: { ...real, runtimeHours: 1, engineVersion: '0.9.0' },
        summaryEngineVersion: '0.9.0',
      })
      .where(eq(rigs.id, rigId))
      .run()
    db.insert(appMeta)
      .values({ key: summariesEngineVersionKey, value: '0.9.0' })
      .onConflictDoUpdate({ target: appMeta.key, set: { value: '0.9.0' } })
      .run()

    const report = recomputeSummaries(fixture.testApp.database)
    expect(report).toMatchObject({
      fromVersion: '0.9.0',
      toVersion: ENGINE_VERSION,
      rigs: await db.$count(rigs),
      plans: await db.$count(plans),
      invalid: 0,
    })
    const after = db.select().from(rigs).where(eq(rigs.id, rigId)).get()!
    expect(after.summary).toEqual(real)
    expect(after.summaryEngineVersion).toBe(ENGINE_VERSION)
    // Nobody edited the rig: its version stays, so nobody's open copy turns stale.
    expect(after.version).toBe(1)
    const recorded = db
      .select()
      .from(appMeta)
      .where(eq(appMeta.key, summariesEngineVersionKey))
      .get()
    expect(recorded?.value).toBe(ENGINE_VERSION)
    expect(recomputeSummaries(fixture.testApp.database)).toBeUndefined()
  })

  it('clears the summary of a stored spec that no longer passes the schema, keeping the spec', async () => {
    const { db } = fixture.testApp.database
    const rigId = Number(fixture.placeholders.rigId)
    const broken = { ...plainRigSpec, pack: { ...packBody, seriesCells: -1 } }
    db.update(rigs)
      .set({ spec: broken as typeof plainRigSpec })
      .where(eq(rigs.id, rigId))
      .run()
    const report = recomputeSummaries(fixture.testApp.database, 'next')
    // The rig and the plans built on it can no longer be run.
    expect(report).toMatchObject({
      rigs: await db.$count(rigs),
      invalid: 1 + (await db.$count(plans, eq(plans.rigId, rigId))),
    })
    const after = db.select().from(rigs).where(eq(rigs.id, rigId)).get()!
    expect(after.summary).toBeNull()
    expect(after.spec).toEqual(broken)
  })

  it('recomputes plan summaries with the swaps on the event clock', () => {
    const { db } = fixture.testApp.database
    const nowMs = Date.now()
    const plan = db
      .insert(plans)
      .values({
        teamId: Number(fixture.placeholders.teamId),
        name: 'Long day',
        rigId: Number(fixture.placeholders.rigId),
        date: '2026-06-06',
        startTime: '22:00',
        packCount: 3,
        schedule: [{ label: 'All day and night', minutes: 40 * 60, state: 'on' }],
        createdAtMs: nowMs,
        updatedAtMs: nowMs,
      })
      .returning()
      .get()
    recomputeSummaries(fixture.testApp.database, 'next')
    const summary = db.select().from(plans).where(eq(plans.id, plan.id)).get()!.summary!
    expect(summary.packsUsed).toBeGreaterThan(1)
    expect(summary.swaps.length).toBe(summary.packsUsed - 1)
    for (const swap of summary.swaps)
      expect(swap.atTime).toBe(clockTimeAfter('22:00', swap.atMinute))
  })

  it('reads the event clock across midnight', () => {
    // Source: arithmetic of the 24-hour clock, 22:00 + 150 min = 00:30 the next day.
    expect(clockTimeAfter('22:00', 150)).toBe('00:30')
    expect(clockTimeAfter('08:15', 45)).toBe('09:00')
  })
})

describe('the demo crews', () => {
  it('have their own rigs, each with a summary, and do not see each other’s', async () => {
    const { seedDemo } = await import('../../server/db/seed')
    const { createTestApp } = await import('../helpers/test-app')
    const testApp = createTestApp()
    try {
      expect(await seedDemo(testApp.database, Date.now())).toBe(true)
      const saved = testApp.database.db.select().from(rigs).all()
      const byTeam = new Map<number, string[]>()
      for (const rig of saved) byTeam.set(rig.teamId, [...(byTeam.get(rig.teamId) ?? []), rig.name])
      expect([...byTeam.values()].map((names) => names.length).sort()).toEqual([1, 3])
      for (const rig of saved) {
        expect(rig.summary?.engineVersion).toBe(ENGINE_VERSION)
        // Source: docs/model.md §1, "20 V max" and "40 V max" packs are 18 V and 36 V nominal
        // (common practice); the market columns run on the 36 V class.
        if (rig.name === 'Market stage columns') expect(rig.spec.pack.seriesCells).toBe(10)
      }
    } finally {
      await testApp.close()
    }
  })
})
