import { and, count, desc, eq, gte, lte, type SQL } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import type { AuditAction } from "~/utils/audit-actions";
import { auditLog, users } from "../schema";

/*
 * THE AUDIT RULE. An audit row is written by the function that opens the transaction of the change it records,
 * through that transaction: `recordAudit(event, tx)`, in the same `db.transaction(...)` as the change, so the
 * change and its row commit or roll back together. That function is a service (app/.server/<area>/) or, for a
 * change that is one query function's own transaction (creating a sample, storing a revision, a lab setting),
 * that query function. Routes never write audit rows. An event that changes no row of its own (a failed or
 * refused sign-in, a token's use) is written alone by its service, with `getDb()`.
 *
 * `db` has no default here, so every caller says which transaction its row belongs to.
 */

type AuditEvent = {
  action: AuditAction;
  userId?: number | null;
  apiTokenId?: string | null;
  entityType?: string | null;
  entityId?: string | number | null;
  details?: Record<string, unknown> | null;
  ipAddress?: string | null;
};

export async function recordAudit(
  event: AuditEvent,
  db: Executor,
): Promise<void> {
  await db.insert(auditLog).values({
    action: event.action,
    userId: event.userId ?? null,
    apiTokenId: event.apiTokenId ?? null,
    entityType: event.entityType ?? null,
    entityId:
      event.entityId === undefined || event.entityId === null
        ? null
        : String(event.entityId),
    details: event.details ?? null,
    ipAddress: event.ipAddress ?? null,
  });
}

type AuditFilter = {
  userId?: number;
  action?: AuditAction;
  from?: Date;
  to?: Date;
};

export async function listAuditEntries(
  filter: AuditFilter,
  page: { limit: number; offset: number },
  db: Executor = getDb(),
) {
  const conditions: SQL[] = [];
  if (filter.userId !== undefined)
    conditions.push(eq(auditLog.userId, filter.userId));
  if (filter.action) conditions.push(eq(auditLog.action, filter.action));
  if (filter.from) conditions.push(gte(auditLog.createdAt, filter.from));
  if (filter.to) conditions.push(lte(auditLog.createdAt, filter.to));
  const where = conditions.length > 0 ? and(...conditions) : undefined;
  const [total] = await db.select({ n: count() }).from(auditLog).where(where);
  const rows = await db
    .select({
      id: auditLog.id,
      createdAt: auditLog.createdAt,
      action: auditLog.action,
      userId: auditLog.userId,
      userEmail: users.email,
      apiTokenId: auditLog.apiTokenId,
      entityType: auditLog.entityType,
      entityId: auditLog.entityId,
      details: auditLog.details,
      ipAddress: auditLog.ipAddress,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.userId))
    .where(where)
    .orderBy(desc(auditLog.createdAt), desc(auditLog.id))
    .limit(page.limit)
    .offset(page.offset);
  return { total: total?.n ?? 0, rows };
}
