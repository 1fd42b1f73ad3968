"use server";

import { randomUUID } from "node:crypto";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { db, type Transaction } from "@/db";
import {
  countExistingTools,
  deleteCitation,
  deleteCitationsOffTools,
  deleteReportImageRow,
  findCitableAnalysis,
  findCitationOfAnalysis,
  findFreeReportSlug,
  insertReport,
  insertReportImage,
  listImagesWithoutAltText,
  listReportReferenceNames,
  listReportToolIds,
  lockEditableReport,
  markReportSubmitted,
  replaceReportTools,
  reportImageNameTaken,
  updateReportFields,
  upsertCitation,
} from "@/db/queries/reports";
import type { Viewer } from "@/db/queries/runs";
import { queueSubmissionMail } from "@/lib/editorial";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { reencodeWebRenditions } from "@/lib/images";
import { deleteObject, putObject } from "@/lib/object-storage";
import { wakeMailSender } from "@/lib/outbox";
import { submissionProblems } from "@/lib/report-submission";
import { firstFreeSlug, slugify } from "@/lib/slug";
import {
  citeAnalysisSchema,
  createReportSchema,
  deleteReportImageSchema,
  removeCitationSchema,
  reportImageLimits,
  reportImageUploadSchema,
  submitReportSchema,
  updateReportSchema,
} from "@/lib/validations/reports";

const notEditable = "This report is not one you can change: it is someone else's, or it is with the editors.";

async function lockOrRefuse(tx: Transaction, id: string, viewer: Viewer) {
  const report = await lockEditableReport(tx, { id, viewer });
  if (!report) throw new UserFacingError(notEditable, 404);
  return report;
}

async function requireTools(tx: Transaction, toolIds: string[]) {
  if ((await countExistingTools(tx, { toolIds })) !== toolIds.length) {
    throw new UserFacingError("Choose tools from the list.", 422, { toolId: ["Choose a tool from the list."] });
  }
}

function toolIdsOf({ toolId, secondToolId }: { toolId: string; secondToolId?: string }) {
  return secondToolId ? [toolId, secondToolId] : [toolId];
}

export const createReport = guardedAction("(workspace)/workspace/reports/actions.ts#createReport", createReportSchema, async (data, user) => {
  const toolIds = toolIdsOf(data);
  const { id } = await db.transaction(async (tx) => {
    await requireTools(tx, toolIds);
    const base = slugify(data.title) || "report";
    const slug = firstFreeSlug(base, await findFreeReportSlug(tx, { base }));
    const report = await insertReport(tx, { slug, title: data.title, authorId: user.id, disclosure: "" });
    await replaceReportTools(tx, { reportId: report.id, toolIds });
    return report;
  });
  revalidatePath("/workspace/reports");
  redirect(`/workspace/reports/${id}`);
});

export const updateReport = guardedAction("(workspace)/workspace/reports/actions.ts#updateReport", updateReportSchema, async (data, user) => {
  const toolIds = toolIdsOf(data);
  await db.transaction(async (tx) => {
    await lockOrRefuse(tx, data.reportId, user);
    await requireTools(tx, toolIds);
    await replaceReportTools(tx, { reportId: data.reportId, toolIds });
    await deleteCitationsOffTools(tx, { reportId: data.reportId, toolIds });
    await updateReportFields(tx, { id: data.reportId, fields: { title: data.title, disclosure: data.disclosure, bodyMdx: data.bodyMdx } });
  });
  revalidatePath(`/workspace/reports/${data.reportId}`);
  return { status: "ok", message: "Saved." };
});

export const citeAnalysis = guardedAction("(workspace)/workspace/reports/actions.ts#citeAnalysis", citeAnalysisSchema, async (data, user) => {
  await db.transaction(async (tx) => {
    const report = await lockOrRefuse(tx, data.reportId, user);
    const toolIds = await listReportToolIds(tx, { reportId: report.id });
    if (!(await findCitableAnalysis(tx, { analysisId: data.analysisId, authorId: report.authorId, toolIds }))) {
      throw new UserFacingError("That analysis cannot be cited here.", 422, {
        analysisId: ["Choose a finished analysis of a run by the report's author on one of its tools."],
      });
    }
    const existing = await findCitationOfAnalysis(tx, { reportId: report.id, analysisId: data.analysisId });
    if (existing && existing.label !== data.label) {
      throw new UserFacingError("That analysis is already cited.", 422, { analysisId: [`Already cited as “${existing.label}”.`] });
    }
    await upsertCitation(tx, { reportId: report.id, analysisId: data.analysisId, label: data.label });
  });
  revalidatePath(`/workspace/reports/${data.reportId}`);
  return { status: "ok", message: `Cited as “${data.label}”.` };
});

