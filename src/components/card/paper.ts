// Paper for the printed card: the two office sizes and a half sheet of each, which fits a
// clipboard or a lanyard pocket. Sizes: ISO 216 (A4 210 × 297 mm, A5 148 × 210 mm) and ANSI/ASME
// Y14.1 (Letter 8.5 × 11 in = 215.9 × 279.4 mm; half letter 5.5 × 8.5 in = 139.7 × 215.9 mm).

export const PAPER_SIZES = ['a4', 'letter', 'a5', 'half-letter'] as const
export type PaperSize = (typeof PAPER_SIZES)[number]

export interface PaperSpec {
  label: string
  /** The CSS `@page` size. */
  pageSize: string
  widthMm: number
  heightMm: number
  marginMm: number
  /** A half sheet gets the compact layout. */
  half: boolean
}

export const PAPER: Record<PaperSize, PaperSpec> = {
  a4: { label: 'A4', pageSize: 'A4', widthMm: 210, heightMm: 297, marginMm: 10, half: false },
  letter: {
    label: 'Letter',
    pageSize: 'letter',
    widthMm: 215.9,
    heightMm: 279.4,
    marginMm: 10,
    half: false,
  },
  a5: { label: 'A5', pageSize: 'A5', widthMm: 148, heightMm: 210, marginMm: 7, half: true },
  'half-letter': {
    label: 'Half letter',
    pageSize: '5.5in 8.5in',
    widthMm: 139.7,
    heightMm: 215.9,
    marginMm: 7,
    half: true,
  },
}

/** CSS pixels per millimetre (CSS Values 4: 1in = 96px = 25.4mm). */
export const PX_PER_MM = 96 / 25.4

/** The printable height of a sheet, in CSS pixels. */
export function printableHeightPx(paper: PaperSpec): number {
  return (paper.heightMm - 2 * paper.marginMm) * PX_PER_MM
}

const paperKey = 'loudhour.card-paper.v1'

export function storedPaper(): PaperSize {
  try {
    const value = localStorage.getItem(paperKey)
    return (PAPER_SIZES as readonly string[]).includes(value ?? '') ? (value as PaperSize) : 'a4'
  } catch {
    return 'a4'
  }
}

export function storePaper(size: PaperSize): void {
  try {
    localStorage.setItem(paperKey, size)
  } catch {
    // Private windows may refuse storage; the choice then lasts the visit.
  }
}
