/**
 * Names are one line of plain text. C0 controls (U+0000–U+001F: NUL, tab, LF, CR …), DEL
 * (U+007F), the C1 controls (U+0080–U+009F, NEL among them) and the Unicode line and paragraph
 * separators (U+2028, U+2029) are refused: a CR or LF in a name could start a new line in a log
 * or a mail header, and a NUL cuts a C string short.
 */
export const singleLinePattern = /^[^\u0000-\u001f\u007f-\u009f\u2028\u2029]*$/u

export const singleLineMessage = 'Use no line breaks, tabs or other control characters'
