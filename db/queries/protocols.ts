import "server-only";
import { and, asc, desc, eq, max, sql, type SQL } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { claimFreeSlug } from "@/db/queries/slugs";
import { protocolVersions, protocols, users } from "@/db/schema";
import { can, type Role } from "@/lib/authz";
import { UserFacingError } from "@/lib/errors";
import { slugify } from "@/lib/slug";
import type { ProtocolForm } from "@/lib/validations/protocol";

// protocol_versions is append-only: this module inserts versions and never updates one (the database refuses too).

type Author = { id: string; role: Role };

/** A reviewer revises the protocols they wrote; an editor may revise any. */
function revisableBy(user: Author): SQL {
  return can(user.role, "workspace:edit-any") ? sql`true` : eq(protocols.createdById, user.id);
}

const latestVersionNumber = db
  .select({ protocolId: protocolVersions.protocolId, version: max(protocolVersions.version).as("latest_version") })
  .from(protocolVersions)
  .groupBy(protocolVersions.protocolId)
  .as("latest");

/** Every protocol with its latest version, newest first. */
export async function listProtocols({ user }: { user: Author }) {
  return db
    .select({
      slug: protocols.slug,
      name: protocols.name,
      latestVersionId: protocolVersions.id,
      version: protocolVersions.version,
      summary: protocolVersions.summary,
      conditions: protocolVersions.conditions,
      revisedAt: protocolVersions.createdAt,
      revisedBy: users.name,
      revisable: sql<boolean>`coalesce(${revisableBy(user)}, false)`,
    })
    .from(protocols)
    .innerJoin(latestVersionNumber, eq(latestVersionNumber.protocolId, protocols.id))
    .innerJoin(
      protocolVersions,
      and(eq(protocolVersions.protocolId, protocols.id), eq(protocolVersions.version, latestVersionNumber.version)),
    )
    .leftJoin(users, eq(users.id, protocolVersions.createdById))
    .orderBy(asc(protocols.name));
}

/** One version of a protocol, the latest when `version` is not given. */
export async function getProtocolVersion({ slug, version, user }: { slug: string; version?: number; user: Author }) {
  const [row] = await db
    .select({
      protocolId: protocols.id,
      slug: protocols.slug,
      name: protocols.name,
      revisable: sql<boolean>`coalesce(${revisableBy(user)}, false)`,
      id: protocolVersions.id,
      version: protocolVersions.version,
      summary: protocolVersions.summary,
      conditions: protocolVersions.conditions,
      requiredMeasurements: protocolVersions.requiredMeasurements,
      repeats: protocolVersions.repeats,
      tolerances: protocolVersions.tolerances,
      stepsMdx: protocolVersions.stepsMdx,
      safetyCautions: protocolVersions.safetyCautions,
      createdAt: protocolVersions.createdAt,
      author: users.name,
    })
    .from(protocols)
    .innerJoin(protocolVersions, eq(protocolVersions.protocolId, protocols.id))
    .leftJoin(users, eq(users.id, protocolVersions.createdById))
    .where(and(eq(protocols.slug, slug), version === undefined ? undefined : eq(protocolVersions.version, version)))
    .orderBy(desc(protocolVersions.version))
    .limit(1);
  return row ?? null;
}

export type ProtocolVersionView = NonNullable<Awaited<ReturnType<typeof getProtocolVersion>>>;

export async function listProtocolVersions({ slug }: { slug: string }) {
  return db
    .select({ version: protocolVersions.version, createdAt: protocolVersions.createdAt, author: users.name })
    .from(protocolVersions)
    .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
    .leftJoin(users, eq(users.id, protocolVersions.createdById))
    .where(eq(protocols.slug, slug))
    .orderBy(desc(protocolVersions.version));
}

function versionColumns(protocol: ProtocolForm) {
  return {
    summary: protocol.summary,
    conditions: protocol.conditions,
    requiredMeasurements: protocol.requiredMeasurements,
    repeats: protocol.repeats,
    tolerances: protocol.tolerances,
    stepsMdx: protocol.stepsMdx,
    safetyCautions: protocol.safetyCautions,
  };
}

/** A new protocol and its version 1; the slug comes from the name, made unique with a numeric suffix. */
export async function insertProtocol(tx: Transaction, { protocol, user }: { protocol: ProtocolForm; user: Author }) {
  const base = slugify(protocol.name);
  if (!base) throw new UserFacingError("The name needs letters or digits.", 422, { name: ["Use letters or digits in the name."] });
  const slug = await claimFreeSlug(tx, { table: protocols, column: protocols.slug, base });
  const [created] = await tx.insert(protocols).values({ slug, name: protocol.name, createdById: user.id }).returning({ id: protocols.id });
  if (!created) throw new Error("protocol not inserted");
  const [version] = await tx
    .insert(protocolVersions)
    .values({ protocolId: created.id, version: 1, createdById: user.id, ...versionColumns(protocol) })
    .returning({ id: protocolVersions.id, version: protocolVersions.version });
  return { slug, versionId: version!.id, version: version!.version };
}

/**
 * Saving an edit appends version N + 1; version N and every run citing it stay exactly as they were. The protocol row
 * is locked first, so two people saving at once get N + 1 and N + 2 rather than a clash. Null when the protocol does
 * not exist or the user may not revise it.
 */
export async function appendProtocolVersion(tx: Transaction, { slug, protocol, user }: { slug: string; protocol: ProtocolForm; user: Author }) {
  const [target] = await tx
    .select({ id: protocols.id })
    .from(protocols)
    .where(and(eq(protocols.slug, slug), revisableBy(user)))
    .for("update");
  if (!target) return null;
  const [latest] = await tx
    .select({ version: max(protocolVersions.version) })
    .from(protocolVersions)
    .where(eq(protocolVersions.protocolId, target.id));
  const next = (latest?.version ?? 0) + 1;
  await tx.update(protocols).set({ name: protocol.name }).where(eq(protocols.id, target.id));
  const [version] = await tx
    .insert(protocolVersions)
    .values({ protocolId: target.id, version: next, createdById: user.id, ...versionColumns(protocol) })
    .returning({ id: protocolVersions.id, version: protocolVersions.version });
  return { slug, versionId: version!.id, version: version!.version };
}
