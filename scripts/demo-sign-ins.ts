import { ADMIN, DEMO_PASSWORD, SCHOOL_NAME, STUDENTS, TEACHERS } from "@/db/seed-data/people";

// Printed by start.sh: the invented demo school's sign-ins (README lists the same).
const rows: [string, string][] = [
  ["admin", ADMIN.email],
  ["teacher", TEACHERS[0].email],
  ["student", STUDENTS[0].email],
];
console.log(`  Demo school: ${SCHOOL_NAME}. Sign in with (password for every demo person: ${DEMO_PASSWORD}):`);
for (const [role, email] of rows) console.log(`    ${role.padEnd(8)} ${email}`);
