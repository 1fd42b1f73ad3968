import { seededReportIds } from "./reports-data";

// Published reports for the demo, made from the seeded drafts' citations through the desk's own publish flow. Fixed
// ids, so seeding again finds them instead of adding more.

export const demoEditorEmail = "marguerite.sallow@benchplate.test";

export const publishedReportIds = {
  wrenford: "5eed0004-7e57-4b00-8000-000000000001",
  cedarHollow: "5eed0004-7e57-4b00-8000-000000000002",
  cedarHollowQueued: "5eed0004-7e57-4b00-8000-000000000003",
} as const;

export type DemoPublication = {
  id: string;
  slug: string;
  title: string;
  reviewerEmail: string;
  /** The seeded draft whose tools and citations this report takes. */
  draftId: string;
  /** How far it goes: sent back once and then published, published, or left waiting on the desk. */
  path: "published" | "sent-back-then-published" | "submitted";
  body: (labels: { waveform: string | null; heatUp: string | null }) => string;
};

const safety = "<SafetyNotice />";

export const demoPublications: DemoPublication[] = [
  {
    id: publishedReportIds.wrenford,
    slug: "quillfern-aeris-720-measured",
    title: "Quillfern Aeris 720: close to its rating, switched in whole cycles",
    reviewerEmail: "nadia.orlen@benchplate.test",
    draftId: seededReportIds.wrenford,
    path: "published",
    body: ({ waveform, heatUp }) =>
      [
        "## In short\n\nThe station draws close to its rated power at full demand, and its controller switches the heater in whole mains cycles, which keeps the harmonic currents low but makes the supply voltage step.",
        safety,
        waveform ? `## Power input against the rating\n\n<VerdictTable analysis="${waveform}" />\n\n<WaveformChart analysis="${waveform}" />` : "",
        waveform ? `## How the controller switches\n\n<ConductionMap analysis="${waveform}" />\n\n<HarmonicChart analysis="${waveform}" />` : "",
        heatUp ? `## Heat-up\n\n<HeatUpCurve analysis="${heatUp}" />` : "",
        "## Rated against measured\n\n<SpecTable />",
      ]
        .filter(Boolean)
        .join("\n\n"),
  },
  {
    id: publishedReportIds.cedarHollow,
    slug: "tessaly-rw-6-duet-at-120-v",
    title: "Tessaly RW-6 Duet at 120 V: the soldering side measured",
    reviewerEmail: "teodor.wylde@benchplate.test",
    draftId: seededReportIds.cedarHollow,
    path: "sent-back-then-published",
    body: ({ waveform, heatUp }) =>
      [
        "## In short\n\nOn a 120 V, 60 Hz shop supply the station reached its setpoint quickly and held it; the figures below come from a loaned retail unit.",
        safety,
        waveform ? `## Power input\n\n<VerdictTable analysis="${waveform}" />\n\n<ConductionMap analysis="${waveform}" />` : "",
        heatUp ? `## Heat-up\n\n<HeatUpCurve analysis="${heatUp}" />\n\n<VerdictTable analysis="${heatUp}" />` : "",
        "## Rated against measured\n\n<SpecTable />",
      ]
        .filter(Boolean)
        .join("\n\n"),
  },
  {
    id: publishedReportIds.cedarHollowQueued,
    slug: "tessaly-rw-6-duet-heat-up-under-load",
    title: "Tessaly RW-6 Duet: how fast the iron comes back",
    reviewerEmail: "teodor.wylde@benchplate.test",
    draftId: seededReportIds.cedarHollow,
    path: "submitted",
    body: ({ heatUp, waveform }) =>
      [
        "## Heat-up and recovery\n\nA closer look at the iron's heat-up from cold, measured with a thermocouple at the tip.",
        safety,
        heatUp ? `<HeatUpCurve analysis="${heatUp}" />` : waveform ? `<VerdictTable analysis="${waveform}" />` : "",
      ]
        .filter(Boolean)
        .join("\n\n"),
  },
];

/** The correction the Wrenford report gets after publication: a finding that said too much is narrowed. */
export const demoCorrection = {
  reportId: publishedReportIds.wrenford,
  firstClaim: "\n\nIt meets its rating at any mains voltage in its range.\n",
  correctedClaim:
    "\n\n*Corrected:* it meets its rating at the 230 V it was tested on (229.2 V measured). The first revision said “at any mains voltage in its range”, which one supply voltage cannot show.\n",
  changeNote: "The first revision said the power input meets the rating at any mains voltage; only 230 V was tested, and the finding now says so.",
};

export const demoSendBackNotes = "Say where the loaned unit came from and whether the lender has any tie to the maker.";

export const demoMakerReply = {
  id: "5eed0004-7e57-4b00-8100-000000000001",
  reportId: publishedReportIds.cedarHollow,
  makerName: "Tessaly Tools",
  receivedOn: "2026-11-20",
  body: "Thank you for sharing the draft figures. The RW-6 Duet sold in North America is rated for 120 V ±10 %; units from the first batch shipped with firmware that reached the setpoint about two seconds later than the current firmware.",
};

/** Comments on the Wrenford report in every state, with the author's reply to the approved one. */
export const demoComments = [
  {
    id: "5eed0004-7e57-4b00-8200-000000000001",
    authorEmail: "priya.fenwick@benchplate.test",
    status: "approved",
    body: "Thanks for showing the conduction map. Does the flicker estimate assume the 230 V reference impedance?",
  },
  {
    id: "5eed0004-7e57-4b00-8200-000000000002",
    authorEmail: "nadia.orlen@benchplate.test",
    status: "approved",
    parentId: "5eed0004-7e57-4b00-8200-000000000001",
    body: "Yes: the IEC 61000-3-3 reference impedance for 230 V. The method page lists the values used.",
  },
  {
    id: "5eed0004-7e57-4b00-8200-000000000003",
    authorEmail: "jonah.ashdown@benchplate.test",
    status: "pending",
    body: "Would the result change with the 10 mm nozzle? Mine seems to run the heater harder.",
  },
  {
    id: "5eed0004-7e57-4b00-8200-000000000004",
    authorEmail: "carmen.idris@benchplate.test",
    status: "rejected",
    body: "Everyone knows these stations are all the same inside, this is pointless.",
  },
  {
    id: "5eed0004-7e57-4b00-8200-000000000005",
    authorEmail: "jonah.ashdown@benchplate.test",
    status: "spam",
    body: "Cheap replacement heaters, best prices at http://heaters.example/deal",
  },
] as const;
