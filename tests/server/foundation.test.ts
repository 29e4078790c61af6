import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { parseEnv } from '../../server/env'
import { resolveSessionSecret } from '../../server/secret'
import { createTestApp, type TestApp } from '../helpers/test-app'

let testApp: TestApp
beforeAll(() => {
  testApp = createTestApp()
})
afterAll(() => testApp.close())

describe('health', () => {
  it('reports every migration applied and none pending', async () => {
    const response = await request(testApp.app).get('/api/health').expect(200)
    expect(response.body.ok).toBe(true)
    expect(response.body.version).toMatch(/^\d+\.\d+\.\d+/)
    expect(response.body.migrations.applied).toBeGreaterThanOrEqual(1)
    expect(response.body.migrations.pending).toBe(0)
  })
})

describe('HTTP basics', () => {
  it('answers unknown API routes with a JSON 404 in the error shape', async () => {
    const response = await request(testApp.app).get('/api/v1/no-such-thing').expect(404)
    expect(response.body).toEqual({
      error: { code: 'not-found', message: expect.stringContaining('/api/v1/no-such-thing') },
    })
  })

  it('refuses malformed JSON with 400, not 500', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/no-such-thing')
      .set('Content-Type', 'application/json')
      .send('{"pack": ')
      .expect(400)
    expect(response.body.error.code).toBe('malformed-json')
  })

  it('refuses a body over the size limit with 413', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/no-such-thing')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ padding: 'x'.repeat(300 * 1024) }))
      .expect(413)
    expect(response.body.error.code).toBe('too-large')
  })

  it('hides x-powered-by and sends security headers', async () => {
    const response = await request(testApp.app).get('/api/health')
    expect(response.headers['x-powered-by']).toBeUndefined()
    expect(response.headers['content-security-policy']).toContain("default-src 'self'")
    expect(response.headers['x-content-type-options']).toBe('nosniff')
  })
})

describe('serving the built client', () => {
  const distDir = mkdtempSync(join(tmpdir(), 'loudhour-dist-'))
  mkdirSync(join(distDir, 'assets'))
  writeFileSync(join(distDir, 'index.html'), '<!doctype html><div id="app"></div>')
  writeFileSync(join(distDir, 'assets', 'app-1234.js'), 'console.log(1)')
  const ownDatabase = createTestApp()
  const app = createApp({
    env: parseEnv({ NODE_ENV: 'production', LOUDHOUR_DEMO: 'false' }),
    database: ownDatabase.database,
    sessionSecret: 'a'.repeat(40),
    mail: ownDatabase.mail,
    distDir,
    log: () => {},
  })
  afterAll(() => {
    ownDatabase.close()
    rmSync(distDir, { recursive: true, force: true })
  })

  it('loads the app for a deep link (history fallback)', async () => {
    const response = await request(app).get('/plans/123').expect(200)
    expect(response.headers['content-type']).toContain('text/html')
    expect(response.text).toContain('<div id="app">')
  })

  it('serves hashed assets with a long cache and 404s missing ones', async () => {
    const response = await request(app).get('/assets/app-1234.js').expect(200)
    expect(response.headers['cache-control']).toContain('immutable')
    await request(app).get('/assets/missing.js').expect(404)
  })

  it('keeps API 404s as JSON beside the fallback', async () => {
    const response = await request(app).get('/api/nothing').expect(404)
    expect(response.body.error.code).toBe('not-found')
  })
})

describe('environment', () => {
  it('applies the documented defaults', () => {
    const env = parseEnv({})
    expect(env.PORT).toBe(3000)
    expect(env.LOUDHOUR_DATA_DIR).toBe('./data')
    expect(env.PUBLIC_URL).toBe('http://localhost:3000')
    expect(env.SMTP_URL).toBeUndefined()
  })

  it('derives PUBLIC_URL from PORT and trims a trailing slash', () => {
    expect(parseEnv({ PORT: '4100' }).PUBLIC_URL).toBe('http://localhost:4100')
    expect(parseEnv({ PUBLIC_URL: 'https://sound.example/' }).PUBLIC_URL).toBe(
      'https://sound.example',
    )
  })

  it('names each bad setting', () => {
    expect(() => parseEnv({ PORT: 'eighty' })).toThrow(/PORT/)
    expect(() => parseEnv({ SESSION_SECRET: 'short' })).toThrow(
      /SESSION_SECRET must be at least 32/,
    )
  })

  it('generates a session secret once and keeps it in the data folder', () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'loudhour-secret-'))
    const first = resolveSessionSecret(dataDir, undefined)
    expect(Buffer.byteLength(first)).toBeGreaterThanOrEqual(32)
    expect(resolveSessionSecret(dataDir, undefined)).toBe(first)
    expect(readFileSync(join(dataDir, 'session-secret'), 'utf8').trim()).toBe(first)
    rmSync(dataDir, { recursive: true, force: true })
  })

  it('refuses a configured secret shorter than 32 bytes at start-up', () => {
    expect(() => resolveSessionSecret(tmpdir(), 'too-short')).toThrow(/at least 32 bytes/)
  })
})
