import { Writable } from 'node:stream'
import { createLogger, type Logger } from '../../server/http/log'

export type LogLine = Record<string, unknown> & { msg?: string; event?: string }

export interface LogCapture {
  logger: Logger
  /** Every line written so far, as written (to search for secrets). */
  text: () => string
  lines: () => LogLine[]
  events: (name: string) => LogLine[]
}

/** The app's own logger (same redaction, same serializers) writing into memory at `info`. */
export function captureLog(): LogCapture {
  const chunks: string[] = []
  const sink = new Writable({
    write(chunk: Buffer, _encoding, done) {
      chunks.push(chunk.toString('utf8'))
      done()
    },
  })
  const logger = createLogger('debug', sink)
  const text = () => chunks.join('')
  const lines = () =>
    text()
      .split('\n')
      .filter((line) => line.trim() !== '')
      .map((line) => JSON.parse(line) as LogLine)
  return { logger, text, lines, events: (name) => lines().filter((line) => line.event === name) }
}
