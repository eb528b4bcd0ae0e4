import { NextResponse } from "next/server";
import { databaseHealth } from "@/db/queries/health";

export const dynamic = "force-dynamic";

/** 200 when the database answers, 503 when it does not (load balancers and start.sh read this). */
export async function GET() {
  const database = await databaseHealth();
  const body = { app: "ok", database: database.ok ? "ok" : "unavailable", latencyMs: database.latencyMs };
  return NextResponse.json(body, { status: database.ok ? 200 : 503, headers: { "cache-control": "no-store" } });
}
