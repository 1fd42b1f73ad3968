// A draft report per demo lab. Fixed ids, so pages and tests can name them.
export const seededReportIds = {
  wrenford: "5eed0003-7e57-4b00-8000-000000000001",
  cedarHollow: "5eed0003-7e57-4b00-8000-000000000002",
} as const;

export const demoReportDrafts = [
  {
    id: seededReportIds.wrenford,
    slug: "on-the-bench-at-wrenford",
    labSlug: "wrenford-bench",
    reviewerEmail: "nadia.orlen@benchplate.test",
    title: "On the bench at Wrenford: rated power, burst-fire and harmonics",
  },
  {
    id: seededReportIds.cedarHollow,
    slug: "on-the-bench-at-cedar-hollow",
    labSlug: "cedar-hollow-shop",
    reviewerEmail: "teodor.wylde@benchplate.test",
    title: "On the bench at Cedar Hollow: a 120 V station measured",
  },
] as const;
