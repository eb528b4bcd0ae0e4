import Link from "next/link";
import { headers } from "next/headers";
import { getCurrentUser } from "@/lib/auth/current-user";
import { HOME, type Role } from "@/lib/auth/permissions";

export const metadata = { title: "Not your area" };

// Who each signed-in area is for, by the address's first segment (middleware.ts passes the address asked for).
const AREA: Record<string, string> = {
  learn: "the students' area, for members of the school",
  teach: "the teachers' area, for the school's teachers",
  admin: "the school's administration, for its admin",
};
const OWN: Record<Role, { role: string; area: string }> = {
  student: { role: "a student", area: "Go to Today, your own area" },
  teacher: { role: "a teacher", area: "Go to your roster" },
  admin: { role: "the school's admin", area: "Go to the admin pages" },
};

export default async function Forbidden() {
  const [user, asked] = await Promise.all([getCurrentUser(), headers().then((h) => h.get("x-rosinwood-path"))]);
  const segment = asked?.split(/[/?#]/)[1] ?? "";
  const area = AREA[segment] ?? "another part of the school";
  return (
    <div className="mx-auto flex w-full max-w-prose flex-1 flex-col justify-center gap-5 px-4 py-20">
      <p className="font-semibold tracking-widest text-cedar uppercase">403 · not your area</p>
      <h1 className="text-h2 font-semibold">This page belongs to another area</h1>
      <p className="text-lead text-bark">{`${asked ?? "This address"} is in ${area}.`}</p>
      {user ? (
        <>
          <p data-testid="signed-in-as" className="break-words">
            {`You are signed in as ${user.name} (${user.email}), ${OWN[user.role].role}.`}
          </p>
          <p className="flex flex-wrap gap-x-6 gap-y-2">
            <Link href={HOME[user.role]} className="font-semibold">
              {OWN[user.role].area}
            </Link>
            <Link href="/sign-in">Sign in as someone else</Link>
          </p>
        </>
      ) : (
        <p>
          <Link href="/sign-in">Sign in</Link>
        </p>
      )}
    </div>
  );
}
