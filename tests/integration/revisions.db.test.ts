import mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import {
  countFollowers,
  followSample,
  isFollowing,
  listActiveFollowers,
  unfollowSample,
} from "~/.server/db/queries/follows";
import {
  getCurrentApprovedRevision,
  getRevisionDetail,
  getRevisionGrids,
  getRevisionsForDiff,
  listRevisionsOfSample,
  storeDraftRevision,
  storeUploadedRevision,
} from "~/.server/db/queries/revisions";
import {
  createSampleRecord,
  getSampleRecord,
  searchSamples,
  updateSampleRecord,
} from "~/.server/db/queries/samples";
import {
  getFourEyesPolicy,
  setFourEyesMode,
} from "~/.server/db/queries/settings";
import { createUser, setUserDisabled } from "~/.server/db/queries/users";
import {
  checkUpload,
  revisionFromUpload,
} from "~/.server/samples/check-upload";
import { diffRevisions } from "~/.server/samples/diff";
import type { StoredQcReport } from "~/.server/samples/qc-report";
import { reviewRevision } from "~/.server/samples/review";
import { buildTemplateCsv } from "~/core/lab-data";
import { useFreshMigratedDatabase } from "../support/app-database";

/*
 * Revisions against the real MariaDB: storing an upload is all-or-nothing, numbering stays unique and gapless
 * under concurrent uploads, review rules (errors block approval, warnings need acknowledging, the previous
 * approved revision is superseded), follows, search and diff.
 * The grids are the invented example of the downloadable template (app/core/lab-data/templates.ts).
 */
let cleanup: () => Promise<void>;
let pool: mysql.Pool;
let labLeadId: number;
let otherLeadId: number;
let viewerId: number;

async function sql<T>(query: string, params: unknown[] = []): Promise<T[]> {
  const [rows] = await pool.query(query, params);
  return rows as T[];
}

const SAMPLE = {
  fieldRegion: null,
  sampleType: "bottomhole" as const,
  samplingDate: "2025-05-14",
  samplingDepthFt: 8200,
  reservoirPressurePsia: 4100,
  reservoirTemperatureF: 200,
  stockTankApi: 35,
  gasSpecificGravity: 0.75,
  standardPressurePsia: 14.696,
  standardTemperatureF: 60,
  laboratory: "Invented Laboratory",
  reportReference: "INV-001",
  notes: "Invented test record.",
};

async function newSample(
  label: string,
  wellName = "T-1",
  fieldName = "Test Field",
) {
  const result = await createSampleRecord(
    { ...SAMPLE, fieldName, wellName, label },
    { userId: labLeadId },
  );
  if (!result.ok) throw new Error("sample not created");
  return result.id;
}

/** The long-layout template, checked for a sample, as the revision an upload would store. */
async function templateRevision(sampleId: number, comment = "test upload") {
  const bytes = new TextEncoder().encode(buildTemplateCsv("long"));
  const checked = await checkUpload(
    { name: "template-long.csv", bytes },
    SAMPLE,
  );
  if (!checked.ok)
    throw new Error(
      `template did not parse: ${checked.errors.map((e) => e.message).join(" ")}`,
    );
  return {
    checked,
    revision: revisionFromUpload(checked, {
      sampleId,
      createdBy: labLeadId,
      comment,
    }),
  };
}

async function rowCounts(sampleId: number) {
  const [r] = await sql<{
    revisions: number;
    grids: number;
    points: number;
    bubbles: number;
    audits: number;
  }>(
    `SELECT
       (SELECT COUNT(*) FROM sample_revisions WHERE sample_id = ?) AS revisions,
       (SELECT COUNT(*) FROM property_grids g JOIN sample_revisions r ON r.id = g.revision_id WHERE r.sample_id = ?) AS grids,
       (SELECT COUNT(*) FROM grid_points p JOIN property_grids g ON g.id = p.grid_id JOIN sample_revisions r ON r.id = g.revision_id WHERE r.sample_id = ?) AS points,
       (SELECT COUNT(*) FROM revision_bubble_points b JOIN sample_revisions r ON r.id = b.revision_id WHERE r.sample_id = ?) AS bubbles,
       (SELECT COUNT(*) FROM grid_points) AS all_points,
       (SELECT COUNT(*) FROM audit_log WHERE action = 'revision_uploaded' AND JSON_VALUE(details, '$.sampleId') = ?) AS audits`,
    [sampleId, sampleId, sampleId, sampleId, sampleId],
  );
  return {
    revisions: Number(r!.revisions),
    grids: Number(r!.grids),
    points: Number(r!.points),
    bubbles: Number(r!.bubbles),
    audits: Number(r!.audits),
  };
}

