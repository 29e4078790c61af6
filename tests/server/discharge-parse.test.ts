import { describe, expect, it } from 'vitest'
import {
  decodeLogBytes,
  normaliseHeader,
  parseDischargeCsv,
} from '../../server/discharge/parse-log'
import { ApiError } from '../../server/http/errors'

function expectRefusal(text: string, status: number, pattern: RegExp) {
  try {
    parseDischargeCsv(text)
  } catch (error) {
    expect(error).toBeInstanceOf(ApiError)
    expect((error as ApiError).status).toBe(status)
    expect((error as ApiError).message).toMatch(pattern)
    return
  }
  throw new Error('expected the log to be refused')
}

describe('discharge log columns', () => {
  it('normalises headers with units in brackets', () => {
    expect(normaliseHeader(' Voltage (V) ')).toBe('voltage_v')
    expect(normaliseHeader('Current[mA]')).toBe('current_ma')
    expect(normaliseHeader('\uFEFFTime_S')).toBe('time_s')
  })

  it('reads seconds, volts and amps', () => {
    const samples = parseDischargeCsv('time_s,voltage_v,current_a\n0,12.6,2\n10,12.5,2\n')
    expect(samples).toEqual([
      { timeS: 0, voltageV: 12.6, currentA: 2 },
      { timeS: 10, voltageV: 12.5, currentA: 2 },
    ])
  })

  it('converts millivolts and milliamps, and takes the magnitude of a negative discharge current', () => {
    const samples = parseDischargeCsv(
      'Time (s);Voltage (mV);Current (mA)\n0;4100;-1500\n1;4090;-1500\n',
    )
    expect(samples[0]).toEqual({ timeS: 0, voltageV: 4.1, currentA: 1.5 })
  })

  it('reads hh:mm:ss times in a plain time column', () => {
    const samples = parseDischargeCsv('time,voltage_v,current_a\n00:00:00,12,1\n01:02:03,11.9,1\n')
    expect(samples[1]!.timeS).toBe(3723)
  })

  it('derives current from power (I = P / V)', () => {
    const samples = parseDischargeCsv('time_s,voltage_v,power_w\n0,12,24\n60,12,24\n')
    expect(samples[0]!.currentA).toBeCloseTo(2, 10)
  })

  it('derives current from a running mAh count (I = ΔQ / Δt)', () => {
    // 500 mAh per half hour is 1 A.
    const samples = parseDischargeCsv(
      'time_s,voltage_v,capacity_mah\n0,12,0\n1800,11.9,500\n3600,11.8,1000\n',
    )
    expect(samples.map((sample) => sample.currentA)).toEqual([1, 1, 1])
  })
})

describe('logs as testers write them', () => {
  it('finds the header below a few lines about the device and the run', () => {
    const samples = parseDischargeCsv(
      'Logger export\nStarted,2026-05-01 09:00\n\ntime_s,voltage_v,current_a\n0,12,1\n5,11.9,1\n',
    )
    expect(samples).toEqual([
      { timeS: 0, voltageV: 12, currentA: 1 },
      { timeS: 5, voltageV: 11.9, currentA: 1 },
    ])
  })

  it('reads decimal commas when cells are separated by semicolons', () => {
    // common practice: spreadsheets in decimal-comma locales separate CSV cells with ";".
    const samples = parseDischargeCsv('time_s;voltage_v;current_a\n0;12,55;1,5\n1;12,5;1,5\n')
    expect(samples[0]).toEqual({ timeS: 0, voltageV: 12.55, currentA: 1.5 })
  })

  it('decodes UTF-16 text with a byte-order mark', () => {
    // Source: The Unicode Standard, ch. 23.8: U+FEFF written as FF FE marks UTF-16 little-endian.
    const text = '\uFEFFtime_s,voltage_v,current_a\n0,12,1\n'
    const bytes = new Uint8Array([0xff, 0xfe, ...Buffer.from(text.slice(1), 'utf16le')])
    expect(decodeLogBytes(bytes)).toBe(text.slice(1))
  })
})

describe('refusals that name what is wrong', () => {
  it('names the row as the line of the file, blank lines counted', () =>
    expectRefusal(
      'time_s,voltage_v,current_a\n0,12,1\n\n\n5,12,x\n',
      400,
      /Row 5, column current_a: "x" is not a number/,
    ))
  it('refuses an empty file', () => expectRefusal('', 400, /empty/))
  it('refuses binary junk with 415', () =>
    expectRefusal('\u0000\u0001\u0002PK\u0003\u0004\u0000\u0000', 415, /not a text CSV/))
  it('names the missing columns', () =>
    expectRefusal('time_s,temp_c\n0,20\n1,20\n', 400, /voltage.*current/))
  it('names the row and column of a bad number', () =>
    expectRefusal(
      'time_s,voltage_v,current_a\n0,12,1\n1,twelve,1\n',
      400,
      /Row 3, column voltage_v/,
    ))
  it('never evaluates formula-looking cells', () =>
    expectRefusal(
      'time_s,voltage_v,current_a\n0,=1+11,1\n1,12,1\n',
      400,
      /Row 2, column voltage_v: "=1\+11" is not a number/,
    ))
  it('refuses time that goes backwards', () =>
    expectRefusal('time_s,voltage_v,current_a\n10,12,1\n5,12,1\n', 400, /time goes backwards/))
  it('refuses a header with only one sample', () =>
    expectRefusal('time_s,voltage_v,current_a\n0,12,1\n', 400, /two samples/))
})
