import { defineConfig } from 'drizzle-kit'

// `npm run db:generate` writes a new SQL migration into drizzle/ from server/db/schema.ts.
export default defineConfig({
  dialect: 'sqlite',
  schema: './server/db/schema.ts',
  out: './drizzle',
})
