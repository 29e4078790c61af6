import Papa from 'papaparse'
import type { DischargeSample } from '../../shared/discharge/analyse'
import { columnRules, type ColumnRule, type LogQuantity } from '../../shared/discharge/columns'
import { ApiError } from '../http/errors'

/**
 * Reads a discharge log from a battery tester or logging meter: CSV with a header row, columns
 * found by name (case-insensitive, unit in the name). Time: `time_s`, `time_ms`, `time_min`,
 * `time_h`, or `time` as seconds or hh:mm:ss. Voltage: `voltage_v` or `voltage_mv`. Current:
 * `current_a` / `current_ma`, or else `power_w` / `power_mw` (I = P / V), or else a running
 * capacity `capacity_ah` / `capacity_mah` (I = ΔQ / Δt).
 */

export const maximumLogRows = 200_000

export function normaliseHeader(header: string): string {
  return header
    .trim()
    .toLowerCase()
    .replace(/^\uFEFF/, '')
    .replace(/[\s()[\]/\\-]+/g, '_')
    .replace(/_+/g, '_')
    .replace(/^_|_$/g, '')
}

function invalid(message: string): ApiError {
  return new ApiError(400, 'invalid-log', message)
}

/** Text that is not text (NUL bytes or many control characters) is not a CSV file at all. */
export function assertLooksLikeText(text: string): void {
  const sample = text.slice(0, 4096)
  let control = 0
  for (let index = 0; index < sample.length; index += 1) {
    const code = sample.charCodeAt(index)
    if (code === 0) control += sample.length
    else if (code < 32 && code !== 9 && code !== 10 && code !== 13) control += 1
    else if (code === 0xfffd) control += 1
  }
  if (sample.length === 0)
    throw invalid('The file is empty: upload a CSV with a header row and samples.')
  if (control / sample.length > 0.02) {
    throw new ApiError(
      415,
      'not-csv',
      'The file is not a text CSV file. Export the log from the tester as CSV.',
    )
  }
}

function parseClock(cell: string): number | undefined {
  const match = /^(\d+):([0-5]?\d)(?::([0-5]?\d(?:\.\d+)?))?$/.exec(cell)
  if (!match) return undefined
  const [, first, second, third] = match
  // hh:mm:ss, or mm:ss when there are two parts.
  return third === undefined
    ? Number(first) * 60 + Number(second)
    : Number(first) * 3600 + Number(second) * 60 + Number(third)
}

function parseNumber(cell: string, decimalComma: boolean): number | undefined {
  // A log written with ";" or tab between cells may use the decimal comma (4,05 for 4.05).
  const plain = decimalComma && /^[+-]?\d+,\d+$/.test(cell) ? cell.replace(',', '.') : cell
  // Only plain decimal numbers: a cell like "=1+2" or "@SUM(A1)" is refused, never evaluated.
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(plain)) return undefined
  const value = Number(plain)
  return Number.isFinite(value) ? value : undefined
}

/** The file's bytes as text: UTF-8, or UTF-16 when it starts with that byte-order mark. */
export function decodeLogBytes(bytes: Uint8Array): string {
  const encoding =
    bytes[0] === 0xff && bytes[1] === 0xfe
      ? 'utf-16le'
      : bytes[0] === 0xfe && bytes[1] === 0xff
        ? 'utf-16be'
        : 'utf-8'
  return new TextDecoder(encoding).decode(bytes)
}

type Column = { index: number; rule: ColumnRule; name: string }

function columnsOf(header: readonly string[]): Map<LogQuantity, Column> {
  const columns = new Map<LogQuantity, Column>()
  header.forEach((raw, index) => {
    const rule = columnRules[normaliseHeader(raw)]
    if (rule && !columns.has(rule.quantity))
      columns.set(rule.quantity, { index, rule, name: raw.trim() })
  })
  return columns
}

const isBlank = (row: readonly string[]) => row.every((cell) => cell.trim() === '')

// Testers often write a few lines about the device and the run above the header.
const maximumPreambleRows = 30