async function allRowCounts() {
  const [r] = await sql<Record<string, number>>(
    "SELECT (SELECT COUNT(*) FROM sample_revisions) AS r, (SELECT COUNT(*) FROM property_grids) AS g, (SELECT COUNT(*) FROM grid_points) AS p, (SELECT COUNT(*) FROM revision_bubble_points) AS b",
  );
  return { r: Number(r!.r), g: Number(r!.g), p: Number(r!.p), b: Number(r!.b) };
}

beforeAll(async () => {
  const fresh = await useFreshMigratedDatabase();
  pool = mysql.createPool({ uri: fresh.url, timezone: "Z" });
  cleanup = async () => {
    await pool.end();
    await fresh.cleanup();
  };
  labLeadId = await createUser({
    email: "lead@example.test",
    name: "Lead One",
    role: "lab_lead",
    passwordHash: "x",
  });
  otherLeadId = await createUser({
    email: "lead2@example.test",
    name: "Lead Two",
    role: "lab_lead",
    passwordHash: "x",
  });
  viewerId = await createUser({
    email: "viewer@example.test",
    name: "Viewer",
    role: "viewer",
    passwordHash: "x",
  });
}, 60_000);

afterAll(async () => cleanup?.());

describe("field → well → sample records", () => {
  test("creates the field and well once, refuses a second sample of the same label in a well", async () => {
    const first = await createSampleRecord(
      { ...SAMPLE, fieldName: "Records Field", wellName: "R-1", label: "S1" },
      { userId: labLeadId },
    );
    expect(first).toMatchObject({
      ok: true,
      createdField: true,
      createdWell: true,
    });
    const second = await createSampleRecord(
      { ...SAMPLE, fieldName: "Records Field", wellName: "R-1", label: "S2" },
      { userId: labLeadId },
    );
    expect(second).toMatchObject({
      ok: true,
      createdField: false,
      createdWell: false,
    });
    const duplicate = await createSampleRecord(
      { ...SAMPLE, fieldName: "Records Field", wellName: "R-1", label: "S1" },
      { userId: labLeadId },
    );
    expect(duplicate).toEqual({ ok: false, conflict: "label" });
    // Nothing half-made by the refused one.
    const [n] = await sql<{ n: number }>(
      "SELECT COUNT(*) AS n FROM samples WHERE label = 'S1'",
    );
    expect(Number(n!.n)).toBe(1);
  });

  test("an edit can move the sample to a new well and refuses a label taken there", async () => {
    const id = await newSample("Move me", "M-1", "Move Field");
    await newSample("Taken", "M-2", "Move Field");
    const record = (await getSampleRecord(id))!;
    const moved = await updateSampleRecord(
      id,
      { ...record, fieldRegion: null, wellName: "M-3", notes: "moved" },
      { userId: labLeadId },
    );
    expect(moved).toMatchObject({
      ok: true,
      createdWell: true,
      changed: ["notes", "well"],
    });
    const [audit] = await sql<{ n: number }>(
      "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'sample_updated' AND entity_id = ?",
      [String(id)],
    );
    expect(Number(audit!.n)).toBe(1);
    expect(await getSampleRecord(id)).toMatchObject({
      wellName: "M-3",
      notes: "moved",
    });
    const clash = await updateSampleRecord(
      id,
      { ...record, fieldRegion: null, wellName: "M-2", label: "Taken" },
      { userId: labLeadId },
    );
    expect(clash).toEqual({ ok: false, conflict: "label" });
    expect(await getSampleRecord(id)).toMatchObject({
      wellName: "M-3",
      label: "Move me",
    });
  });

  test("search, filter, sort and pages", async () => {
    for (const label of ["Zeta 1", "Zeta 2", "Zeta 3"])
      await newSample(label, "Z-1", "Zeta Field");
    const all = await searchSamples({
      q: "zeta",
      sort: "label",
      dir: "desc",
      page: 1,
      pageSize: 2,
    });
    expect(all.total).toBe(3);
    expect(all.rows.map((r) => r.label)).toEqual(["Zeta 3", "Zeta 2"]);
    const page2 = await searchSamples({
      q: "zeta",
      sort: "label",
      dir: "desc",
      page: 2,
      pageSize: 2,
    });
    expect(page2.rows.map((r) => r.label)).toEqual(["Zeta 1"]);
    // LIKE wildcards typed by the user are taken literally.
    expect(
      (
        await searchSamples({
          q: "%",
          sort: "label",
          dir: "asc",
          page: 1,
          pageSize: 10,
        })
      ).total,
    ).toBe(0);
    expect(
      (
        await searchSamples({
          q: "Z-1",
          status: "approved",
          sort: "field",
          dir: "asc",
          page: 1,
          pageSize: 10,
        })
      ).total,
    ).toBe(0);
    expect(
      (
        await searchSamples({
          q: "Z-1",
          status: "none",
          sort: "field",
          dir: "asc",
          page: 1,
          pageSize: 10,
        })
      ).total,
    ).toBe(3);
  });
});

