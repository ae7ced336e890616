import { sql } from "drizzle-orm";
import { NextResponse } from "next/server";
import { db } from "@/db/client";

/** Liveness and database reachability, for load balancers and the test runner. */
export async function GET() {
  try {
    await db.run(sql`select 1`);
    return NextResponse.json({ ok: true });
  } catch (error) {
    console.error("[health] database unreachable", error);
    return NextResponse.json({ ok: false }, { status: 503 });
  }
}
