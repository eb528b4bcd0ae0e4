import { randomBytes } from "node:crypto";
import postgres from "postgres";
import { connect, type Db } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";

function adminUrl(): string {
  const url = process.env.TEST_PG_ADMIN_URL;
  if (!url) throw new Error("TEST_PG_ADMIN_URL is not set: run integration tests through `npm test`");
  return url;
}

/** A fresh, migrated database on the test cluster; `drop()` removes it. */
export async function createTestDatabase(): Promise<{ url: string; db: Db; drop: () => Promise<void> }> {
  const name = `t_${randomBytes(6).toString("hex")}`;
  const admin = postgres(adminUrl(), { max: 1, onnotice: () => {} });
  await admin.unsafe(`create database "${name}"`);
  const url = adminUrl().replace(/\/[^/?]+(\?|$)/, `/${name}$1`);
  await migrateDatabase(url);
  const { db, close } = connect(url);
  return {
    url,
    db,
    drop: async () => {
      await close();
      await admin.unsafe(`drop database if exists "${name}" with (force)`);
      await admin.end({ timeout: 5 });
    },
  };
}
