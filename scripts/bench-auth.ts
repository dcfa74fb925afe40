// npm run bench:auth — time of one password verification (the cost of one sign-in), argon2id as configured.
import { hashPassword, verifyPassword } from "~/.server/auth/password";

const hash = await hashPassword("benchmark-password");
const times: number[] = [];
for (let i = 0; i < 15; i++) {
  const started = performance.now();
  await verifyPassword(hash, "benchmark-password");
  times.push(performance.now() - started);
}
times.sort((a, b) => a - b);
const ms = (v: number | undefined) => `${(v ?? NaN).toFixed(1)} ms`;
console.log(
  `argon2id verify (one sign-in): median ${ms(times[7])}, min ${ms(times[0])}, max ${ms(times[14])}; target 50–500 ms`,
);
