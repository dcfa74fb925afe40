import net from "node:net";

/** One raw HTTP/1.1 exchange: whatever bytes we like go out; the status line and headers come back. */
export type RawAnswer =
  | { status: number; headers: Record<string, string>; bodyStart: string }
  | { error: string };

/**
 * Sends `request` (bytes, exactly as given) on a new connection to 127.0.0.1:port and reads the answer's head.
 * Unlike fetch, nothing is normalised or refused on the client side, so malformed paths, methods and headers
 * reach the server as written.
 */
export function rawRequest(
  port: number,
  request: Buffer,
  timeoutMs = 15_000,
): Promise<RawAnswer> {
  return new Promise((resolve) => {
    const socket = net.connect(port, "127.0.0.1");
    const chunks: Buffer[] = [];
    let settled = false;
    const settle = (answer: RawAnswer) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      socket.destroy();
      resolve(answer);
    };
    const timer = setTimeout(() => settle({ error: "timeout" }), timeoutMs);
    // Written, not ended: a half-closed connection is treated by Node as a client that went away.
    socket.on("connect", () => socket.write(request));
    socket.on("data", (chunk) => {
      chunks.push(chunk);
      const text = Buffer.concat(chunks).toString("latin1");
      const end = text.indexOf("\r\n\r\n");
      if (end < 0) return;
      const [statusLine, ...lines] = text.slice(0, end).split("\r\n");
      const status = Number(
        /^HTTP\/1\.[01] (\d{3})/.exec(statusLine ?? "")?.[1] ?? 0,
      );
      const headers: Record<string, string> = {};
      for (const line of lines) {
        const i = line.indexOf(":");
        if (i > 0)
          headers[line.slice(0, i).trim().toLowerCase()] = line
            .slice(i + 1)
            .trim();
      }
      settle({
        status,
        headers,
        bodyStart: text.slice(end + 4, end + 4 + 400),
      });
    });
    socket.on("error", (e) =>
      settle({ error: (e as NodeJS.ErrnoException).code ?? e.message }),
    );
    socket.on("close", () => {
      if (chunks.length === 0) settle({ error: "closed without an answer" });
    });
  });
}

export { seededRandom } from "../../app/core/interpolation/grids.test-helpers";
