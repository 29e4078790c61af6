/** Bump whenever a change alters any result, so saved summaries can be told apart. */
export const ENGINE_VERSION = '1.3.0'
