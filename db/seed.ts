import { closeDatabase, db } from "@/db";
import { seedCommunity } from "./seeds/community";
import { seedComparisons } from "./seeds/comparisons";
import { seedBenchRuns } from "./seeds/bench-runs";
import { seedEditorial } from "./seeds/editorial";
import { seedPeopleAndCatalogue } from "./seeds/people-and-catalogue";
import { seedWorkspaceCatalogue } from "./seeds/workspace-catalogue";
import { seedReports } from "./seeds/reports";

// Each seeder extends the demo scenario with one area of the product, in dependency order; each is idempotent.
const seeders = [
  { name: "people and catalogue", run: seedPeopleAndCatalogue },
  { name: "instruments, protocols and tool photos", run: seedWorkspaceCatalogue },
  { name: "test runs, captures and analyses", run: seedBenchRuns },
  // Reports cite what the seeders above made.
  { name: "draft reports", run: seedReports },
  { name: "published reports, corrections and comments", run: seedEditorial },
  // After the reports: a measured request links the published report that answers it.
  { name: "measurement requests and e-mail settings", run: seedCommunity },
  // A second tool from the Wrenford bench, published, so two tools compare on equal terms.
  { name: "a published run for comparisons", run: seedComparisons },
];

try {
  for (const seeder of seeders) {
    const summary = await db.transaction((tx) => seeder.run(tx));
    console.log(`seeded ${seeder.name}: ${summary}`);
  }
} finally {
  await closeDatabase();
}
