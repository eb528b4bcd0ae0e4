import { Lucia, TimeSpan } from "lucia";
import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { env } from "@/lib/env";

type Role = "student" | "teacher" | "admin";

// Every request asks PostgreSQL (the adapter's one query: the session by primary key joined to its
// person), so a sign-out, a role change or a disabled account holds on the next request in every process.
function create() {
  return new Lucia(new DrizzlePostgreSQLAdapter(db(), sessions, users), {
    // Sliding expiry: lucia extends a session used in the second half of its 30-day life.
    sessionExpiresIn: new TimeSpan(30, "d"),
    // The cookie lives as long as the session (lucia sets Max-Age to sessionExpiresIn and re-sends it
    // when it slides), never longer: an ended session leaves no cookie for the browser to keep sending.
    sessionCookie: {
      name: "rosinwood_session",
      attributes: { secure: env().INSECURE_COOKIES !== "true", sameSite: "lax" },
    },
    getUserAttributes: (a) => ({ name: a.name, email: a.email, role: a.role, disabled: a.disabled }),
  });
}

let instance: ReturnType<typeof create> | undefined;
export function lucia() {
  instance ??= create();
  return instance;
}

declare module "lucia" {
  interface Register {
    Lucia: ReturnType<typeof create>;
    DatabaseUserAttributes: { name: string; email: string; role: Role; disabled: boolean };
  }
}
