// Seeds the demo shops. Idempotent: what exists is left as it is, so a second run changes nothing.
import { randomBytes } from "node:crypto";
import { hashPassword } from "better-auth/crypto";
import { and, eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "@/db/schema";
import { hashPin } from "@/lib/auth/pin";
import { DEMO_PASSWORD, DEMO_PIN, DEMO_SHOPS } from "./demo";
import { seedJobs } from "./jobs";
import { seedPhotoStore, seedStorageFromEnv, type SeedStorage } from "./photos";
import { seedProcedures } from "./procedures";
import { seedWelding } from "./welding";

const { shop, membership, user, account } = schema;

export async function seed(databaseUrl: string, storage: SeedStorage | null = seedStorageFromEnv(process.env)): Promise<{ created: string[] }> {
  const photos = storage ? seedPhotoStore(storage) : null;
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
  const db = drizzle(pool, { schema });
  const created: string[] = [];
  try {
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    for (const s of DEMO_SHOPS) {
      await db.transaction(async (tx) => {
        let [shopRow] = await tx.select({ id: shop.id }).from(shop).where(eq(shop.slug, s.slug));
        if (!shopRow) {
          [shopRow] = await tx.insert(shop).values({ slug: s.slug, name: s.name, continuityCode: s.continuityCode }).returning({ id: shop.id });
          created.push(`shop ${s.name}`);
        }
        let leadId: string | undefined;
        for (const p of s.people) {
          let [u] = await tx.select({ id: user.id }).from(user).where(eq(user.email, p.email));
          if (!u) {
            const id = randomBytes(16).toString("hex");
            const now = new Date();
            await tx.insert(user).values({ id, name: p.name, email: p.email, emailVerified: true, createdAt: now, updatedAt: now });
            await tx.insert(account).values({ id: randomBytes(16).toString("hex"), accountId: id, providerId: "credential", userId: id, password: passwordHash, createdAt: now, updatedAt: now });
            u = { id };
            created.push(`person ${p.email}`);
          }
          const [m] = await tx
            .select({ id: membership.id })
            .from(membership)
            .where(and(eq(membership.shopId, shopRow!.id), eq(membership.userId, u.id)));
          if (!m) {
            await tx.insert(membership).values({ shopId: shopRow!.id, userId: u.id, roles: [...p.roles], legalName: p.name, pinHash: await hashPin(DEMO_PIN), pinSetAt: new Date() });
          }
          if ((p.roles as readonly string[]).includes("lead")) leadId ??= u.id;
        }
        if (s.slug === "iron-gully" && leadId) created.push(...(await seedProcedures(tx, shopRow!.id, leadId, photos)));
        // The WPS library and qualifications first: the seeded jobs' passes are checked against them.
        created.push(...(await seedWelding(tx, shopRow!.id, s.people)));
        if (s.slug === "iron-gully") created.push(...(await seedJobs(tx, shopRow!.id, s.people, photos)));
      });
    }
  } finally {
    await pool.end();
  }
  return { created };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error("Set DATABASE_URL to the database to seed.");
    process.exit(1);
  }
  seed(url).then(
    ({ created }) => console.log(created.length ? `seeded: ${created.join(", ")}` : "demo data already present; nothing changed"),
    (error) => {
      console.error(error);
      process.exit(1);
    },
  );
}
