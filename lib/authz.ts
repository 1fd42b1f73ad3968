// What each role may do, in one place. Pages, route handlers and server actions look their
// permission up here; tests/integration/authorization.test.ts fails on any entry point missing from it.

export const roles = ["reader", "reviewer", "editor", "admin"] as const;
export type Role = (typeof roles)[number];

export const permissions = {
  "account:manage": ["reader", "reviewer", "editor", "admin"],
  "workspace:use": ["reviewer", "editor"],
  "catalogue:edit": ["reviewer", "editor"],
  /** Reviewers edit only their own runs and reports; this permission lifts that limit. */
  "workspace:edit-any": ["editor"],
  "desk:use": ["editor"],
  "users:manage": ["admin"],
  "mail:inspect": ["admin"],
  // readers' voice, mail, audit
  /** Post measurement requests and vote on them. */
  "requests:ask": ["reader", "reviewer", "editor", "admin"],
  /** Set a request planned or declined, reopen it, merge duplicates. */
  "requests:triage": ["editor"],
  /** Link the report that answers a request, which marks it measured. */
  "requests:fulfil": ["reviewer", "editor"],
  "audit:read": ["editor", "admin"],
  // editorial desk, publishing, comments
  /** Comment on published reports (the report's author may also reply). */
  "comments:post": ["reader", "reviewer", "editor", "admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissions;

/** "public" means anyone, signed in or not. */
export type Access = Permission | "public";

export function can(role: Role | null | undefined, permission: Access): boolean {
  if (permission === "public") return true;
  if (!role) return false;
  return (permissions[permission] as readonly Role[]).includes(role);
}

/** Pages by their route pattern, as the folders under app/ spell them (route groups left out). */
export const pageAccess = {
  "/": "public",
  "/tools": "public",
  "/tools/[slug]": "public",
  "/sign-in": "public",
  "/sign-up": "public",
  "/reset-password": "public",
  "/reset-password/[token]": "public",
  "/account": "account:manage",
  "/workspace": "workspace:use",
  "/desk": "desk:use",
  "/admin": "users:manage",
  "/admin/mail": "mail:inspect",
  // readers' voice, mail, audit
  "/requests": "public",
  "/requests/[id]": "public",
  "/requests/new": "requests:ask",
  "/unsubscribe/[token]": "public",
  "/account-deleted": "public",
  "/desk/requests": "requests:triage",
  "/desk/requests/[id]": "requests:triage",
  "/desk/audit": "audit:read",
  // editorial desk, publishing, comments
  "/reports": "public",
  "/reports/[slug]": "public",
  "/reports/[slug]/revisions/[number]": "public",
  "/reports/[slug]/diff": "public",
  "/desk/reports/[id]": "desk:use",
  "/desk/comments": "desk:use",
  "/workspace/reports/[id]/revise": "workspace:use",
  // workspace: tools catalogue, instruments, protocols
  "/workspace/tools": "catalogue:edit",
  "/workspace/tools/new": "catalogue:edit",
  "/workspace/tools/[slug]/edit": "catalogue:edit",
  "/workspace/instruments": "workspace:use",
  "/workspace/instruments/new": "workspace:use",
  "/workspace/instruments/[id]/edit": "workspace:use",
  "/workspace/protocols": "workspace:use",
  "/workspace/protocols/new": "workspace:use",
  "/workspace/protocols/[slug]": "workspace:use",
  "/workspace/protocols/[slug]/edit": "workspace:use",
  // workspace: runs, captures, analyses
  "/workspace/runs": "workspace:use",
  "/workspace/runs/new": "workspace:use",
  "/workspace/runs/[id]": "workspace:use",
  "/workspace/runs/[id]/captures/[captureId]": "workspace:use",
  // workspace: reports
  "/workspace/reports": "workspace:use",
  "/workspace/reports/new": "workspace:use",
  "/workspace/reports/[id]": "workspace:use",
  "/workspace/reports/[id]/view": "workspace:use",
  // readers: compare
  "/compare": "public",
  // readers: catalogue and search
  "/search": "public",
} as const satisfies Record<string, Access>;

/** Route handlers by pattern and method. */
export const routeHandlerAccess = {
  "GET /api/tools": "public",
  "GET /api/auth/[...nextauth]": "public",
  "POST /api/auth/[...nextauth]": "public",
  "GET /api/avatars/[userId]": "public",
  // workspace: tools catalogue, instruments, protocols
  "GET /api/tool-photos/[photoId]/[width]": "public",
  // workspace: runs, captures, analyses
  "POST /api/captures": "workspace:use",
  "POST /api/captures/[id]/uploaded": "workspace:use",
  "GET /api/analyses/[id]": "workspace:use",
  // workspace: reports
  "POST /api/reports/[id]/preview": "workspace:use",
  /** Published reports' images are public; the handler itself limits drafts to their author and editors. */
  "GET /api/report-images/[imageId]": "public",
  // readers: open data
  "GET /feed.xml": "public",
  "GET /reports/[slug]/measurements.csv": "public",
  "GET /reports/[slug]/measurements.json": "public",
} as const satisfies Record<string, Access>;

/** Server actions by "<file under app/>#<export>". */
export const actionAccess = {
  "(auth)/actions.ts#signInWithPassword": "public",
  "(auth)/actions.ts#signUpReader": "public",
  "(auth)/actions.ts#requestPasswordReset": "public",
  "(auth)/actions.ts#resetPassword": "public",
  "(auth)/actions.ts#signOutUser": "account:manage",
  "(account)/actions.ts#updateAvatar": "account:manage",
  "(admin)/actions.ts#changeUserRole": "users:manage",
  // readers' voice, mail, audit
  "(account)/actions.ts#updateNotificationPreferences": "account:manage",
  "(account)/actions.ts#deleteAccount": "account:manage",
  "(public)/actions.ts#createMeasurementRequest": "requests:ask",
  "(public)/actions.ts#toggleRequestVote": "requests:ask",
  "(public)/actions.ts#markRequestMeasured": "requests:fulfil",
  "(desk)/actions.ts#changeRequestStatus": "requests:triage",
  "(desk)/actions.ts#mergeMeasurementRequests": "requests:triage",
  // editorial desk, publishing, comments
  "(desk)/desk/reports/actions.ts#publishReport": "desk:use",
  "(desk)/desk/reports/actions.ts#scheduleReport": "desk:use",
  "(desk)/desk/reports/actions.ts#sendBackReport": "desk:use",
  "(desk)/desk/reports/actions.ts#retractReport": "desk:use",
  "(desk)/desk/reports/actions.ts#attachMakerReply": "desk:use",
  "(desk)/desk/comments/actions.ts#moderateComment": "desk:use",
  "(desk)/desk/comments/actions.ts#setCommenterTrust": "desk:use",
  "(public)/reports/actions.ts#postComment": "comments:post",
  "(workspace)/workspace/reports/[id]/revise/actions.ts#proposeRevision": "workspace:use",
  // workspace: tools catalogue, instruments, protocols
  "(workspace)/workspace/tools/actions.ts#createTool": "catalogue:edit",
  "(workspace)/workspace/tools/actions.ts#updateTool": "catalogue:edit",
  "(workspace)/workspace/tools/actions.ts#addToolPhoto": "catalogue:edit",
  "(workspace)/workspace/tools/actions.ts#deleteToolPhoto": "catalogue:edit",
  "(workspace)/workspace/instruments/actions.ts#createInstrument": "workspace:use",
  "(workspace)/workspace/instruments/actions.ts#updateInstrument": "workspace:use",
  "(workspace)/workspace/protocols/actions.ts#createProtocol": "workspace:use",
  "(workspace)/workspace/protocols/actions.ts#reviseProtocol": "workspace:use",
  // workspace: runs, captures, analyses
  "(workspace)/workspace/runs/actions.ts#createRun": "workspace:use",
  "(workspace)/workspace/runs/actions.ts#updateRun": "workspace:use",
  "(workspace)/workspace/runs/actions.ts#addManualReading": "workspace:use",
  "(workspace)/workspace/runs/actions.ts#deleteManualReading": "workspace:use",
  "(workspace)/workspace/runs/actions.ts#startWaveformAnalysis": "workspace:use",
  "(workspace)/workspace/runs/actions.ts#startHeatUpAnalysis": "workspace:use",
  // workspace: reports
  "(workspace)/workspace/reports/actions.ts#createReport": "workspace:use",
  "(workspace)/workspace/reports/actions.ts#updateReport": "workspace:use",
  "(workspace)/workspace/reports/actions.ts#citeAnalysis": "workspace:use",
  "(workspace)/workspace/reports/actions.ts#removeCitation": "workspace:use",
  "(workspace)/workspace/reports/actions.ts#uploadReportImage": "workspace:use",
  "(workspace)/workspace/reports/actions.ts#deleteReportImage": "workspace:use",
  "(workspace)/workspace/reports/actions.ts#submitReport": "workspace:use",
} as const satisfies Record<string, Access>;

export type PagePattern = keyof typeof pageAccess;
export type ActionKey = keyof typeof actionAccess;

/** Navigation per role: what each signed-in role sees beyond the public pages. */
export const roleNavigation: readonly { href: PagePattern; label: string; permission: Permission }[] = [
  { href: "/workspace", label: "Bench workspace", permission: "workspace:use" },
  { href: "/desk", label: "Editor's desk", permission: "desk:use" },
  { href: "/admin", label: "Accounts", permission: "users:manage" },
  { href: "/admin/mail", label: "Outgoing mail", permission: "mail:inspect" },
  { href: "/desk/audit", label: "Audit log", permission: "audit:read" },
];
