// The runtime card as an HTML e-mail body. Inline styles only (mail programs drop <style>), every
// value escaped, and no meaning in colour alone: severities are written out.
import { escapeHtml } from '../mail/templates'
import { CARD_HEADINGS, SEVERITY_WORDS, type RuntimeCard } from '../../shared/card/model'

const ink = 'color: #1b2326'
const cell = 'padding: 3px 10px 3px 0; vertical-align: top; text-align: left'
const heading = 'font-size: 15px; margin: 18px 0 6px; border-bottom: 1px solid #1b2326'

function h2(text: string): string {
  return `<h2 style="${heading}">${escapeHtml(text)}</h2>`
}

function rows(cells: string[][]): string {
  const body = cells
    .map((row) => `<tr>${row.map((value) => `<td style="${cell}">${value}</td>`).join('')}</tr>`)
    .join('\n')
  return `<table style="border-collapse: collapse; font-size: 14px">\n${body}\n</table>`
}

function paragraphs(texts: string[]): string {
  return texts.map((text) => `<p style="margin: 4px 0">${escapeHtml(text)}</p>`).join('\n')
}

function swapsHtml(card: RuntimeCard): string {
  if (card.swaps.length === 0) return paragraphs([card.noSwapNote])
  return rows(
    card.swaps.map((swap) => [
      `<strong style="font-size: 18px">${escapeHtml(swap.atLabel)}</strong>`,
      escapeHtml(swap.instruction),
    ]),
  )
}

/** The card, with an optional line above it saying who sent it. */
export function cardHtml(card: RuntimeCard, shareUrl: string, intro?: string): string {
  const when = [card.dateLabel, card.timeLabel].filter(Boolean).join(', ')
  const url = escapeHtml(shareUrl)
  const parts = [
    intro ? `<p style="margin: 0 0 12px; font-size: 14px">${escapeHtml(intro)}</p>` : '',
    `<h1 style="font-size: 22px; margin: 0 0 4px">${escapeHtml(card.title)}</h1>`,
    when
      ? `<p style="margin: 0 0 4px; font-size: 16px"><strong>${escapeHtml(when)}</strong></p>`
      : '',
    paragraphs([`Rig: ${card.rigName}. ${card.rigLine}`, card.conditions].filter(Boolean)),
    h2(CARD_HEADINGS.runtime),
    `<p style="margin: 4px 0; font-size: 16px"><strong>${escapeHtml(card.runtime.headline)}</strong></p>`,
    card.sound ? paragraphs([card.sound]) : '',
    h2(CARD_HEADINGS.swaps),
    swapsHtml(card),
    h2(CARD_HEADINGS.packs),
    `<p style="margin: 4px 0"><strong>${escapeHtml(card.packs.headline)}</strong> ${escapeHtml(card.packs.packLabel)}</p>`,
    card.segments.length > 0 ? h2(CARD_HEADINGS.day) : '',
    card.segments.length > 0
      ? rows(
          card.segments.map((segment) => [
            escapeHtml(`${segment.startLabel}–${segment.endLabel}`),
            `<strong>${escapeHtml(segment.label)}</strong>`,
            escapeHtml(segment.activity),
            segment.meter ? `<strong>${escapeHtml(segment.meter)}</strong>` : '',
          ]),
        )
      : '',
    card.meterNote ? paragraphs([card.meterNote]) : '',
    card.warnings.length > 0 ? h2(CARD_HEADINGS.warnings) : '',
    card.warnings.length > 0
      ? `<ul style="margin: 4px 0; padding-left: 20px">${card.warnings
          .map(
            (warning) =>
              `<li><strong>${SEVERITY_WORDS[warning.severity]}:</strong> ${escapeHtml(warning.message)}</li>`,
          )
          .join('\n')}</ul>`
      : '',
    h2(CARD_HEADINGS.cautions),
    `<ul style="margin: 4px 0; padding-left: 20px">${card.cautions
      .map(
        (caution) =>
          `<li><strong>${escapeHtml(caution.title)}.</strong> ${escapeHtml(caution.text)}</li>`,
      )
      .join('\n')}</ul>`,
    card.notes ? h2(CARD_HEADINGS.notes) : '',
    card.notes ? paragraphs([card.notes]) : '',
    `<p style="margin: 18px 0 4px"><a href="${url}" style="display: inline-block; padding: 10px 16px; background: #1f5e70; color: #ffffff; border-radius: 6px; text-decoration: none">Open the card to print it</a></p>`,
    `<p style="font-size: 13px; margin: 4px 0">Or paste this link into a browser: ${url}</p>`,
    `<p style="font-size: 13px; margin: 12px 0 0">${escapeHtml(card.disclaimer)}</p>`,
  ]
  return `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; ${ink}; line-height: 1.45; max-width: 720px">
${parts.filter(Boolean).join('\n')}
</body></html>`
}
