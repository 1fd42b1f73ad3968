"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { appendProtocolVersion, insertProtocol } from "@/db/queries/protocols";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { protocolFormSchema, protocolRevisionSchema } from "@/lib/validations/protocol";

export const createProtocol = guardedAction("(workspace)/workspace/protocols/actions.ts#createProtocol", protocolFormSchema, async (protocol, user) => {
  const created = await db.transaction((tx) => insertProtocol(tx, { protocol, user }));
  revalidatePath("/workspace/protocols");
  redirect(`/workspace/protocols/${created.slug}`);
});

export const reviseProtocol = guardedAction(
  "(workspace)/workspace/protocols/actions.ts#reviseProtocol",
  protocolRevisionSchema,
  async ({ slug, ...protocol }, user) => {
    const appended = await db.transaction((tx) => appendProtocolVersion(tx, { slug, protocol, user }));
    if (!appended) throw new UserFacingError("Only the protocol's author or an editor can revise it.", 403);
    revalidatePath("/workspace/protocols");
    revalidatePath(`/workspace/protocols/${slug}`);
    redirect(`/workspace/protocols/${slug}?version=${appended.version}`);
  },
);
