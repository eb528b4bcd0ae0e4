import path from "node:path";
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import { connect } from "./client";

const migrationsFolder = path.join(path.dirname(fileURLToPath(import.meta.url)), "migrations");

/** Applies every committed drizzle-kit migration that the database has not seen yet. */
export async function migrateDatabase(url: string): Promise<void> {
  const { db, close } = connect(url);
  try {
    await migrate(db, { migrationsFolder });
  } finally {
    await close();
  }
}
