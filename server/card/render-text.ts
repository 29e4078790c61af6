// The runtime card as plain text: the e-mail's text part, for readers without HTML.
import { CARD_HEADINGS, SEVERITY_WORDS, type RuntimeCard } from '../../shared/card/model'

function section(heading: string, lines: string[]): string {
  return [heading.toUpperCase(), ...lines].join('\n')
}

/** The card, with an optional line above it saying who sent it. */
export function cardText(card: RuntimeCard, shareUrl: string, intro?: string): string {
  const when = [card.dateLabel, card.timeLabel].filter(Boolean).join(', ')
  const sections = [
    ...(intro ? [intro] : []),
    [`${card.title} — runtime card`, when, `Rig: ${card.rigName}. ${card.rigLine}`, card.conditions]
      .filter(Boolean)
      .join('\n'),
    section(CARD_HEADINGS.runtime, [card.runtime.headline, ...(card.sound ? [card.sound] : [])]),
    section(
      CARD_HEADINGS.swaps,
      card.swaps.length > 0
        ? card.swaps.map((swap) => `${swap.atLabel}  ${swap.instruction}`)
        : [card.noSwapNote],
    ),
    section(CARD_HEADINGS.packs, [card.packs.headline, card.packs.packLabel]),
    ...(card.segments.length > 0
      ? [
          section(CARD_HEADINGS.day, [
            ...card.segments.map(
              (segment) =>
                `${segment.startLabel}–${segment.endLabel}  ${segment.label}: ${segment.activity}${segment.meter ? `. ${segment.meter}` : ''}`,
            ),
            ...(card.meterNote ? [card.meterNote] : []),
          ]),
        ]
      : []),
    ...(card.warnings.length > 0
      ? [
          section(
            CARD_HEADINGS.warnings,
            card.warnings.map(
              (warning) => `${SEVERITY_WORDS[warning.severity]}: ${warning.message}`,
            ),
          ),
        ]
      : []),
    section(
      CARD_HEADINGS.cautions,
      card.cautions.map((caution) => `${caution.title}: ${caution.text}`),
    ),
    ...(card.notes ? [section(CARD_HEADINGS.notes, [card.notes])] : []),
    `Open or print the card: ${shareUrl}`,
    card.disclaimer,
  ]
  return `${sections.join('\n\n')}\n`
}
