// How a warning names a moment of the run. The engine knows no clock, so it says the time since
// switching on; a plan, which has a start time, swaps the phrase for its clock time
// (`onEventClock`), the same on screen and on the card.
import { durationWords } from '../card/format'

/** "about 9 h 58 min into the run". */
export function runMomentPhrase(minute: number): string {
  return `about ${durationWords(minute)} into the run`
}

/** A warning's message with its moment on the event clock: "… at about 10:58 …". */
export function onEventClock(
  warning: { message: string; atMinute?: number | undefined },
  clockAt: (minute: number) => string,
): string {
  if (warning.atMinute === undefined) return warning.message
  return warning.message.replace(
    runMomentPhrase(warning.atMinute),
    `at about ${clockAt(warning.atMinute)}`,
  )
}
