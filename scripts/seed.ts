// Loads the invented demo scenario into DATABASE_URL (npm run db:seed). Safe to run again.
import { closeDb, getDb } from "~/.server/db/client";
import { seedDemo } from "~/.server/db/seed";
import { getEnv } from "~/.server/env";

const started = performance.now();
await seedDemo(getDb(), { demoPassword: getEnv().DEMO_PASSWORD });
await closeDb();
console.log(
  `demo data seeded in ${Math.round(performance.now() - started)} ms`,
);
