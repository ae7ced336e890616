import { e2eDatabase } from "./reservation-support";
import type { DemoRole } from "./support";

// The seed (db/seed.ts) makes 40 farmers, 20 builders and 13 hatcheries besides the demo accounts, all with the demo
// password. Specs that need several accounts of a role, or an account whose data no other spec looks at, take them
// from the e2e server's database file: the demo accounts themselves (@shoal.demo names without a dot before the @,
// hatchery-builder@ too) are left to the specs that show them.

const DEMO_LOCAL_PART = /^[a-z-]+@shoal\.demo$/;

/** E-mail addresses of seeded accounts holding `role` and no other role, demo accounts excluded, in a fixed order. */
export async function seededAccounts(role: DemoRole, count: number, skip = 0): Promise<string[]> {
  const db = e2eDatabase();
  try {
    const rows = await db.execute({
      sql: `select u.email as email from user u join user_role r on r.user_id = u.id
            where r.role = ? and (select count(*) from user_role o where o.user_id = u.id) = 1
            order by u.email`,
      args: [role],
    });
    const emails = rows.rows.map((r) => String(r.email)).filter((e) => !DEMO_LOCAL_PART.test(e));
    const picked = emails.slice(skip, skip + count);
    if (picked.length < count) throw new Error(`the seed has only ${emails.length} ${role} accounts besides the demo ones; ${skip + count} wanted`);
    return picked;
  } finally {
    db.close();
  }
}
