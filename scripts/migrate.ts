// Applies committed migrations from drizzle/ to DATABASE_URL (npm run db:migrate).
import { runMigrations } from "~/.server/db/migrate";
import { getEnv } from "~/.server/env";

const started = performance.now();
await runMigrations(getEnv().DATABASE_URL);
console.log(
  `migrations applied in ${Math.round(performance.now() - started)} ms`,
);
