// `npm run db:migrate` and `npm run db:seed`: the same code the server runs at start, by hand.
// On the embedded database this takes the data-dir lock, so it refuses while a server runs.
import { openConfiguredDatabase } from "@/server/database";
import { seedDemo } from "@/db/seed";

const command = process.argv[2];
const opened = await openConfiguredDatabase();
try {
  if (command === "seed") console.log((await seedDemo(opened.db)) ? "Seeded the demo scenario." : "Database already has data: nothing seeded.");
  else console.log(`Migrations applied (${opened.kind}).`);
} finally {
  await opened.close();
}