export const removeCitation = guardedAction("(workspace)/workspace/reports/actions.ts#removeCitation", removeCitationSchema, async (data, user) => {
  await db.transaction(async (tx) => {
    await lockOrRefuse(tx, data.reportId, user);
    if (!(await deleteCitation(tx, { reportId: data.reportId, label: data.label }))) {
      throw new UserFacingError(`No citation is labelled “${data.label}”.`, 404);
    }
  });
  revalidatePath(`/workspace/reports/${data.reportId}`);
  return { status: "ok", message: `Citation “${data.label}” removed.` };
});

export const uploadReportImage = guardedAction(
  "(workspace)/workspace/reports/actions.ts#uploadReportImage",
  reportImageUploadSchema,
  async (data, user) => {
    const nameTaken = { name: [`This report already has an image named “${data.name}”.`] };
    // Refuse early, before the image is decoded and stored, when nothing could come of it.
    await db.transaction(async (tx) => {
      await lockOrRefuse(tx, data.reportId, user);
      if (await reportImageNameTaken(tx, { reportId: data.reportId, name: data.name })) throw new UserFacingError("Choose another name.", 422, nameTaken);
    });
    const [rendition] = await reencodeWebRenditions(Buffer.from(await data.image.arrayBuffer()), [reportImageLimits.maxWidth], "image");
    if (!rendition) throw new UserFacingError("That file could not be read as an image.", 422, { image: ["That file could not be read as an image."] });
    const objectKey = `reports/${data.reportId}/images/${randomUUID()}.webp`;
    await putObject(objectKey, rendition.data, "image/webp");
    try {
      await db.transaction(async (tx) => {
        await lockOrRefuse(tx, data.reportId, user);
        if (await reportImageNameTaken(tx, { reportId: data.reportId, name: data.name })) throw new UserFacingError("Choose another name.", 422, nameTaken);
        await insertReportImage(tx, { reportId: data.reportId, name: data.name, objectKey, altText: data.altText, width: rendition.width, height: rendition.height });
      });
    } catch (error) {
      // No row points at the object, so it must not outlive this request.
      await deleteObject(objectKey);
      throw error;
    }
    revalidatePath(`/workspace/reports/${data.reportId}`);
    return { status: "ok", message: `Uploaded. Use it as <Figure image="${data.name}" />.` };
  },
);

export const deleteReportImage = guardedAction(
  "(workspace)/workspace/reports/actions.ts#deleteReportImage",
  deleteReportImageSchema,
  async (data, user) => {
    const deleted = await db.transaction(async (tx) => {
      await lockOrRefuse(tx, data.reportId, user);
      return deleteReportImageRow(tx, { reportId: data.reportId, imageId: data.imageId });
    });
    if (!deleted) throw new UserFacingError("That image is not on this report.", 404);
    // The row goes first: an object left behind by a failed delete is invisible, a row without its object is a broken figure.
    await deleteObject(deleted.objectKey).catch((error: unknown) => console.error("report image object not deleted", deleted.objectKey, error));
    revalidatePath(`/workspace/reports/${data.reportId}`);
    return { status: "ok", message: "Image deleted." };
  },
);

export const submitReport = guardedAction("(workspace)/workspace/reports/actions.ts#submitReport", submitReportSchema, async (data, user) => {
  const problems = await db.transaction(async (tx) => {
    const report = await lockOrRefuse(tx, data.reportId, user);
    const [known, missingAlt] = await Promise.all([
      listReportReferenceNames(tx, { reportId: report.id }),
      listImagesWithoutAltText(tx, { reportId: report.id }),
    ]);
    const found = submissionProblems({ bodyMdx: report.bodyMdx, known, imagesWithoutAltText: missingAlt.map((image) => image.name) });
    if (found.length === 0) {
      await markReportSubmitted(tx, { id: report.id });
      await queueSubmissionMail(tx, { reportId: report.id });
    }
    return found;
  });
  if (problems.length) {
    return { status: "error", message: "Not submitted yet: fix these first (save your changes before submitting).", fieldErrors: { submission: problems } };
  }
  await wakeMailSender();
  revalidatePath("/desk");
  revalidatePath(`/workspace/reports/${data.reportId}`);
  revalidatePath("/workspace/reports");
  return { status: "ok", message: "Submitted for review. The report is read-only while the editors have it." };
});
