// What a number field says about text that is not a number yet. naive-ui's number input keeps
// such text on screen struck through and tells nobody; these messages say at the field what to
// type instead.

/** Text still being typed that will become a number ("-", ".", "-."): nothing to say yet. */
const unfinished = /^-?\.?$/

/**
 * The message for text typed into a number field, or null when it reads as a number (or is
 * empty, which the form's own checks judge). Only digits with a point read as numbers: a comma
 * is a decimal mark in much of the world but a thousands mark in the rest, so it is never guessed.
 */
export function unreadableNumberMessage(text: string): string | null {
  const typed = text.trim()
  if (typed === '' || unfinished.test(typed)) return null
  if (/^-?\d+,\d+$/.test(typed)) return `Use a point for decimals: ${typed.replace(',', '.')}`
  const value = Number(typed)
  if (Number.isFinite(value)) return null
  return `“${typed}” is not a number: type digits, such as 12 or 4.5`
}

/** Said under a field after it lost focus holding such text and went back to its last value. */
export function revertedNumberNote(typed: string): string {
  return `“${typed.trim()}” was not a number, so the field went back to its last value.`
}