describe("storing an upload", () => {
  test("the template round-trips: what is read back is what was parsed", async () => {
    const sampleId = await newSample("Round trip");
    const { checked, revision } = await templateRevision(sampleId);
    const stored = await storeDraftRevision(revision);
    expect(stored.number).toBe(1);
    const grids = await getRevisionGrids(stored.id);
    expect(grids.map((g) => g.property).sort()).toEqual(
      Object.keys(checked.dataset.properties).sort(),
    );
    const bo = grids.find((g) => g.property === "oil_fvf")!;
    expect(bo.unit).toBe("rb/STB");
    expect(bo.values).toEqual(checked.dataset.properties.oil_fvf!.values);
    const bg = grids.find((g) => g.property === "gas_fvf")!;
    expect(bg.sourceUnit).toBe("ft3/scf");
    expect(bg.unit).toBe("rb/scf");
    const detail = await getRevisionDetail(sampleId, 1);
    expect(detail).toMatchObject({
      status: "draft",
      uploaderName: "Lead One",
      comment: "test upload",
      sourceFilename: "template-long.csv",
    });
    expect((await rowCounts(sampleId)).audits).toBe(1);
  });

  test("a failure in the middle of storing leaves no partial rows (second grid breaks a unique key)", async () => {
    const sampleId = await newSample("Half stored");
    const before = await allRowCounts();
    const { revision } = await templateRevision(sampleId);
    // The first grid and its points go in, then the same property again violates property_grids' unique key.
    const broken = {
      ...revision,
      grids: [...revision.grids, revision.grids[0]!],
    };
    await expect(storeDraftRevision(broken)).rejects.toThrow();
    expect(await rowCounts(sampleId)).toEqual({
      revisions: 0,
      grids: 0,
      points: 0,
      bubbles: 0,
      audits: 0,
    });
    expect(await allRowCounts()).toEqual(before);
  });

  test("a failure at the very end (the audit record) rolls the whole revision back", async () => {
    const sampleId = await newSample("Audit fails");
    const before = await allRowCounts();
    const { revision } = await templateRevision(sampleId);
    // audit_log.ip_address is VARCHAR(64): MariaDB's strict mode refuses a longer value, after every grid is written.
    await expect(
      storeDraftRevision({ ...revision, ipAddress: "x".repeat(65) }),
    ).rejects.toThrow();
    expect(await rowCounts(sampleId)).toEqual({
      revisions: 0,
      grids: 0,
      points: 0,
      bubbles: 0,
      audits: 0,
    });
    expect(await allRowCounts()).toEqual(before);
    // And the next upload still gets number 1: nothing was used up.
    expect((await storeDraftRevision(revision)).number).toBe(1);
  });

  test("two concurrent uploads for one sample get unique, gapless numbers", async () => {
    const sampleId = await newSample("Concurrent");
    const { revision } = await templateRevision(sampleId);
    const pair = await Promise.all([
      storeDraftRevision(revision),
      storeDraftRevision(revision),
    ]);
    expect(pair.map((r) => r.number).sort()).toEqual([1, 2]);
    // Five more at once, on a sample that now has revisions.
    const more = await Promise.all(
      Array.from({ length: 5 }, () => storeDraftRevision(revision)),
    );
    expect(more.map((r) => r.number).sort((a, b) => a - b)).toEqual([
      3, 4, 5, 6, 7,
    ]);
    const numbers = await sql<{ number: number }>(
      "SELECT number FROM sample_revisions WHERE sample_id = ? ORDER BY number",
      [sampleId],
    );
    expect(numbers.map((r) => r.number)).toEqual([1, 2, 3, 4, 5, 6, 7]);
    const counts = await rowCounts(sampleId);
    expect(counts.grids).toBe(7 * revision.grids.length);
    expect(counts.audits).toBe(7);
  });

  test("an upload identical (SHA-256) to a stored revision is refused unless confirmed, and names that revision", async () => {
    const sampleId = await newSample("Identical");
    const { revision } = await templateRevision(sampleId);
    const first = await storeUploadedRevision({
      ...revision,
      storeIdentical: false,
    });
    expect(first).toMatchObject({ ok: true, number: 1 });
    const before = await rowCounts(sampleId);
    const again = await storeUploadedRevision({
      ...revision,
      storeIdentical: false,
    });
    expect(again).toMatchObject({
      ok: false,
      reason: "identical",
      identical: { number: 1, status: "draft", uploaderName: "Lead One" },
    });
    if (!again.ok && again.reason === "identical")
      expect(again.identical.createdAt).toBeInstanceOf(Date);
    expect(await rowCounts(sampleId)).toEqual(before);
    // A different file goes in without a question; the identical one with the confirmation.
    const other = { ...revision, sourceSha256: "0".repeat(64) };
    expect(
      await storeUploadedRevision({
        ...other,
        storeIdentical: false,
      }),
    ).toMatchObject({ ok: true, number: 2 });
    expect(
      await storeUploadedRevision({
        ...revision,
        storeIdentical: true,
      }),
    ).toMatchObject({ ok: true, number: 3 });
    const [audit] = await sql<{ details: unknown }>(
      "SELECT details FROM audit_log WHERE action = 'revision_uploaded' AND JSON_VALUE(details, '$.sampleId') = ? AND JSON_VALUE(details, '$.number') = 3",
      [sampleId],
    );
    expect(
      typeof audit!.details === "string"
        ? JSON.parse(audit!.details)
        : audit!.details,
    ).toMatchObject({ storedIdentical: true });
  });

  test("first uploads to neighbouring samples at the same moment do not deadlock, and each sample numbers from 1", async () => {
    // Under REPEATABLE READ the "next number" reads of empty samples took the same index gap and deadlocked.
    const ids = [];
    for (let k = 0; k < 4; k++) ids.push(await newSample(`Parallel ${k}`));
    const revisions = await Promise.all(
      ids.map(async (id) => (await templateRevision(id)).revision),
    );
    const stored = await Promise.all(
      revisions.flatMap((r) => [storeDraftRevision(r), storeDraftRevision(r)]),
    );
    for (let k = 0; k < ids.length; k++) {
      expect([stored[2 * k]!.number, stored[2 * k + 1]!.number].sort()).toEqual(
        [1, 2],
      );
    }
  });
});

