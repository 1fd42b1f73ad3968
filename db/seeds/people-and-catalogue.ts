import { sql } from "drizzle-orm";
import type { Transaction } from "@/db";
import { labMembers, labs, makers, tools, users } from "@/db/schema";
import { hashPassword } from "@/lib/passwords";
import { demoLabs, demoMakers, demoPassword, demoPeople, demoTools } from "./people-and-catalogue-data";

// Upserts by natural key, so running the seed again refreshes the demo instead of duplicating it.
export async function seedPeopleAndCatalogue(tx: Transaction) {
  const passwordHash = await hashPassword(demoPassword);
  const labRows = await tx
    .insert(labs)
    .values(demoLabs)
    .onConflictDoUpdate({
      target: labs.slug,
      set: { name: sql`excluded.name`, city: sql`excluded.city`, nominalVoltage: sql`excluded.nominal_voltage`, frequencyHz: sql`excluded.frequency_hz` },
    })
    .returning({ id: labs.id, slug: labs.slug });
  const labIdBySlug = new Map(labRows.map((row) => [row.slug, row.id]));

  for (const person of demoPeople) {
    const [user] = await tx
      .insert(users)
      .values({ email: person.email, name: person.name, role: person.role, passwordHash })
      .onConflictDoUpdate({ target: users.email, set: { name: person.name, role: person.role, passwordHash } })
      .returning({ id: users.id });
    const labId = person.labSlug ? labIdBySlug.get(person.labSlug) : undefined;
    if (user && labId) await tx.insert(labMembers).values({ labId, userId: user.id }).onConflictDoNothing();
  }

  const makerRows = await tx
    .insert(makers)
    .values(demoMakers)
    .onConflictDoUpdate({ target: makers.slug, set: { name: sql`excluded.name`, country: sql`excluded.country` } })
    .returning({ id: makers.id, slug: makers.slug });
  const makerIdBySlug = new Map(makerRows.map((row) => [row.slug, row.id]));

  for (const { makerSlug, ...tool } of demoTools) {
    const makerId = makerIdBySlug.get(makerSlug);
    if (!makerId) throw new Error(`demo tool ${tool.slug} names unknown maker ${makerSlug}`);
    await tx.insert(tools).values({ ...tool, makerId }).onConflictDoUpdate({ target: tools.slug, set: { ...tool, makerId } });
  }
  return `${demoPeople.length} people, ${demoLabs.length} labs, ${demoMakers.length} makers, ${demoTools.length} tools`;
}
