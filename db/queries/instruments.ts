import "server-only";
import { and, asc, eq, inArray, isNull, or, sql, type SQL } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { instruments, labMembers, labs } from "@/db/schema";
import { can, type Role } from "@/lib/authz";
import { UserFacingError } from "@/lib/errors";
import type { InstrumentForm } from "@/lib/validations/instrument";

type Editor = { id: string; role: Role };

/**
 * A reviewer keeps the register of their own labs (and instruments they entered without a lab); an editor keeps all.
 * Every read for editing and every write filters on this, so an out-of-scope id simply matches nothing.
 */
function editableBy(user: Editor): SQL {
  if (can(user.role, "workspace:edit-any")) return sql`true`;
  const ownLabs = db.select({ labId: labMembers.labId }).from(labMembers).where(eq(labMembers.userId, user.id));
  return or(inArray(instruments.labId, ownLabs), and(isNull(instruments.labId), eq(instruments.createdById, user.id)))!;
}

/** What an instrument is: its spec and calibration, as the register lists it and as a run keeps it. */
export const instrumentColumns = {
  id: instruments.id,
  kind: instruments.kind,
  maker: instruments.maker,
  model: instruments.model,
  serialNumber: instruments.serialNumber,
  accuracy: instruments.accuracy,
  calibratedOn: instruments.calibratedOn,
  calibrationDueOn: instruments.calibrationDueOn,
};

/** The register, with whether the viewer may edit each entry. */
export async function listInstruments({ user }: { user: Editor }) {
  return db
    .select({ ...instrumentColumns, lab: labs.name, editable: sql<boolean>`coalesce(${editableBy(user)}, false)` })
    .from(instruments)
    .leftJoin(labs, eq(labs.id, instruments.labId))
    .orderBy(asc(instruments.kind), asc(instruments.maker), asc(instruments.model));
}

export async function getInstrumentForEditing({ id, user }: { id: string; user: Editor }) {
  const [row] = await db
    .select({ ...instrumentColumns, labId: instruments.labId })
    .from(instruments)
    .where(and(eq(instruments.id, id), editableBy(user)))
    .limit(1);
  return row ?? null;
}

export type InstrumentForEditing = NonNullable<Awaited<ReturnType<typeof getInstrumentForEditing>>>;

/** Labs a user may file instruments under: their own, or every lab for an editor. */
export async function listLabsForInstruments({ user }: { user: Editor }) {
  const columns = { id: labs.id, name: labs.name };
  if (can(user.role, "workspace:edit-any")) return db.select(columns).from(labs).orderBy(asc(labs.name));
  return db
    .select(columns)
    .from(labs)
    .innerJoin(labMembers, eq(labMembers.labId, labs.id))
    .where(eq(labMembers.userId, user.id))
    .orderBy(asc(labs.name));
}

async function requireLabChoice(tx: Transaction, { labId, user }: { labId: string | null; user: Editor }) {
  if (labId === null || can(user.role, "workspace:edit-any")) return;
  const [member] = await tx
    .select({ labId: labMembers.labId })
    .from(labMembers)
    .where(and(eq(labMembers.labId, labId), eq(labMembers.userId, user.id)));
  if (!member) throw new UserFacingError("You can file instruments only under your own labs.", 403, { labId: ["Choose one of your labs."] });
}

const duplicateSerial = () =>
  new UserFacingError("That instrument is already in the register.", 409, {
    serialNumber: ["An instrument with this maker, model and serial number is already in the register."],
  });

function isUniqueViolation(error: unknown): boolean {
  const cause = (error as { cause?: { code?: string } } | null)?.cause ?? error;
  return (cause as { code?: string } | null)?.code === "23505";
}

export async function insertInstrument(tx: Transaction, { instrument, user }: { instrument: InstrumentForm; user: Editor }) {
  await requireLabChoice(tx, { labId: instrument.labId, user });
  try {
    const [row] = await tx
      .insert(instruments)
      .values({ ...instrument, createdById: user.id })
      .onConflictDoNothing()
      .returning({ id: instruments.id });
    if (!row) throw duplicateSerial();
    return row;
  } catch (error) {
    throw isUniqueViolation(error) ? duplicateSerial() : error;
  }
}

/** Past runs keep their own snapshot of the spec, so this never changes what a run recorded. */
export async function updateInstrument(tx: Transaction, { id, instrument, user }: { id: string; instrument: InstrumentForm; user: Editor }) {
  await requireLabChoice(tx, { labId: instrument.labId, user });
  try {
    const [row] = await tx
      .update(instruments)
      .set(instrument)
      .where(and(eq(instruments.id, id), editableBy(user)))
      .returning({ id: instruments.id });
    return row ?? null;
  } catch (error) {
    throw isUniqueViolation(error) ? duplicateSerial() : error;
  }
}
