import { TransactionRollbackError } from "drizzle-orm";
import mysql from "mysql2/promise";
import { afterAll, beforeAll, beforeEach, expect, test } from "vitest";
import { issueApiToken, revokeToken } from "~/.server/api/tokens";
import { changePassword } from "~/.server/auth/accounts";
import { hashPassword } from "~/.server/auth/password";
import { changeRole, setAccountDisabled } from "~/.server/auth/people";
import { createSession, signOut } from "~/.server/auth/session";
import type { Database, Executor } from "~/.server/db/client";
import { setFourEyesMode } from "~/.server/db/queries/settings";
import { createUser, getUserById } from "~/.server/db/queries/users";
import type { AuditAction } from "~/utils/audit-actions";
import { useFreshMigratedDatabase } from "../support/app-database";

/*
 * The audit rule (app/.server/db/queries/audit.ts): a change and its audit row are one transaction. To see that
 * they also fail together, a trigger makes the audit insert of chosen actions fail, after the change it records
 * has been written: the change must then be gone as well. The other way round, services run inside a caller's
 * transaction that rolls back leave neither change nor audit row (an audit row written on another connection
 * would remain). And the people rules: an administrator cannot demote
 * or disable themself.
 */
let db: Database;
let pool: mysql.Pool;
let cleanup: () => Promise<void>;
let adminId: number;
let engineerId: number;
const IP = "192.0.2.7";
const PASSWORD = "correct-horse-battery";

async function sql<T>(query: string, params: unknown[] = []): Promise<T[]> {
  const [rows] = await pool.query(query, params);
  return rows as T[];
}

async function auditCount(action: AuditAction): Promise<number> {
  const [row] = await sql<{ n: number }>(
    "SELECT COUNT(*) AS n FROM audit_log WHERE action = ?",
    [action],
  );
  return Number(row!.n);
}

/** The failure is the forced one of the audit insert, after the change was written. */
const AUDIT_FAILED = /insert into `audit_log`/;

/** From now on the audit insert of `action` fails (SIGNAL in a trigger), inside whatever transaction runs it. */
async function failAuditOf(action: AuditAction) {
  await sql("INSERT INTO test_failing_audit (action) VALUES (?)", [action]);
}

beforeAll(async () => {
  const fresh = await useFreshMigratedDatabase();
  db = fresh.db;
  pool = mysql.createPool({ uri: fresh.url, timezone: "Z" });
  cleanup = async () => {
    await pool.end();
    await fresh.cleanup();
  };
  await sql("CREATE TABLE test_failing_audit (action VARCHAR(64) PRIMARY KEY)");
  await sql(`CREATE TRIGGER test_audit_fails BEFORE INSERT ON audit_log FOR EACH ROW
    BEGIN
      IF EXISTS (SELECT 1 FROM test_failing_audit f WHERE f.action = NEW.action) THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'forced audit failure';
      END IF;
    END`);
  const passwordHash = await hashPassword(PASSWORD);
  adminId = await createUser(
    { email: "admin@example.test", name: "Admin", role: "admin", passwordHash },
    db,
  );
  engineerId = await createUser(
    { email: "eng@example.test", name: "Eng", role: "engineer", passwordHash },
    db,
  );
}, 60_000);
afterAll(async () => cleanup?.());

beforeEach(async () => {
  await sql("DELETE FROM test_failing_audit");
});

test("a role change and its audit row commit together, and roll back together when the audit write fails", async () => {
  const done = await changeRole(
    { actorId: adminId, userId: engineerId, role: "lab_lead", ipAddress: IP },
    db,
  );
  expect(done).toEqual({ ok: true, done: "Eng is now Lab lead." });
  expect((await getUserById(engineerId, db))?.role).toBe("lab_lead");
  const rows = await sql(
    "SELECT user_id, entity_id, JSON_VALUE(details, '$.from') AS from_role, JSON_VALUE(details, '$.to') AS to_role FROM audit_log WHERE action = 'role_changed'",
  );
  expect(rows).toEqual([
    {
      user_id: adminId,
      entity_id: String(engineerId),
      from_role: "engineer",
      to_role: "lab_lead",
    },
  ]);

  await failAuditOf("role_changed");
  await expect(
    changeRole(
      { actorId: adminId, userId: engineerId, role: "viewer", ipAddress: IP },
      db,
    ),
  ).rejects.toThrow(AUDIT_FAILED);
  expect((await getUserById(engineerId, db))?.role).toBe("lab_lead");
  expect(await auditCount("role_changed")).toBe(1);
});