export function parseDischargeCsv(text: string): DischargeSample[] {
  assertLooksLikeText(text)
  if (text.trim() === '')
    throw invalid('The file is empty: upload a CSV with a header row and samples.')
  // Blank lines are kept while parsing so that a record's index is its line in the file.
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: false })
  const records = parsed.data
  const decimalComma = parsed.meta.delimiter !== ','
  const firstFilled = records.findIndex((row) => !isBlank(row))
  let headerIndex = firstFilled
  for (
    let index = firstFilled;
    index >= 0 && index < firstFilled + maximumPreambleRows;
    index += 1
  ) {
    const found = columnsOf(records[index] ?? [])
    if (found.has('time') && found.has('voltage')) {
      headerIndex = index
      break
    }
  }
  const header = records[headerIndex]
  const rows = records
    .map((row, index) => ({ row, rowNumber: index + 1 }))
    .slice(headerIndex + 1)
    .filter(({ row }) => !isBlank(row))
  if (!header || rows.length === 0) {
    throw invalid('The log needs a header row and at least two samples.')
  }
  if (rows.length > maximumLogRows) {
    throw invalid(
      `The log has ${rows.length} rows; at most ${maximumLogRows} are read. Log less often.`,
    )
  }

  const columns = columnsOf(header)
  const time = columns.get('time')
  const voltage = columns.get('voltage')
  const flow = columns.get('current') ?? columns.get('power') ?? columns.get('capacity')
  const missing = [
    time ? undefined : 'time (time_s, or time as seconds or hh:mm:ss)',
    voltage ? undefined : 'voltage (voltage_v or voltage_mv)',
    flow ? undefined : 'current (current_a or current_ma), or power_w, or capacity_mah',
  ].filter(Boolean)
  if (missing.length > 0 || !time || !voltage || !flow) {
    throw invalid(
      `The log has no column for ${missing.join('; ')}. Columns found: ${header.map((h) => h.trim()).join(', ')}.`,
    )
  }
  if (rows.length < 2) throw invalid('The log needs at least two samples.')

  const read = (row: string[], rowNumber: number, column: Column) => {
    const cell = (row[column.index] ?? '').trim()
    const value =
      parseNumber(cell, decimalComma) ?? (column.rule.clock ? parseClock(cell) : undefined)
    if (value === undefined) {
      const shown = cell.length > 24 ? `${cell.slice(0, 24)}…` : cell
      throw invalid(`Row ${rowNumber}, column ${column.name}: "${shown}" is not a number.`)
    }
    return value * column.rule.toSi
  }

  const samples: DischargeSample[] = []
  let previousCapacityAh = 0
  for (const { row, rowNumber } of rows) {
    const timeS = read(row, rowNumber, time)
    const voltageV = read(row, rowNumber, voltage)
    const flowValue = Math.abs(read(row, rowNumber, flow))
    const previous = samples[samples.length - 1]
    if (previous && timeS < previous.timeS) {
      throw invalid(
        `Row ${rowNumber}, column ${time.name}: time goes backwards (${timeS} s after ${previous.timeS} s).`,
      )
    }
    if (voltageV <= 0) {
      throw invalid(`Row ${rowNumber}, column ${voltage.name}: the voltage must be above zero.`)
    }
    let currentA: number
    switch (flow.rule.quantity) {
      case 'current':
        currentA = flowValue
        break
      case 'power':
        currentA = flowValue / voltageV
        break
      default: {
        const dt = previous ? timeS - previous.timeS : 0
        currentA = previous && dt > 0 ? ((flowValue - previousCapacityAh) * 3600) / dt : 0
        previousCapacityAh = flowValue
      }
    }
    samples.push({ timeS, voltageV, currentA })
  }
  // A running capacity gives the current of each interval at its end; the first sample takes
  // the second's so that the trapezoids do not start from an invented zero.
  if (flow.rule.quantity === 'capacity' && samples.length > 1)
    samples[0]!.currentA = samples[1]!.currentA
  if (samples[samples.length - 1]!.timeS <= samples[0]!.timeS) {
    throw invalid('The log covers no time: every sample has the same time.')
  }
  return samples
}
