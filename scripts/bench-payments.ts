// Benchmark of the admin payments table: 200,000 payments over 20,000 invented people in a database of
// its own, asked of the real route handlers (app/api/admin/payments: guard, validation, query, JSON)
// with an admin's session, in this process, the database on loopback. For a filtered, sorted page
// without a name search and with searches matching one person, 200 and 800, and two totals, it prints
// p50/p95/p99 in ms one request at a time (the target: p95 ≤ 100 ms, every case) and with 20 in flight,
// in interleaved rounds (BENCH_ROUNDS, BENCH_REQUESTS per case each round). BENCH_HTTP=1 also asks them
// over HTTP of the built app (./bench-payments-http.ts). Exits non-zero when a case misses the target.
//   npm run -s bench:payments          (TEST_PG_ADMIN_URL or DATABASE_URL names the cluster)
import { randomBytes } from "node:crypto";
import { cpus, loadavg } from "node:os";
import { performance } from "node:perf_hooks";
import postgres from "postgres";
import {
  answerWords,
  CONCURRENCY,
  cpuCheck,
  oneAtATime,
  report,
  ROUNDS,
  type Answer,
  type Case,
  type Round,
} from "./bench-payments-common";
import { overHttp } from "./bench-payments-http";

const PAYMENTS = Number(process.env.BENCH_PAYMENTS ?? 200_000);
const USERS = Number(process.env.BENCH_USERS ?? 20_000);
const REQUESTS = Number(process.env.BENCH_REQUESTS ?? 1000);

const base = process.env.TEST_PG_ADMIN_URL ?? process.env.DATABASE_URL;
if (!base)
  throw new Error(
    "set TEST_PG_ADMIN_URL (or DATABASE_URL) to a PostgreSQL cluster the benchmark may create a database on",
  );
const name = `bench_payments_${randomBytes(4).toString("hex")}`;
const url = base.replace(/\/[^/?]+(\?|$)/, `/${name}$1`);
const admin = postgres(base.replace(/\/[^/?]+(\?|$)/, "/postgres$1"), { max: 1, onnotice: () => {} });

async function fill(sql: postgres.Sql): Promise<{ monthly: string }> {
  const [m] =
    await sql`insert into plans (name, amount, currency, interval) values ('Monthly membership', 1800, 'GBP', 'month') returning id`;
  const [y] =
    await sql`insert into plans (name, amount, currency, interval) values ('Yearly membership', 18000, 'GBP', 'year') returning id`;
  // Invented names from two short lists, numbered so every address is unique.
  await sql`
    insert into users (email, name, role)
    select 'member' || i || '@bench.example',
           (array['Alder','Bryony','Cathal','Delphine','Emrys','Fenella','Gideon','Hester','Ivo','Juno','Kester','Linnea','Morwen','Niall','Orla','Perrin','Quilla','Rhodri','Sabine','Tamsin'])[1 + i % 20]
           || ' ' ||
           (array['Thistlewood','Marrable','Quenby','Holloway','Dunsmore','Featherstane','Corrigall','Ashwell','Brackenbury','Tredinnick','Gallacher','Penrose','Whitlow','Strachan','Merriday','Oakhanger','Birchall','Fairweather','Cowdray','Lindqvist','Harrowby','Pellow','Rainsford','Sowerby','Tilney'])[1 + (i * 7) % 25]
           || ' ' || i,
           'student'
    from generate_series(1, ${USERS}) as i`;
  await sql`create temp table bench_people as select row_number() over (order by created_at, id) as n, id from users`;
  await sql`create index on bench_people (n)`;
  // Payments over the last year: mostly paid, some failed or refunded; one in five yearly.
  await sql`
    insert into payments (user_id, plan_id, stripe_invoice_id, kind, amount, refunded_amount, currency, status, created_at)
    select u.id,
           case when g % 5 = 0 then ${y.id}::uuid else ${m.id}::uuid end,
           'in_bench_' || g,
           (case when g % 12 = 0 then 'new' else 'renewal' end)::payment_kind,
           case when g % 5 = 0 then 18000 else 1800 + (g % 4) * 50 end,
           case when g % 23 = 0 then 500 else 0 end,
           'GBP',
           (case when g % 23 = 0 then 'partially_refunded' when g % 17 = 0 then 'failed' when g % 29 = 0 then 'refunded' else 'paid' end)::payment_status,
           now() - ((g * 7919) % 525600) * interval '1 minute'
    from generate_series(1, ${PAYMENTS}) as g
    join bench_people u on u.n = 1 + (g * 31) % ${USERS}`;
  await sql`update payments set refunded_amount = amount where status = 'refunded'`;
  await sql`vacuum analyze`; // as autovacuum would after a bulk load: statistics and the visibility map (index-only scans)
  return { monthly: m.id as string };
}

const answerOf = async (res: Response): Promise<Answer> => ({
  status: res.status,
  body: (await res.json()) as Answer["body"],
});

type Measured = { c: Case; call: () => Promise<Answer> };

/**
 * Each case one at a time (also the warm-up), then ROUNDS rounds, each asking every case in turn
 * REQUESTS times with CONCURRENCY in flight: interleaving the cases spreads the machine's own drift
 * (this VM's speed moves by a fifth from minute to minute) over all of them. Prints each round's p95
 * and the percentiles over every round's requests together.
 */
