import { eq, inArray, sql } from "drizzle-orm";
import sharp from "sharp";
import type { Transaction } from "@/db";
import { countToolPhotos } from "@/db/queries/tool-photos";
import { instruments, labs, protocols, protocolVersions, tools, users } from "@/db/schema";
import { statObject } from "@/lib/object-storage";
import { storeToolPhoto } from "@/lib/tool-photos";
import { demoInstruments, demoProtocols } from "./workspace-catalogue-data";

const day = 24 * 60 * 60 * 1000;

function isoDaysFrom(now: Date, days: number): string {
  return new Date(now.getTime() + days * day).toISOString().slice(0, 10);
}

/**
 * The instruments register for both labs and the two demo protocols. Instruments upsert by maker, model and serial;
 * protocol versions are immutable, so an existing version is left as it is and only missing ones are added.
 */
export async function seedWorkspaceCatalogue(tx: Transaction) {
  const now = new Date();
  const labRows = await tx.select({ id: labs.id, slug: labs.slug }).from(labs);
  const labIdBySlug = new Map(labRows.map((row) => [row.slug, row.id]));

  for (const { labSlug, calibration, ...instrument } of demoInstruments) {
    const labId = labIdBySlug.get(labSlug);
    if (!labId) throw new Error(`demo instrument ${instrument.serialNumber} names unknown lab ${labSlug}: run the people seeder first`);
    const dates = {
      calibratedOn: isoDaysFrom(now, -calibration.calibratedDaysAgo),
      calibrationDueOn: isoDaysFrom(now, calibration.intervalDays - calibration.calibratedDaysAgo),
    };
    await tx
      .insert(instruments)
      .values({ ...instrument, labId, ...dates })
      .onConflictDoUpdate({
        target: [instruments.maker, instruments.model, instruments.serialNumber],
        set: { kind: instrument.kind, labId, accuracy: instrument.accuracy, ...dates },
      });
  }

  const authors = await tx
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(inArray(users.email, demoProtocols.map((protocol) => protocol.authorEmail)));
  const authorIdByEmail = new Map(authors.map((row) => [row.email, row.id]));
  let versionsAdded = 0;
  for (const protocol of demoProtocols) {
    const createdById = authorIdByEmail.get(protocol.authorEmail);
    if (!createdById) throw new Error(`demo protocol author ${protocol.authorEmail} missing: run the people seeder first`);
    const [row] = await tx
      .insert(protocols)
      .values({ slug: protocol.slug, name: protocol.name, createdById })
      .onConflictDoUpdate({ target: protocols.slug, set: { name: sql`excluded.name` } })
      .returning({ id: protocols.id });
    const protocolId = row!.id;
    for (const [index, { writtenDaysAgo, ...version }] of protocol.versions.entries()) {
      const written = new Date(now.getTime() - writtenDaysAgo * day);
      const added = await tx
        .insert(protocolVersions)
        .values({ ...version, protocolId, version: index + 1, createdById, createdAt: written, updatedAt: written })
        .onConflictDoNothing({ target: [protocolVersions.protocolId, protocolVersions.version] })
        .returning({ id: protocolVersions.id });
      versionsAdded += added.length;
    }
  }

  const photos = await seedToolPhotos(tx);
  return `${demoInstruments.length} instruments, ${demoProtocols.length} protocols (${versionsAdded} versions added), ${photos}`;
}

const demoPhotos = [
  {
    toolSlug: "quillfern-aeris-720",
    case: "#6b7180",
    accent: "#a5481f",
    altText: "Drawing of the Aeris 720 station from the front: grey case, setpoint display, two knobs and the hot-air handle in its cradle",
  },
  {
    toolSlug: "tessaly-rw-6-duet",
    case: "#2c6e68",
    accent: "#fffdf8",
    altText: "Drawing of the RW-6 Duet from the front: green case, two displays, the soldering iron and the hot-air handle on their stands",
  },
];

/** A simple drawing of a bench station: no text, so it renders the same without any fonts installed. */
function stationDrawing(caseColour: string, accent: string): Buffer {
  return Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="1600" height="1000" viewBox="0 0 1600 1000">
  <rect width="1600" height="1000" fill="#ebe6da"/>
  <rect x="0" y="780" width="1600" height="220" fill="#d6cfbf"/>
  <rect x="260" y="340" width="760" height="460" rx="28" fill="${caseColour}"/>
  <rect x="320" y="400" width="300" height="130" rx="10" fill="#1f232b"/>
  <rect x="345" y="430" width="250" height="70" rx="6" fill="${accent}" opacity="0.85"/>
  <circle cx="760" cy="470" r="58" fill="#f6f3ec"/><circle cx="900" cy="470" r="58" fill="#f6f3ec"/>
  <rect x="330" y="620" width="620" height="24" rx="12" fill="#1f232b" opacity="0.5"/>
  <rect x="1120" y="520" width="260" height="280" rx="20" fill="#454b57"/>
  <rect x="1190" y="260" width="70" height="330" rx="30" fill="#1f232b" transform="rotate(-12 1225 425)"/>
  <path d="M1020 700 C 1080 700, 1100 600, 1190 560" stroke="#1f232b" stroke-width="18" fill="none"/>
</svg>`);
}

/** Photos for two tools when object storage answers; a demo without the fakes running still seeds everything else. */
async function seedToolPhotos(tx: Transaction): Promise<string> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      statObject("seed-reachability-check"),
      new Promise((_, reject) => (timer = setTimeout(() => reject(new Error("no answer within 5 s")), 5_000))),
    ]);
  } catch (error) {
    console.log(`  tool photos skipped: object storage is not reachable (${(error as Error).message}); start the fakes and seed again`);
    return "no photos (object storage not reachable)";
  } finally {
    clearTimeout(timer);
  }
  let added = 0;
  for (const photo of demoPhotos) {
    const [tool] = await tx.select({ id: tools.id }).from(tools).where(eq(tools.slug, photo.toolSlug));
    if (!tool || (await countToolPhotos(tx, { toolId: tool.id })) > 0) continue;
    const image = await sharp(stationDrawing(photo.case, photo.accent)).jpeg({ quality: 90 }).toBuffer();
    await storeToolPhoto({ toolId: tool.id, image, altText: photo.altText, uploadedById: null });
    added++;
  }
  return `${added} tool photos added`;
}
