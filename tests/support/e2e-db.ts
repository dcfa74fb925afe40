import { randomUUID } from "node:crypto";
import jwt from "jsonwebtoken";
import mysql from "mysql2/promise";
import { APP_SERVER_ENV } from "./e2e";

/** Direct access to the e2e database, for arranging cases the UI cannot reach quickly (e.g. an expired token). */
let pool: mysql.Pool | undefined;
export function e2eDb(): mysql.Pool {
  pool ??= mysql.createPool({
    uri: APP_SERVER_ENV.DATABASE_URL,
    timezone: "Z",
    connectionLimit: 2,
  });
  return pool;
}
export async function closeE2eDb() {
  await pool?.end();
  pool = undefined;
}

export async function userIdOf(email: string): Promise<number> {
  const [rows] = await e2eDb().query("SELECT id FROM users WHERE email = ?", [
    email,
  ]);
  const id = (rows as { id: number }[])[0]?.id;
  if (!id) throw new Error(`no user ${email}`);
  return id;
}

/** Signs a token the way the server does (HS256, issuer, audience), with a record of our choosing. */
export async function mintToken(input: {
  userId: number;
  scopes?: string[];
  restriction?: { fieldIds?: number[]; sampleIds?: number[] } | null;
  expiresInSeconds?: number;
  secret?: string;
  record?: boolean;
}): Promise<{ id: string; token: string }> {
  const id = randomUUID();
  const scopes = input.scopes ?? ["tables:read", "lookup"];
  const expiresIn = input.expiresInSeconds ?? 3600;
  if (input.record !== false) {
    await e2eDb().query(
      "INSERT INTO api_tokens (id, user_id, name, scopes, restriction, expires_at) VALUES (?, ?, ?, ?, ?, ?)",
      [
        id,
        input.userId,
        `test token ${id.slice(0, 8)}`,
        JSON.stringify(scopes),
        input.restriction ? JSON.stringify(input.restriction) : null,
        new Date(Date.now() + Math.max(expiresIn, 1) * 1000),
      ],
    );
  }
  const token = jwt.sign(
    { scope: scopes.join(" ") },
    input.secret ?? APP_SERVER_ENV.API_TOKEN_SECRET!,
    {
      algorithm: "HS256",
      jwtid: id,
      subject: String(input.userId),
      issuer: "isopleth",
      audience: "isopleth-api",
      expiresIn,
    },
  );
  return { id, token };
}
