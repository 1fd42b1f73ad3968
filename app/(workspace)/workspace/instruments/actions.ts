"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { insertInstrument, updateInstrument as updateInstrumentRow } from "@/db/queries/instruments";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { instrumentFormSchema, instrumentUpdateSchema } from "@/lib/validations/instrument";

export const createInstrument = guardedAction(
  "(workspace)/workspace/instruments/actions.ts#createInstrument",
  instrumentFormSchema,
  async (instrument, user) => {
    await db.transaction((tx) => insertInstrument(tx, { instrument, user }));
    revalidatePath("/workspace/instruments");
    redirect("/workspace/instruments?saved=1");
  },
);

export const updateInstrument = guardedAction(
  "(workspace)/workspace/instruments/actions.ts#updateInstrument",
  instrumentUpdateSchema,
  async ({ id, ...instrument }, user) => {
    const updated = await db.transaction((tx) => updateInstrumentRow(tx, { id, instrument, user }));
    if (!updated) throw new UserFacingError("That instrument is not in a register you keep.", 404);
    revalidatePath("/workspace/instruments");
    redirect("/workspace/instruments?saved=1");
  },
);
