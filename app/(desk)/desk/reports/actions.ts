"use server";

import { revalidatePath, updateTag } from "next/cache";
import { db } from "@/db";
import { approveReport, attachMakerReply as saveMakerReply, publishedReportsCacheTag, reportCacheTag, retractReport as saveRetraction, sendBackReport as saveSendBack } from "@/lib/editorial";
import { guardedAction } from "@/lib/guarded-action";
import { formatDateTime } from "@/lib/format";
import { wakeMailSender } from "@/lib/outbox";
import { makerReplySchema, publishReportSchema, retractReportSchema, scheduleReportSchema, sendBackSchema } from "@/lib/validations/editorial";

/** Everything that shows the report: the desk, the reviewer's workspace and, once it is public, the reader pages. */
function revalidateReportPages(reportId: string, slug: string) {
  updateTag(reportCacheTag(slug));
  updateTag(publishedReportsCacheTag);
  revalidatePath("/");
  revalidatePath("/desk");
  revalidatePath(`/desk/reports/${reportId}`);
  revalidatePath(`/workspace/reports/${reportId}`);
  revalidatePath("/reports");
  revalidatePath(`/reports/${slug}`, "layout");
}

export const publishReport = guardedAction("(desk)/desk/reports/actions.ts#publishReport", publishReportSchema, async (data, user) => {
  const { slug, revisionNumber } = await db.transaction((tx) => approveReport(tx, { reportId: data.reportId, editorId: user.id, notes: data.notes, publishAt: null }));
  await wakeMailSender();
  revalidateReportPages(data.reportId, slug);
  return { status: "ok", message: `Published as revision ${revisionNumber}: /reports/${slug}` };
});

export const scheduleReport = guardedAction("(desk)/desk/reports/actions.ts#scheduleReport", scheduleReportSchema, async (data, user) => {
  const { slug, revisionNumber } = await db.transaction((tx) =>
    approveReport(tx, { reportId: data.reportId, editorId: user.id, notes: data.notes, publishAt: data.publishAt }),
  );
  await wakeMailSender();
  revalidateReportPages(data.reportId, slug);
  return { status: "ok", message: `Revision ${revisionNumber} is approved and goes live on ${formatDateTime(data.publishAt)}.` };
});

export const sendBackReport = guardedAction("(desk)/desk/reports/actions.ts#sendBackReport", sendBackSchema, async (data, user) => {
  await db.transaction((tx) => saveSendBack(tx, { reportId: data.reportId, editorId: user.id, notes: data.notes }));
  await wakeMailSender();
  revalidatePath("/desk");
  revalidatePath(`/desk/reports/${data.reportId}`);
  revalidatePath(`/workspace/reports/${data.reportId}`);
  return { status: "ok", message: "Sent back; the reviewer has your notes." };
});

export const retractReport = guardedAction("(desk)/desk/reports/actions.ts#retractReport", retractReportSchema, async (data, user) => {
  const { slug } = await db.transaction((tx) => saveRetraction(tx, { reportId: data.reportId, editorId: user.id, reason: data.reason }));
  await wakeMailSender();
  revalidateReportPages(data.reportId, slug);
  return { status: "ok", message: "Retracted. The report stays readable with your reason at the top." };
});

export const attachMakerReply = guardedAction("(desk)/desk/reports/actions.ts#attachMakerReply", makerReplySchema, async (data, user) => {
  const { slug } = await db.transaction((tx) => saveMakerReply(tx, { ...data, editorId: user.id }));
  revalidateReportPages(data.reportId, slug);
  return { status: "ok", message: `${data.makerName}'s reply is attached to the report.` };
});
