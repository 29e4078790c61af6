import { afterEach, describe, expect, it, vi } from 'vitest'
import { uploadDischargeLog } from '@/api/dischargeLogs'
import { ApiRequestError, onUnauthorized } from '@/api/http'

// A stand-in XMLHttpRequest that answers with the status the test sets.
function answerUploadsWith(status: number, response: unknown) {
  class FakeRequest {
    status = 0
    response: unknown = null
    responseType = ''
    upload = { addEventListener: () => {} }
    private listeners = new Map<string, () => void>()
    open() {}
    addEventListener(type: string, listener: () => void) {
      this.listeners.set(type, listener)
    }
    send() {
      this.status = status
      this.response = response
      queueMicrotask(() => this.listeners.get('load')?.())
    }
  }
  vi.stubGlobal('XMLHttpRequest', FakeRequest)
}

afterEach(() => vi.unstubAllGlobals())

const file = () => new File(['elapsed_s,voltage_v,current_a\n0,20,2\n'], 'log.csv')

describe('uploading a discharge log', () => {
  it('sends the user to sign-in when the session has ended, as every other request does', async () => {
    const signIn = vi.fn()
    const stop = onUnauthorized(signIn)
    answerUploadsWith(401, { error: { code: 'unauthenticated', message: 'Sign in first.' } })
    const upload = uploadDischargeLog(1, 2, file(), () => {})
    await expect(upload).rejects.toBeInstanceOf(ApiRequestError)
    expect(signIn).toHaveBeenCalledOnce()
    stop()
  })

  it('keeps the user on the page for any other refusal, with the server message', async () => {
    const signIn = vi.fn()
    const stop = onUnauthorized(signIn)
    answerUploadsWith(415, { error: { code: 'unsupported', message: 'Not a CSV file.' } })
    await expect(uploadDischargeLog(1, 2, file(), () => {})).rejects.toThrow('Not a CSV file.')
    expect(signIn).not.toHaveBeenCalled()
    stop()
  })
})