test("disabling an account (and ending its sessions) rolls back with its failed audit row", async () => {
  await createSession(engineerId, { ipAddress: IP, userAgent: null }, db);
  await failAuditOf("account_disabled");
  await expect(
    setAccountDisabled(
      { actorId: adminId, userId: engineerId, disabled: true, ipAddress: IP },
      db,
    ),
  ).rejects.toThrow(AUDIT_FAILED);
  expect((await getUserById(engineerId, db))?.disabledAt).toBeNull();
  const [sessions] = await sql<{ n: number }>(
    "SELECT COUNT(*) AS n FROM sessions WHERE user_id = ?",
    [engineerId],
  );
  expect(Number(sessions!.n)).toBe(1);
  expect(await auditCount("account_disabled")).toBe(0);
});

test("an administrator cannot demote or disable themself through the service, and nothing is written", async () => {
  for (const role of ["lab_lead", "engineer", "viewer"] as const) {
    expect(
      await changeRole(
        { actorId: adminId, userId: adminId, role, ipAddress: IP },
        db,
      ),
    ).toEqual({
      ok: false,
      formError:
        "You cannot remove your own administrator role; ask another administrator.",
    });
  }
  expect(
    await setAccountDisabled(
      { actorId: adminId, userId: adminId, disabled: true, ipAddress: IP },
      db,
    ),
  ).toEqual({ ok: false, formError: "You cannot disable your own account." });
  const me = await getUserById(adminId, db);
  expect(me).toMatchObject({ role: "admin", disabledAt: null });
  const [row] = await sql<{ n: number }>(
    "SELECT COUNT(*) AS n FROM audit_log WHERE entity_type = 'user' AND entity_id = ?",
    [String(adminId)],
  );
  expect(Number(row!.n)).toBe(0);
  // Keeping one's own admin role is no demotion.
  expect(
    await changeRole(
      { actorId: adminId, userId: adminId, role: "admin", ipAddress: IP },
      db,
    ),
  ).toMatchObject({ ok: true });
  // A person who no longer exists is refused as such.
  expect(
    await changeRole(
      { actorId: adminId, userId: 999_999, role: "viewer", ipAddress: IP },
      db,
    ),
  ).toEqual({ ok: false, formError: "That person no longer exists." });
});

test("issuing and revoking a token: record and audit row together, neither when the audit write fails", async () => {
  await failAuditOf("api_token_created");
  await expect(
    issueApiToken({
      userId: engineerId,
      name: "never stored",
      scopes: ["tables:read"],
      expiresInDays: 30,
      ipAddress: IP,
    }),
  ).rejects.toThrow(AUDIT_FAILED);
  expect(
    await sql("SELECT id FROM api_tokens WHERE name = 'never stored'"),
  ).toEqual([]);

  await sql("DELETE FROM test_failing_audit");
  const issued = await issueApiToken({
    userId: engineerId,
    name: "model",
    scopes: ["tables:read"],
    sampleIds: [],
    fieldIds: [],
    expiresInDays: 30,
    ipAddress: IP,
  });
  expect(await auditCount("api_token_created")).toBe(1);

  const stranger = (await getUserById(adminId, db))!;
  await failAuditOf("api_token_revoked");
  await expect(
    revokeToken({ user: stranger, tokenId: issued.id, ipAddress: IP }),
  ).rejects.toThrow(AUDIT_FAILED);
  const [token] = await sql<{ revoked_at: Date | null }>(
    "SELECT revoked_at FROM api_tokens WHERE id = ?",
    [issued.id],
  );
  expect(token!.revoked_at).toBeNull();
  expect(await auditCount("api_token_revoked")).toBe(0);
});

