import { sqliteTable, text } from 'drizzle-orm/sqlite-core'

/** Small facts about the installation itself, e.g. which engine version computed the summaries. */
export const appMeta = sqliteTable('app_meta', {
  key: text('key').primaryKey(),
  value: text('value').notNull(),
})
