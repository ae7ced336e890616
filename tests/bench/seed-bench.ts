import { createClient } from "@libsql/client";
import { randomUUID } from "node:crypto";
import { PLACES } from "../../lib/places/gazetteer";
import { rng } from "../../db/seed-random";


/**
 * Fills a migrated database with `count` listings over southern and eastern Africa:
 * 60 % spread evenly over 35°S–5°N, 10°E–40°E, 40 % gathered around the gazetteer's
 * towns (normal scatter, σ ≈ 60 km), as providers gather where people are.
 */
export async function seedBenchListings(url: string, count: number): Promise<void> {
  const client = createClient({ url });
  const rand = rng(7);
  const gauss = () => Math.sqrt(-2 * Math.log(rand() || 1e-12)) * Math.cos(2 * Math.PI * rand());
  const batchSize = 2000;
  try {
    for (let start = 0; start < count; start += batchSize) {
      const statements: { sql: string; args: (string | number)[] }[] = [];
      for (let i = start; i < Math.min(count, start + batchSize); i++) {
        let lat: number;
        let lng: number;
        if (rand() < 0.6) {
          lat = -35 + rand() * 40;
          lng = 10 + rand() * 30;
        } else {
          const p = PLACES[Math.floor(rand() * PLACES.length)] ?? PLACES[0];
          if (!p) throw new Error("no places");
          lat = Math.max(-89, Math.min(89, p.lat + (gauss() * 60) / 111));
          lng = p.lng + (gauss() * 60) / (111 * Math.cos((p.lat * Math.PI) / 180));
        }
        const id = randomUUID();
        const kind = rand() < 0.5 ? "hatchery" : "builder";
        statements.push({ sql: "INSERT INTO user (id, name, email, email_verified) VALUES (?, ?, ?, 1)", args: [id, `Bench ${i}`, `bench-${i}@bench.test`] });
        statements.push({ sql: "INSERT INTO profile (user_id, display_name, region, lat, lng, verification_state) VALUES (?, ?, 'Bench', ?, ?, 'verified')", args: [id, `Bench provider ${i}`, lat, lng] });
        statements.push({
          sql: "INSERT INTO listing (user_id, kind, display_name, region, lat, lng, verified, species_mask, tank_type_mask, service_radius_km, trust_score) VALUES (?, ?, ?, 'Bench', ?, ?, ?, ?, ?, 50, ?)",
          args: [id, kind, `Bench provider ${i}`, lat, lng, rand() < 0.7 ? 1 : 0, kind === "hatchery" ? 1 + Math.floor(rand() * 3) : 0, kind === "builder" ? 1 + Math.floor(rand() * 7) : 0, rand()],
        });
      }
      await client.batch(statements, "write");
    }
  } finally {
    client.close();
  }
}
