import { migrateDatabase } from "@/db/migrate";
import { env } from "@/lib/env";

try {
  await migrateDatabase(env().DATABASE_URL);
  console.log("migrations applied");
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}