test("revoking: only the owner or revoke:any-token, and a second revocation records nothing", async () => {
  const issued = await issueApiToken({
    userId: adminId,
    name: "admin's",
    scopes: ["tables:read"],
    expiresInDays: 1,
    ipAddress: IP,
  });
  const engineer = (await getUserById(engineerId, db))!;
  const admin = (await getUserById(adminId, db))!;
  expect(
    await revokeToken({ user: engineer, tokenId: issued.id, ipAddress: IP }),
  ).toEqual({ ok: false, reason: "forbidden" });
  const before = await auditCount("api_token_revoked");
  expect(
    await revokeToken({ user: admin, tokenId: issued.id, ipAddress: IP }),
  ).toEqual({ ok: true, name: "admin's" });
  expect(
    await revokeToken({ user: admin, tokenId: issued.id, ipAddress: IP }),
  ).toEqual({ ok: true, name: "admin's" });
  expect(await auditCount("api_token_revoked")).toBe(before + 1);
  expect(
    await revokeToken({
      user: admin,
      tokenId: "00000000-0000-4000-8000-000000000000",
      ipAddress: IP,
    }),
  ).toEqual({ ok: false, reason: "not_found" });
});

test("signing out and changing a password roll back with their failed audit rows", async () => {
  const { sessionId } = await createSession(
    adminId,
    { ipAddress: IP, userAgent: null },
    db,
  );
  await failAuditOf("sign_out");
  await expect(
    signOut({ sessionId, userId: adminId, ipAddress: IP }),
  ).rejects.toThrow(AUDIT_FAILED);
  expect(
    await sql("SELECT id FROM sessions WHERE id = ?", [sessionId]),
  ).toHaveLength(1);

  const passwordHash = () =>
    sql<{ password_hash: string }>(
      "SELECT password_hash FROM users WHERE id = ?",
      [adminId],
    ).then((rows) => rows[0]!.password_hash);
  const hashBefore = await passwordHash();
  await failAuditOf("password_changed");
  await expect(
    changePassword({
      userId: adminId,
      sessionId,
      currentPassword: PASSWORD,
      newPassword: "another-long-password",
      ipAddress: IP,
    }),
  ).rejects.toThrow(AUDIT_FAILED);
  expect(await passwordHash()).toBe(hashBefore);
  expect(await auditCount("password_changed")).toBe(0);
});

test("a lab setting (written by its query function) rolls back with its failed audit row", async () => {
  await failAuditOf("setting_changed");
  await expect(
    setFourEyesMode({ mode: "on", userId: adminId, ipAddress: IP }, db),
  ).rejects.toThrow(AUDIT_FAILED);
  expect(await sql("SELECT `key` FROM lab_settings")).toEqual([]);
});

/** Runs `work` inside a transaction of the caller's that is then rolled back. */
async function thenRolledBack(work: (tx: Executor) => Promise<unknown>) {
  await expect(
    db.transaction(async (tx) => {
      await work(tx);
      tx.rollback();
    }),
  ).rejects.toThrow(TransactionRollbackError);
}

test("in a caller's transaction that rolls back, neither the changes nor their audit rows remain", async () => {
  const auditsBefore = await sql<{ n: number }>(
    "SELECT COUNT(*) AS n FROM audit_log",
  );
  const { sessionId } = await createSession(
    engineerId,
    { ipAddress: IP, userAgent: null },
    db,
  );
  const roleBefore = (await getUserById(engineerId, db))!.role;
  await thenRolledBack(async (tx) => {
    expect(
      await changeRole(
        { actorId: adminId, userId: engineerId, role: "viewer", ipAddress: IP },
        tx,
      ),
    ).toMatchObject({ ok: true });
    expect(
      await setAccountDisabled(
        { actorId: adminId, userId: engineerId, disabled: true, ipAddress: IP },
        tx,
      ),
    ).toMatchObject({ ok: true });
    await issueApiToken(
      {
        userId: engineerId,
        name: "rolled back",
        scopes: ["lookup"],
        expiresInDays: 1,
        ipAddress: IP,
      },
      tx,
    );
    await signOut({ sessionId, userId: engineerId, ipAddress: IP }, tx);
  });
  expect(await getUserById(engineerId, db)).toMatchObject({
    role: roleBefore,
    disabledAt: null,
  });
  expect(
    await sql("SELECT id FROM api_tokens WHERE name = 'rolled back'"),
  ).toEqual([]);
  expect(
    await sql("SELECT id FROM sessions WHERE id = ?", [sessionId]),
  ).toHaveLength(1);
  expect(
    await sql<{ n: number }>("SELECT COUNT(*) AS n FROM audit_log"),
  ).toEqual(auditsBefore);
});
