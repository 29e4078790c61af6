import request from 'supertest'
import { createTestApp } from './test-app'

/**
 * Posts `{}` to a public route of a fresh app until it answers 429 (or `attempts` run out); the
 * last status, its Retry-After and how many requests it took.
 */
export async function postUntilThrottled(
  path: string,
  attempts: number,
): Promise<{ status: number; retryAfter: string | undefined; requests: number }> {
  const own = createTestApp()
  try {
    let status = 0
    let retryAfter: string | undefined
    let requests = 0
    while (requests < attempts && status !== 429) {
      const response = await request(own.app).post(path).send({})
      requests += 1
      status = response.status
      retryAfter = response.headers['retry-after']
    }
    return { status, retryAfter, requests }
  } finally {
    await own.close()
  }
}