async function draftWith(
  sampleId: number,
  findings: { severity: "error" | "warning" | "info" }[],
) {
  const { revision } = await templateRevision(sampleId);
  const report = revision.qcReport as StoredQcReport;
  const withFindings = {
    ...report,
    findings: findings.map((f, i) => ({
      code: "OUTLIER" as const,
      severity: f.severity,
      message: `finding ${i}`,
      cells: [],
    })),
  };
  return storeDraftRevision({ ...revision, qcReport: withFindings });
}

describe("review", () => {
  // These tests are about the QC rules; uploader and reviewer are often the same person, so four-eyes is off.
  beforeAll(async () => {
    await setFourEyesMode({ mode: "off", userId: labLeadId });
  });
  afterAll(async () => {
    await setFourEyesMode({ mode: "auto", userId: labLeadId });
  });

  test("errors block approval, warnings need acknowledging, the previous approved revision is superseded", async () => {
    const sampleId = await newSample("Reviewed");
    const base = {
      sampleId,
      reviewerId: labLeadId,
      comment: null,
      acknowledgedWarnings: false,
    };
    const clean = await draftWith(sampleId, []);
    expect(
      await reviewRevision({
        ...base,
        number: clean.number,
        decision: "approve",
      }),
    ).toMatchObject({
      ok: true,
      previousApproved: null,
      ownUpload: true,
    });

    const bad = await draftWith(sampleId, [
      { severity: "error" },
      { severity: "warning" },
    ]);
    expect(
      await reviewRevision({
        ...base,
        number: bad.number,
        decision: "approve",
        acknowledgedWarnings: true,
      }),
    ).toEqual({
      ok: false,
      reason: "qc_errors",
    });

    const warned = await draftWith(sampleId, [
      { severity: "warning" },
      { severity: "info" },
    ]);
    expect(
      await reviewRevision({
        ...base,
        number: warned.number,
        decision: "approve",
      }),
    ).toEqual({
      ok: false,
      reason: "warnings_not_acknowledged",
    });
    const approved = await reviewRevision({
      ...base,
      reviewerId: otherLeadId,
      number: warned.number,
      decision: "approve",
      acknowledgedWarnings: true,
      comment: "Checked the outlier against the report.",
    });
    expect(approved).toMatchObject({
      ok: true,
      previousApproved: clean.number,
      ownUpload: false,
    });

    const rejected = await reviewRevision({
      ...base,
      number: bad.number,
      decision: "reject",
      comment: "Transcription errors.",
    });
    expect(rejected).toMatchObject({ ok: true });
    expect(
      await reviewRevision({
        ...base,
        number: bad.number,
        decision: "approve",
      }),
    ).toEqual({
      ok: false,
      reason: "not_draft",
      status: "rejected",
    });

    const list = await listRevisionsOfSample(sampleId);
    expect(
      list.map((r) => [r.number, r.status, r.uploaderName, r.reviewerName]),
    ).toEqual([
      [3, "approved", "Lead One", "Lead Two"],
      [2, "rejected", "Lead One", "Lead One"],
      [1, "superseded", "Lead One", "Lead One"],
    ]);
    expect((await getCurrentApprovedRevision(sampleId))?.number).toBe(3);
    const audits = await sql<{ action: string; details: unknown }>(
      "SELECT action, details FROM audit_log WHERE action IN ('revision_approved','revision_rejected') AND JSON_VALUE(details, '$.sampleId') = ? ORDER BY id",
      [sampleId],
    );
    expect(audits.map((a) => a.action)).toEqual([
      "revision_approved",
      "revision_approved",
      "revision_rejected",
    ]);
    const details = audits[1]!.details;
    expect(
      typeof details === "string" ? JSON.parse(details) : details,
    ).toMatchObject({
      number: 3,
      superseded: 1,
      ownUpload: false,
      acknowledgedWarnings: true,
    });
  });

  test("two reviewers approving two drafts at once leave exactly one approved revision", async () => {
    const sampleId = await newSample("Race");
    const a = await draftWith(sampleId, []);
    const b = await draftWith(sampleId, []);
    const base = {
      sampleId,
      comment: null,
      acknowledgedWarnings: false,
      decision: "approve" as const,
    };
    await Promise.all([
      reviewRevision({
        ...base,
        number: a.number,
        reviewerId: labLeadId,
      }),
      reviewRevision({
        ...base,
        number: b.number,
        reviewerId: otherLeadId,
      }),
    ]);
    const statuses = await sql<{ status: string }>(
      "SELECT status FROM sample_revisions WHERE sample_id = ?",
      [sampleId],
    );
    expect(statuses.filter((s) => s.status === "approved")).toHaveLength(1);
    expect(statuses.filter((s) => s.status === "superseded")).toHaveLength(1);
  });
});

