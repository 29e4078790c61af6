import { describe, expect, it } from 'vitest'
import { revertedNumberNote, unreadableNumberMessage } from '@/display/numberText'

describe('what a number field says about typed text', () => {
  it('says nothing for numbers, empty fields and a number still being typed', () => {
    // Source: ECMAScript Number(): "12", " 4.5 ", "-6", "1e3" are numbers; a lone sign is not yet
    for (const text of ['12', ' 4.5 ', '-6', '1e3', '', '  ', '-', '.', '-.']) {
      expect(unreadableNumberMessage(text)).toBeNull()
    }
  })

  it('says what is wrong with text that is not a number', () => {
    expect(unreadableNumberMessage('abc')).toBe(
      '“abc” is not a number: type digits, such as 12 or 4.5',
    )
    expect(unreadableNumberMessage('12 V')).toBe(
      '“12 V” is not a number: type digits, such as 12 or 4.5',
    )
  })

  it('asks for a decimal point where a comma was typed, and never guesses', () => {
    // Source: common practice: a comma is the decimal mark in much of Europe and a thousands
    // separator in English, so "2,5" is asked about rather than read either way
    expect(unreadableNumberMessage('2,5')).toBe('Use a point for decimals: 2.5')
    expect(unreadableNumberMessage('-0,75')).toBe('Use a point for decimals: -0.75')
  })

  it('says what was dropped when the field went back to its last value', () => {
    expect(revertedNumberNote(' abc ')).toBe(
      '“abc” was not a number, so the field went back to its last value.',
    )
  })
})
