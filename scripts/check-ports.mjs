// Used by start.sh before anything starts: are the ports it needs free?
//   node scripts/check-ports.mjs HOST NAME=PORT[@HOST] ...   (exit 1 naming every port that is taken)
// Each port is tried the way its server will bind it (a listen, then closed at once), so "in use" means exactly
// what the server would meet; `ss` names the process holding it when it can.
import { execFileSync } from "node:child_process";
import net from "node:net";

const [defaultHost, ...specs] = process.argv.slice(2);
if (!defaultHost || specs.length === 0) {
  console.error(
    "usage: node scripts/check-ports.mjs HOST NAME=PORT[@HOST] ...",
  );
  process.exit(2);
}

function tryListen(host, port) {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once("error", (error) => resolve(error.code ?? String(error)));
    server.listen({ host, port, exclusive: true }, () =>
      server.close(() => resolve(null)),
    );
  });
}

function holder(port) {
  try {
    const out = execFileSync("ss", ["-ltnpH", `sport = :${port}`], {
      encoding: "utf8",
      stdio: ["ignore", "pipe", "ignore"],
    });
    const match = out.match(/users:\(\("([^"]+)",pid=(\d+)/);
    return match ? ` by ${match[1]} (pid ${match[2]})` : "";
  } catch {
    return "";
  }
}

const problems = [];
const seen = new Map();
for (const spec of specs) {
  const match = spec.match(/^([A-Z_]+)=(\d+)(?:@(.+))?$/);
  if (!match) {
    problems.push(`${spec}: not NAME=PORT`);
    continue;
  }
  const [, name, portText, host = defaultHost] = match;
  const port = Number(portText);
  if (port < 1 || port > 65535) {
    problems.push(`${name}=${portText}: not a port number (1-65535)`);
    continue;
  }
  if (seen.has(port)) {
    problems.push(
      `${name} and ${seen.get(port)} are both ${port}; give each its own port`,
    );
    continue;
  }
  seen.set(port, name);
  const code = await tryListen(host, port);
  if (code === "EADDRINUSE")
    problems.push(
      `${name}=${port}: port ${port} on ${host} is already in use${holder(port)}`,
    );
  else if (code === "EACCES")
    problems.push(
      `${name}=${port}: not allowed to listen on port ${port} (ports below 1024 need privileges)`,
    );
  else if (code)
    problems.push(
      `${name}=${port}: cannot listen on ${host}:${port} (${code})`,
    );
}

if (problems.length > 0) {
  for (const problem of problems) console.error(`  - ${problem}`);
  process.exit(1);
}
