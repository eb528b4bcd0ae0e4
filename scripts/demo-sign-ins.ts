import { ADMIN, STUDENTS, TEACHERS } from "@/db/seed-data/people";

const rows: [string, string][] = [
  ["admin", ADMIN.email],
  ["teacher", TEACHERS[0].email],
  ["student", STUDENTS[0].email],
];
for (const [role, email] of rows) console.log(`    ${role.padEnd(8)} ${email}`);
