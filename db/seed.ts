import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { createClient } from "@libsql/client";
import { hashPassword } from "better-auth/crypto";
import { randomUUID } from "node:crypto";
import { resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { inArray, sql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/libsql";
import sharp from "sharp";
import { refreshListings } from "../lib/listings/sync";
import { encodeVariants, variantKey } from "../lib/storage/variants";
import { loadDotEnv } from "../scripts/load-env";
import type { Role, Species, TankType, VerificationState } from "../lib/catalog";
import { allSchema } from "./all-schema";
import { seedJobs } from "./seed-jobs";
import * as schema from "./schema";
import { seedReservations } from "./seed-reservations";
import { seedReviews } from "./seed-reviews";
import { BUILDER_NAMES, FIRST_NAMES, HATCHERY_NAMES, SURNAMES, TOWNS, type Town } from "./seed-data";
import { rng } from "./seed-random";

export const DEMO_PASSWORD = "shoal-demo-2026";
export const DEMO_ACCOUNTS = {
  admin: "admin@shoal.demo",
  farmer: "farmer@shoal.demo",
  hatchery: "hatchery@shoal.demo",
  builder: "builder@shoal.demo",
  hatcheryBuilder: "hatchery-builder@shoal.demo",
} as const;

const COUNTS = { hatcheries: 13, builders: 20, farmers: 40 };


function near(town: Town, rand: () => number, km: number): { lat: number; lng: number } {
  const r = km * Math.sqrt(rand());
  const theta = rand() * 2 * Math.PI;
  const dLat = (r * Math.cos(theta)) / 110.574;
  const dLng = (r * Math.sin(theta)) / (111.32 * Math.cos((town.lat * Math.PI) / 180));
  return { lat: Number((town.lat + dLat).toFixed(5)), lng: Number((town.lng + dLng).toFixed(5)) };
}

function pick<T>(items: readonly T[], rand: () => number): T {
  const item = items[Math.floor(rand() * items.length)];
  if (item === undefined) throw new Error("empty list");
  return item;
}

function phone(rand: () => number): string {
  // Zambian mobile numbers are +260 9x xxx xxxx; these are random, not anyone's.
  return `+2609${pick(["5", "6", "7"], rand)}${String(Math.floor(rand() * 10_000_000)).padStart(7, "0")}`;
}

const PALETTE = ["#176d64", "#9d5f16", "#23877b", "#7a4815", "#135851", "#c27a1c"];

/** A generated logo: fish shapes on a coloured ground, drawn from the name so each business gets its own (no fonts needed). */
async function avatarPng(label: string, colour: string): Promise<Buffer> {
  let h = 0;
  for (const ch of label) h = (Math.imul(h, 31) + ch.charCodeAt(0)) >>> 0;
  const local = rng(h);
  const fish = Array.from({ length: 3 }, (_, k) => {
    const x = 50 + local() * 150;
    const y = 70 + k * 75 + local() * 20;
    const s = 0.7 + local() * 0.5;
    return `<g transform="translate(${x.toFixed(0)} ${y.toFixed(0)}) scale(${s.toFixed(2)})"><path d="M0 0c30-26 75-26 105 0-30 26-75 26-105 0Zm105 0 30-20v40z" fill="#ffffff" opacity="${(0.55 + 0.15 * k).toFixed(2)}"/><circle cx="22" cy="-4" r="4" fill="${colour}"/></g>`;
  }).join("");
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="320" height="320" viewBox="0 0 320 320"><rect width="320" height="320" fill="${colour}"/>${fish}</svg>`;
  return sharp(Buffer.from(svg)).png().toBuffer();
}

type SeedOptions = { url: string; authToken?: string; onlyIfEmpty?: boolean };

/** Seeds the demo scenario. Returns a summary, or null when the database already had users and onlyIfEmpty is set. */
export async function seedDemo(options: SeedOptions): Promise<string | null> {
  const client = createClient({ url: options.url, authToken: options.authToken, timeout: 5000 });
  const db = drizzle(client, { schema: allSchema });
  try {
    if (options.onlyIfEmpty) {
      const existing = await db.select({ id: schema.user.id }).from(schema.user).limit(1);
      if (existing.length) return null;
    }
    const rand = rng(20261201);
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const s3 = new S3Client({
      endpoint: process.env.S3_ENDPOINT ?? "http://127.0.0.1:4569",
      region: process.env.S3_REGION ?? "us-east-1",
      forcePathStyle: (process.env.S3_FORCE_PATH_STYLE ?? "true") === "true",
      credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "S3RVER", secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER" },
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
    const bucket = process.env.S3_BUCKET ?? "shoal-images";

    async function uploadAvatar(ownerId: string, label: string, colour: string): Promise<string> {
      const id = randomUUID();
      const { width, height, variants } = await encodeVariants(await avatarPng(label, colour), [160, 320]);
      for (const v of variants) {
        await s3.send(new PutObjectCommand({ Bucket: bucket, Key: variantKey(id, v.width), Body: v.data, ContentType: "image/webp" }));
      }
      await db.insert(schema.image).values({ id, ownerId, kind: "avatar", keyPrefix: `images/${id}`, widths: variants.map((v) => v.width), width, height, alt: `${label} logo` });
      return id;
    }

    async function addUser(email: string, name: string, roles: Role[]): Promise<string> {
      const id = randomUUID();
      await db.insert(schema.user).values({ id, name, email, emailVerified: true });
      await db.insert(schema.account).values({ id: randomUUID(), accountId: id, providerId: "credential", userId: id, password: passwordHash });
      for (const role of roles) await db.insert(schema.userRole).values({ userId: id, role });
      return id;
    }

    async function addProfile(userId: string, p: { displayName: string; town: Town; spreadKm: number; about?: string; provider: boolean; state: VerificationState }) {
      const at = near(p.town, rand, p.spreadKm);
      const avatarImageId = p.provider ? await uploadAvatar(userId, p.displayName, pick(PALETTE, rand)) : null;
      await db.insert(schema.profile).values({
        userId,
        displayName: p.displayName,
        phone: p.provider || rand() < 0.5 ? phone(rand) : null,
        region: p.town.region,
        lat: at.lat,
        lng: at.lng,
        about: p.about ?? null,
        avatarImageId,
        verificationState: p.state,
        onboardedAt: new Date(),
      });
    }

    const person = () => `${pick(FIRST_NAMES, rand)} ${pick(SURNAMES, rand)}`;
    const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, ".").replace(/^\.|\.$/g, "");

    // Admin
    const adminId = await addUser(DEMO_ACCOUNTS.admin, "Shoal Support", ["admin"]);
    await db.insert(schema.profile).values({ userId: adminId, displayName: "Shoal Support", region: "Lusaka", onboardedAt: new Date() });

    // Hatcheries (the first one is a demo account; one more also builds tanks)
    for (let i = 0; i < COUNTS.hatcheries; i++) {
      const name = HATCHERY_NAMES[i] ?? `Hatchery ${i + 1}`;
      const town = TOWNS[i % TOWNS.length] as Town;
      const both = i === 1;
      const email = i === 0 ? DEMO_ACCOUNTS.hatchery : both ? DEMO_ACCOUNTS.hatcheryBuilder : `${slug(name)}@shoal.demo`;
      const roles: Role[] = both ? ["hatchery", "builder", "farmer"] : ["hatchery"];
      const id = await addUser(email, person(), roles);
      const state: VerificationState = i >= COUNTS.hatcheries - 2 ? "pending" : "verified";
      await addProfile(id, {
        displayName: name,
        town,
        spreadKm: 8,
        provider: true,
        state,
        about: `Family-run hatchery near ${town.name}. Healthy fingerlings raised in clean water, counted in front of you at collection.`,
      });
      const species: Species[] = i % 3 === 0 ? ["tilapia", "catfish"] : i % 3 === 1 ? ["tilapia"] : ["catfish"];
      const delivers = rand() < 0.5;
      await db.insert(schema.hatchery).values({ userId: id, species, delivers, deliveryRadiusKm: delivers ? 20 + Math.floor(rand() * 60) : 0 });
      if (both) await seedBuilderTerms(id);
    }

    async function seedBuilderTerms(userId: string) {
      // Demo prices in ZMW minor units (ngwee); invented, ordered as the trade orders them:
      // tarpaulin < concrete < excavated earthen pond (common practice).
      const jitter = () => 0.85 + rand() * 0.3;
      await db.insert(schema.builder).values({
        userId,
        serviceRadiusKm: 25 + Math.floor(rand() * 60),
        currency: "ZMW",
        baseFeeMinor: Math.round(300 + rand() * 500) * 100,
        travelRatePerKmMinor: Math.round((8 + rand() * 7) * 100),
      });
      const offers: { tankType: TankType; materials: number; labour: number }[] = [
        { tankType: "tarpaulin", materials: 350, labour: 150 },
        { tankType: "concrete", materials: 700, labour: 400 },
        { tankType: "earthen", materials: 300, labour: 900 },
      ];
      const offered = offers.filter((o, k) => k === 0 || rand() < 0.6);
      await db.insert(schema.builderPrice).values(
        offered.map((o) => ({ builderId: userId, tankType: o.tankType, materialsPerSqmMinor: Math.round(o.materials * jitter()) * 100, labourPerSqmMinor: Math.round(o.labour * jitter()) * 100 })),
      );
    }

    // Builders (the first one is a demo account)
    for (let i = 0; i < COUNTS.builders; i++) {
      const name = BUILDER_NAMES[i] ?? `Builder ${i + 1}`;
      const town = TOWNS[(i * 3 + 1) % TOWNS.length] as Town;
      const id = await addUser(i === 0 ? DEMO_ACCOUNTS.builder : `${slug(name)}@shoal.demo`, person(), i % 5 === 2 ? ["builder", "farmer"] : ["builder"]);
      const state: VerificationState = i === COUNTS.builders - 1 ? "rejected" : i >= COUNTS.builders - 3 ? "pending" : "verified";
      await addProfile(id, {
        displayName: name,
        town,
        spreadKm: 10,
        provider: true,
        state,
        about: `We build fish tanks around ${town.name}: we level the base, raise the frame and fit the liner, and show you how to drain and refill.`,
      });
      await seedBuilderTerms(id);
    }

    // Farmers (the first one is a demo account)
    for (let i = 0; i < COUNTS.farmers; i++) {
      const name = person();
      const town = TOWNS[(i * 5 + 2) % TOWNS.length] as Town;
      const id = await addUser(i === 0 ? DEMO_ACCOUNTS.farmer : `${slug(name)}.${i}@shoal.demo`, name, ["farmer"]);
      await addProfile(id, { displayName: name, town, spreadKm: 12, provider: false, state: "unverified" });
    }

    // The search reads listings; build them from what was just seeded.
    const providers = await db.selectDistinct({ id: schema.userRole.userId }).from(schema.userRole).where(inArray(schema.userRole.role, ["hatchery", "builder"]));
    for (const p of providers) await refreshListings(db, p.id);
    console.log(await seedJobs({ db, s3, bucket, demo: DEMO_ACCOUNTS }));

    const reservationsSummary = await seedReservations(client, { farmerEmail: DEMO_ACCOUNTS.farmer, hatcheryEmail: DEMO_ACCOUNTS.hatchery });
    console.log(await seedReviews(db, DEMO_ACCOUNTS));

    const byRole = await db
      .select({ role: schema.userRole.role, n: sql<number>`count(*)` })
      .from(schema.userRole)
      .groupBy(schema.userRole.role);
    const users = await db.select({ n: sql<number>`count(*)` }).from(schema.user);
    const count = (role: Role) => Number(byRole.find((r) => r.role === role)?.n ?? 0);
    return [
      `seeded ${Number(users[0]?.n ?? 0)} demo accounts: ${count("hatchery")} hatcheries, ${count("builder")} builders, ${count("farmer")} farmers, ${count("admin")} admin (one account can hold several roles)`,
      reservationsSummary,
      `password for every demo account: ${DEMO_PASSWORD}`,
      ...Object.entries(DEMO_ACCOUNTS).map(([role, email]) => `  ${role.padEnd(16)} ${email}`),
    ].join("\n");
  } finally {
    client.close();
  }
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  loadDotEnv();
  seedDemo({ url: process.env.DATABASE_URL ?? "file:./data/shoal.db", authToken: process.env.DATABASE_AUTH_TOKEN, onlyIfEmpty: !process.argv.includes("--force") })
    .then((summary) => console.log(summary ?? "database already has users; nothing seeded (use --force on an empty database)"))
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