describe("four-eyes approval (lab policy)", () => {
  const approve = (sampleId: number, number: number, reviewerId: number) =>
    reviewRevision({
      sampleId,
      number,
      reviewerId,
      decision: "approve",
      comment: null,
      acknowledgedWarnings: false,
    });

  test("by default it is on with two active lab leads and off with one; disabled accounts are not counted", async () => {
    expect(await getFourEyesPolicy()).toEqual({
      mode: "auto",
      activeLabLeads: 2,
      required: true,
    });
    await setUserDisabled(otherLeadId, true);
    try {
      expect(await getFourEyesPolicy()).toEqual({
        mode: "auto",
        activeLabLeads: 1,
        required: false,
      });
      // With one lab lead, the default lets the uploader approve.
      const sampleId = await newSample("Four eyes, one lead");
      const own = await draftWith(sampleId, []);
      expect(await approve(sampleId, own.number, labLeadId)).toMatchObject({
        ok: true,
        ownUpload: true,
      });
    } finally {
      await setUserDisabled(otherLeadId, false);
    }
  });

  test("while on, the uploader's own approval is refused and changes nothing; someone else approves; rejecting one's own stays allowed", async () => {
    const sampleId = await newSample("Four eyes");
    const own = await draftWith(sampleId, []);
    const auditsBefore = await sql<{ n: number }>(
      "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'revision_approved'",
    );
    expect(await approve(sampleId, own.number, labLeadId)).toEqual({
      ok: false,
      reason: "own_upload",
    });
    expect((await getRevisionDetail(sampleId, own.number))?.status).toBe(
      "draft",
    );
    const auditsAfter = await sql<{ n: number }>(
      "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'revision_approved'",
    );
    expect(Number(auditsAfter[0]!.n)).toBe(Number(auditsBefore[0]!.n));

    expect(await approve(sampleId, own.number, otherLeadId)).toMatchObject({
      ok: true,
      ownUpload: false,
    });
    const detail = await getRevisionDetail(sampleId, own.number);
    expect(detail).toMatchObject({
      status: "approved",
      uploaderName: "Lead One",
      reviewerName: "Lead Two",
    });
    expect(detail?.reviewedAt).toBeInstanceOf(Date);
    const [audit] = await sql<{ details: unknown }>(
      "SELECT details FROM audit_log WHERE action = 'revision_approved' AND JSON_VALUE(details, '$.sampleId') = ?",
      [sampleId],
    );
    const details =
      typeof audit!.details === "string"
        ? JSON.parse(audit!.details)
        : audit!.details;
    expect(details).toMatchObject({ ownUpload: false, fourEyes: true });

    const second = await draftWith(sampleId, []);
    expect(
      await reviewRevision({
        sampleId,
        number: second.number,
        reviewerId: labLeadId,
        decision: "reject",
        comment: "Withdrawn.",
        acknowledgedWarnings: false,
      }),
    ).toMatchObject({ ok: true });
  });

  test("an administrator turns it on or off; each change is audited with before and after, a non-change is not", async () => {
    const sampleId = await newSample("Four eyes, set");
    const count = async () =>
      Number(
        (
          await sql<{ n: number }>(
            "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'setting_changed'",
          )
        )[0]!.n,
      );
    const before = await count();
    expect(
      await setFourEyesMode({
        mode: "off",
        userId: viewerId,
        ipAddress: "192.0.2.7",
      }),
    ).toEqual({ changed: true, from: "auto", to: "off" });
    const draft = await draftWith(sampleId, []);
    expect(await approve(sampleId, draft.number, labLeadId)).toMatchObject({
      ok: true,
      ownUpload: true,
    });

    expect(await setFourEyesMode({ mode: "on", userId: viewerId })).toEqual({
      changed: true,
      from: "off",
      to: "on",
    });
    expect(await setFourEyesMode({ mode: "on", userId: viewerId })).toEqual({
      changed: false,
      from: "on",
      to: "on",
    });
    await setUserDisabled(otherLeadId, true);
    try {
      // "on" holds with a single lab lead.
      const next = await draftWith(sampleId, []);
      expect(await approve(sampleId, next.number, labLeadId)).toEqual({
        ok: false,
        reason: "own_upload",
      });
    } finally {
      await setUserDisabled(otherLeadId, false);
    }
    expect(await setFourEyesMode({ mode: "auto", userId: viewerId })).toEqual({
      changed: true,
      from: "on",
      to: "auto",
    });
    expect(await count()).toBe(before + 3);
    const rows = await sql<{
      user_id: number;
      entity_id: string;
      details: unknown;
      ip_address: string | null;
    }>(
      "SELECT user_id, entity_id, details, ip_address FROM audit_log WHERE action = 'setting_changed' ORDER BY id DESC LIMIT 3",
    );
    const parsed = rows.map((r) => ({
      ...r,
      details:
        typeof r.details === "string" ? JSON.parse(r.details) : r.details,
    }));
    expect(parsed.map((r) => r.details)).toEqual([
      { key: "four_eyes_approval", from: "on", to: "auto" },
      { key: "four_eyes_approval", from: "off", to: "on" },
      { key: "four_eyes_approval", from: "auto", to: "off" },
    ]);
    expect(parsed[2]).toMatchObject({
      user_id: viewerId,
      entity_id: "four_eyes_approval",
      ip_address: "192.0.2.7",
    });
  });
});

