/** `npm run db:migrate`: applies drizzle/ migrations to the configured database. */
import { migrateDatabase } from "@/db/migrate";
import { env } from "@/lib/env";

await migrateDatabase();
console.log(`Migrations applied to ${env.databaseUrl}`);
