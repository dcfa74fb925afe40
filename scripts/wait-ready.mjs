// Used by start.sh: waits until URL answers 200, while the given processes stay alive.
//   node scripts/wait-ready.mjs URL TIMEOUT_S PID...
// Exit 0 once ready; 1 when a process exits first (its output is above) or the time runs out.
const [url, timeoutText, ...pids] = process.argv.slice(2);
const deadline = Date.now() + Number(timeoutText) * 1000;

function alive(pid) {
  try {
    process.kill(Number(pid), 0);
    return true;
  } catch {
    return false;
  }
}

for (;;) {
  const dead = pids.filter((pid) => !alive(pid));
  if (dead.length > 0) {
    console.error(`process ${dead.join(", ")} exited before ${url} answered`);
    process.exit(1);
  }
  try {
    const response = await fetch(url, { signal: AbortSignal.timeout(2_000) });
    if (response.status === 200) process.exit(0);
  } catch {
    // not listening yet
  }
  if (Date.now() > deadline) {
    console.error(`${url} did not answer 200 within ${timeoutText} s`);
    process.exit(1);
  }
  await new Promise((resolve) => setTimeout(resolve, 200));
}