describe("follows and diff", () => {
  test("follow is idempotent; followers are listed; unfollow removes", async () => {
    const sampleId = await newSample("Followed");
    await followSample(sampleId, viewerId);
    await followSample(sampleId, viewerId);
    await followSample(sampleId, otherLeadId);
    expect(await isFollowing(sampleId, viewerId)).toBe(true);
    expect((await listActiveFollowers(sampleId)).map((f) => f.email)).toEqual([
      "lead2@example.test",
      "viewer@example.test",
    ]);
    await unfollowSample(sampleId, viewerId);
    expect(await isFollowing(sampleId, viewerId)).toBe(false);
    expect(await countFollowers(sampleId)).toBe(1);
  });

  test("the diff lists changed, added and removed cells", async () => {
    const sampleId = await newSample("Diffed");
    const { revision } = await templateRevision(sampleId);
    await storeDraftRevision(revision);
    const bo = revision.grids.find((g) => g.property === "oil_fvf")!;
    const changedBo = {
      ...bo,
      values: bo.values.map((row, i) =>
        row.map((v, j) => (i === 0 && j === 0 && v !== null ? v + 0.01 : v)),
      ),
    };
    const withoutZ = revision.grids.filter(
      (g) => g.property !== "z_factor" && g.property !== "oil_fvf",
    );
    const gor = revision.grids.find((g) => g.property === "solution_gor")!;
    const extraRow = {
      ...gor,
      pressures: [...gor.pressures, 6000],
      values: [...gor.values, gor.values[gor.values.length - 1]!],
    };
    await storeDraftRevision({
      ...revision,
      grids: [
        ...withoutZ.filter((g) => g.property !== "solution_gor"),
        changedBo,
        extraRow,
      ],
    });
    const pair = await getRevisionsForDiff(sampleId, 1, 2);
    const diff = diffRevisions(pair.from!, pair.to!);
    expect(diff.changed).toHaveLength(1);
    expect(diff.changed[0]).toMatchObject({
      property: "oil_fvf",
      pressurePsia: bo.pressures[0],
      temperatureF: bo.temperatures[0],
    });
    expect(diff.changed[0]!.to! - diff.changed[0]!.from!).toBeCloseTo(0.01, 12);
    expect(diff.added.map((c) => [c.property, c.pressurePsia])).toEqual(
      gor.temperatures.map(() => ["solution_gor", 6000]),
    );
    const zCells = revision.grids
      .find((g) => g.property === "z_factor")!
      .values.flat()
      .filter((v) => v !== null).length;
    expect(diff.removed).toHaveLength(zCells);
    expect(
      diff.removed.every((c) => c.property === "z_factor" && c.to === null),
    ).toBe(true);
    expect((await getRevisionsForDiff(sampleId, 1, 9)).to).toBeNull();
  });
});
