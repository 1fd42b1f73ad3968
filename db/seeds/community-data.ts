// Readers' requests in the invented demo scenario. Fixed ids keep the seed idempotent and give tests stable pages.

export const seededRequestIds = {
  mostWanted: "5eed0001-7e57-4b00-8000-000000000001",
  mergedDuplicate: "5eed0001-7e57-4b00-8000-000000000002",
  planned: "5eed0001-7e57-4b00-8000-000000000003",
  declined: "5eed0001-7e57-4b00-8000-000000000004",
  measured: "5eed0001-7e57-4b00-8000-000000000005",
  openAirflow: "5eed0001-7e57-4b00-8000-000000000006",
} as const;

export const demoEditorEmail = "marguerite.sallow@benchplate.test";

type SeedRequest = {
  id: string;
  toolSlug: string | null;
  proposedToolName: string | null;
  whatToMeasure: string;
  why: string;
  requesterEmail: string;
  voterEmails: string[];
  daysAgo: number;
};

export const demoRequests: SeedRequest[] = [
  {
    id: seededRequestIds.mostWanted,
    toolSlug: "marrowby-hx-2000-torrent",
    proposedToolName: null,
    whatToMeasure: "Real power on the high stage at 230 V, the burst-fire pattern of the element, and the flicker (Pst) it would cause on the reference impedance.",
    why: "It shares a circuit with the workshop lights, and they dip in a rhythm whenever the gun is on the high stage.",
    requesterEmail: "priya.fenwick@benchplate.test",
    voterEmails: ["priya.fenwick@benchplate.test", "jonah.ashdown@benchplate.test", "carmen.idris@benchplate.test", "teodor.wylde@benchplate.test"],
    daysAgo: 21,
  },
  {
    id: seededRequestIds.mergedDuplicate,
    toolSlug: "marrowby-hx-2000-torrent",
    proposedToolName: null,
    whatToMeasure: "Does the HX-2000 make lights flicker? Please measure how it switches the heater.",
    why: "My desk lamp blinks when I strip paint with it.",
    requesterEmail: "carmen.idris@benchplate.test",
    voterEmails: ["carmen.idris@benchplate.test"],
    daysAgo: 12,
  },
  {
    id: seededRequestIds.planned,
    toolSlug: "tessaly-rw-6-duet",
    proposedToolName: null,
    whatToMeasure: "Power input and current with the hot-air handle and the iron both heating at once on a 120 V supply.",
    why: "The manual says one at a time at full power; I want to know whether both at once trips a 15 A branch circuit.",
    requesterEmail: "jonah.ashdown@benchplate.test",
    voterEmails: ["jonah.ashdown@benchplate.test", "priya.fenwick@benchplate.test"],
    daysAgo: 30,
  },
  {
    id: seededRequestIds.declined,
    toolSlug: null,
    proposedToolName: "Velmora Sprig 12 V cordless iron",
    whatToMeasure: "Battery runtime at 350 °C and the heat-up time from cold.",
    why: "I solder on site, away from any socket.",
    requesterEmail: "carmen.idris@benchplate.test",
    voterEmails: ["carmen.idris@benchplate.test"],
    daysAgo: 40,
  },
  {
    id: seededRequestIds.measured,
    toolSlug: "quillfern-aeris-720",
    proposedToolName: null,
    whatToMeasure: "Real power at the highest setpoint against the 720 W rating, with the uncertainty.",
    why: "Comparing running costs against a station I already own.",
    requesterEmail: "jonah.ashdown@benchplate.test",
    voterEmails: ["jonah.ashdown@benchplate.test", "carmen.idris@benchplate.test"],
    daysAgo: 60,
  },
  {
    id: seededRequestIds.openAirflow,
    toolSlug: "corvane-breeze-550",
    proposedToolName: null,
    whatToMeasure: "Airflow at the widest nozzle against the rated figure, measured at the nozzle with the profile factor stated.",
    why: "Shrinking tubing on long harnesses takes ages; I suspect the airflow is well under the rating.",
    requesterEmail: "priya.fenwick@benchplate.test",
    voterEmails: ["priya.fenwick@benchplate.test"],
    daysAgo: 5,
  },
];

export const declinedReason = "Benchplate tests mains-powered tools; a battery iron needs a runtime protocol we do not have yet.";
