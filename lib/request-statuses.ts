// The database enum for measurement requests is built from this tuple (db/schema/community.ts), so forms, labels and
// the schema cannot drift apart; this module stays free of imports so client code can use it.

export const requestStatuses = ["open", "planned", "measured", "declined"] as const;

export type RequestStatusName = (typeof requestStatuses)[number];

export const requestStatusLabels: Record<RequestStatusName, string> = {
  open: "Open",
  planned: "Planned",
  measured: "Measured",
  declined: "Declined",
};
