/** `npm run seed`: applies migrations, then seeds the demo data (idempotent). */
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/lib/demo";
import { env } from "@/lib/env";

await migrateDatabase();
await seedDemo((line) => console.log(line));
console.log(`Demo data ready in ${env.databaseUrl}`);