async function measure(list: Measured[]) {
  const alone = new Map<Case, { xs: number[]; answer: string }>();
  for (const m of list) alone.set(m.c, await oneAtATime(m.call));
  const rounds = new Map<Case, Round[]>(list.map((m) => [m.c, []]));
  for (let r = 0; r < ROUNDS; r++) {
    for (const m of list) {
      const times: number[] = [];
      let next = 0;
      const wall = performance.now();
      await Promise.all(
        Array.from({ length: CONCURRENCY }, async () => {
          while (next < REQUESTS) {
            next++;
            const started = performance.now();
            answerWords(await m.call());
            times.push(performance.now() - started);
          }
        }),
      );
      rounds.get(m.c)!.push({ times: times.sort((a, b) => a - b), seconds: (performance.now() - wall) / 1000 });
    }
  }
  return list.map(({ c }) => report(c, alone.get(c)!, rounds.get(c)!, `${REQUESTS} requests`)).every(Boolean);
}

async function main() {
  await admin.unsafe(`create database "${name}"`);
  try {
    const { migrateDatabase } = await import("@/db/migrate");
    await migrateDatabase(url);
    const sql = postgres(url, { max: 1, onnotice: () => {} });
    const t0 = performance.now();
    const { monthly } = await fill(sql);
    console.log(
      `seeded ${PAYMENTS} payments over ${USERS} people in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );

    process.env.DATABASE_URL = url;
    process.env.APP_URL ??= "http://127.0.0.1:3000";
    const [me] =
      await sql`insert into users (email, name, role) values ('bench-admin@bench.example', 'Bench Admin', 'admin') returning id`;
    const to = new Date();
    const from = new Date(to.getTime() - 92 * 86_400_000);
    // One person, as an admin looks up a member: the one with the most paid monthly payments in the range,
    // among those numbered 10,000 and up (a five-digit number in the name, so no other name contains it).
    const [one] = await sql`
      select u.name from payments p join users u on u.id = p.user_id
      where p.status = 'paid' and p.plan_id = ${monthly} and p.created_at >= ${from} and u.email ~ '^member1[0-9]{4}@'
      group by u.name order by count(*) desc, u.name limit 1`;
    await sql.end();
    const { lucia } = await import("@/lib/auth/lucia");
    const session = await lucia().createSession(me.id as string, {});
    const cookie = `${lucia().sessionCookieName}=${session.id}`;

    const filtered = {
      status: "paid",
      plan: monthly,
      from: from.toISOString().slice(0, 10),
      to: to.toISOString().slice(0, 10),
    };
    const ordered = { sort: "amount", dir: "desc", page: "3", pageSize: "25" };
    // The table asks for its total apart, once per set of filters (components/admin/server-table.tsx).
    const cases: Case[] = [
      {
        label: 'page: paid, monthly, 92 days, name or e-mail contains "wood" (800 of 20,000 people), by amount, page 3',
        path: "admin/payments",
        query: { ...filtered, q: "wood", ...ordered },
      },
      {
        label: 'page: paid, monthly, 92 days, name contains "Ivo Penrose" (200 of 20,000 people), by amount, page 3',
        path: "admin/payments",
        query: { ...filtered, q: "Ivo Penrose", ...ordered },
      },
      {
        label: `page: paid, monthly, 92 days, name contains "${one.name}" (one person), by amount, page 1`,
        path: "admin/payments",
        query: { ...filtered, q: one.name as string, ...ordered, page: "1" },
      },
      {
        label: "page: paid, monthly, 92 days, by amount, page 3",
        path: "admin/payments",
        query: { ...filtered, ...ordered },
      },
      {
        label: 'count: paid, monthly, 92 days, name or e-mail contains "wood"',
        path: "admin/payments/count",
        query: { ...filtered, q: "wood" },
      },
      { label: "count: paid, monthly, 92 days", path: "admin/payments/count", query: filtered },
    ];
    console.log(
      `machine: ${cpus().length} CPUs, load average ${loadavg()
        .map((l) => l.toFixed(1))
        .join(" ")}; ${cpuCheck()}`,
    );

    // In this process: the route handlers called directly (guard, validation, queries, JSON).
    const { GET: page } = await import("@/app/api/admin/payments/route");
    const { GET: count } = await import("@/app/api/admin/payments/count/route");
    console.log("\n== the route handlers in this process (database on loopback)");
    const met = await measure(
      cases.map((c) => {
        const route = c.path.endsWith("count") ? count : page;
        const address = `${process.env.APP_URL}/api/${c.path}?${new URLSearchParams(c.query)}`;
        return {
          c,
          call: async () =>
            answerOf(await route(new Request(address, { headers: { cookie } }), { params: Promise.resolve({}) })),
        };
      }),
    );

    // BENCH_HTTP=1: the same requests over HTTP on loopback to `next start` (the last `next build`),
    // and /api/health (one trivial query) as the floor of HTTP through Next.js on this machine.
    console.log(
      met
        ? "\nevery case met the target (one at a time, p95 ≤ 100 ms)"
        : "\nA CASE MISSED THE TARGET (one at a time, p95 ≤ 100 ms)",
    );
    if (!met) process.exitCode = 1;
    if (process.env.BENCH_HTTP === "1") await overHttp(cases, cookie);
    const { closeDb } = await import("@/db/client");
    await closeDb();
  } finally {
    // BENCH_KEEP=1 keeps the database for EXPLAIN ANALYZE.
    if (process.env.BENCH_KEEP === "1") console.log(`kept database ${name}`);
    else await admin.unsafe(`drop database if exists "${name}" with (force)`);
    await admin.end({ timeout: 5 });
  }
}

await main();
