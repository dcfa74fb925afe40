// The layering map: what each folder under app/ may import, checked on every import of every file.
// Imports are read with the TypeScript compiler's parser (multi-line imports, `import type`, `export … from`,
// dynamic `import()` and `typeof import()` types), and `~/` and relative paths are resolved to files. A folder
// under app/ without a row fails, so a new folder gets its rule when it is made. DEVELOPERS.md shows the same
// table ("Layering"); a test below keeps the two equal.
import { builtinModules } from "node:module";
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import { dirname, join, normalize } from "node:path";
import { fileURLToPath } from "node:url";
import ts from "typescript";
import { describe, expect, test } from "vitest";

const ROOT = normalize(join(dirname(fileURLToPath(import.meta.url)), "../.."));

// ---------------------------------------------------------------------------------------------------------
// The table

/**
 * app/core in its dependency order: each library may import only the libraries listed before it, and only
 * those named in `uses`. So the order is the list order, and a cycle between libraries cannot be written down.
 */
const CORE_ORDER: { lib: string; uses: string[]; packages?: string[] }[] = [
  { lib: "format", uses: [] },
  { lib: "units", uses: ["format"] },
  { lib: "csv", uses: [] },
  { lib: "interpolation", uses: ["format"] },
  { lib: "properties", uses: ["format", "units"] },
  { lib: "lookup", uses: ["format", "interpolation", "units"] },
  {
    lib: "lab-data",
    uses: ["format", "units", "properties", "csv"],
    packages: ["csv-parse", "exceljs"],
  },
  {
    lib: "tables",
    uses: ["format", "units", "csv", "interpolation", "lookup"],
  },
];
const CORE = CORE_ORDER.map((c) => `core/${c.lib}`);
const expand = (names: string[]) =>
  names.flatMap((n) => (n === "core/*" ? CORE : [n]));

/** Packages only the server may load: the browser layers (utils, components) never import them. */
const SERVER_ONLY_PACKAGES = [
  "@node-rs/argon2",
  "@react-router/express",
  "@react-router/node",
  "compression",
  "drizzle-orm",
  "express",
  "helmet",
  "jsonwebtoken",
  "mysql2",
  "nodemailer",
  "piscina",
  "pino",
  "prom-client",
];
/** Packages only tests and test helpers may import (so a published app/core would not ship them). */
const TEST_ONLY_PACKAGES = ["vitest", "fast-check"];

type Packages =
  | { kind: "any" }
  | { kind: "only"; names: string[] }
  | { kind: "browser" } // no node built-ins, nothing from SERVER_ONLY_PACKAGES
  | { kind: "no-database" }; // no drizzle-orm or mysql2: data goes through the queries

type Layer = {
  /** Name used in messages and in `may`. */
  name: string;
  /** Folders (files directly inside) or `folder/**` (the folder and everything below it), or single files. */
  paths: string[];
  holds: string;
  /** Layers whose modules it may import, values and types (its own layer always; `core/*`: every core library). */
  may: string[];
  /** Layers it may import types from only (`import type`, erased at build time). */
  typesFrom?: string[];
  packages: Packages;
  /** Only relative imports (drizzle-kit loads the schema outside Vite and cannot resolve `~/`). */
  relativeOnly?: boolean;
};

const LAYERS: Layer[] = [
  ...CORE_ORDER.map((c): Layer => ({
    name: `core/${c.lib}`,
    paths: [`app/core/${c.lib}/**`],
    holds: "pure computation library (no framework, I/O or environment)",
    may: c.uses.map((u) => `core/${u}`),
    packages: { kind: "only", names: c.packages ?? [] },
  })),
  {
    name: "utils",
    paths: ["app/utils/**"],
    holds: "small client-safe helpers shared by server and browser",
    may: ["core/*"],
    packages: { kind: "browser" },
  },
  {
    name: "components",
    paths: ["app/components/**"],
    holds: "React components and hooks",
    may: ["utils", "core/*"],
    packages: { kind: "browser" },
  },
  {
    name: ".server/db/schema",
    paths: ["app/.server/db/schema"],
    holds: "Drizzle tables and row types",
    // the enums' values come from their one declaration (roles, scopes, property keys, unit systems)
    may: ["utils", "core/units"],
    packages: { kind: "only", names: ["drizzle-orm"] },
    relativeOnly: true,
  },
  {
    name: ".server/db/client",
    paths: ["app/.server/db/client.ts"],
    holds: "the mysql2 pool and Drizzle instance",
    may: [".server/db/schema", ".server"],
    packages: { kind: "any" },
  },
  {
    name: ".server/db/queries",
    paths: ["app/.server/db/queries"],
    holds: "named query functions, one file per entity",
    may: [".server/db/client", ".server/db/schema", "utils", "core/*"],
    packages: { kind: "only", names: ["drizzle-orm"] },
  },
  {
    name: ".server",
    paths: [
      "app/.server",
      "app/.server/api",
      "app/.server/auth",
      "app/.server/db",
      "app/.server/email/**",
      "app/.server/lookup",
      "app/.server/ops",
      "app/.server/samples",
      "app/.server/workers",
    ],
    holds:
      "server-only services: env, auth, API, e-mail, operations, samples, workers, seed",
    may: [
      ".server/db/client",
      ".server/db/schema",
      ".server/db/queries",
      "utils",
      "core/*",
    ],
    typesFrom: ["components"],
    packages: { kind: "any" },
  },
  {
    name: "routes",
    paths: ["app/routes/**"],
    holds: "route modules: guard, parse, call, return",
    may: [".server", ".server/db/queries", "components", "utils", "core/*"],
    packages: { kind: "no-database" },
  },
  {
    name: "app",
    paths: ["app"],
    holds: "root.tsx, entry.server.tsx, routes.ts, app.css",
    may: [
      "routes",
      ".server",
      ".server/db/client",
      ".server/db/queries",
      "components",
      "utils",
      "core/*",
    ],
    packages: { kind: "any" },
  },
];

/** Outside app/: only tests and test helpers may import these. */
const TEST_SOURCES = ["reference-data", "tests/support"];

/**
 * Imports that break the table today, each with the reason. The test fails for a violation not listed here
 * and for an entry that is no longer needed, so the list can only shrink. Goal: empty.
 */
const KNOWN_VIOLATIONS: { from: string; to: string; why: string }[] = [];

// ---------------------------------------------------------------------------------------------------------
// Reading imports

type ImportRef = {
  specifier: string;
  typeOnly: boolean;
  kind: "import" | "export" | "dynamic" | "type-import" | "require";
  line: number;
};

/** Every module reference in a source file, with whether it is erased at build time. */
function importsOf(fileName: string, text: string): ImportRef[] {
  const source = ts.createSourceFile(
    fileName,
    text,
    ts.ScriptTarget.Latest,
    true,
    fileName.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS,
  );
  const out: ImportRef[] = [];
  const add = (
    node: ts.Node,
    specifier: string,
    typeOnly: boolean,
    kind: ImportRef["kind"],
  ) =>
    out.push({
      specifier,
      typeOnly,
      kind,
      line:
        source.getLineAndCharacterOfPosition(node.getStart(source)).line + 1,
    });
  const visit = (node: ts.Node): void => {
    if (
      ts.isImportDeclaration(node) &&
      ts.isStringLiteral(node.moduleSpecifier)
    ) {
      const clause = node.importClause;
      const bindings = clause?.namedBindings;
      const typeOnly =
        clause !== undefined &&
        (clause.isTypeOnly ||
          (clause.name === undefined &&
            bindings !== undefined &&
            ts.isNamedImports(bindings) &&
            bindings.elements.length > 0 &&
            bindings.elements.every((e) => e.isTypeOnly)));
      add(node, node.moduleSpecifier.text, typeOnly, "import");
    } else if (
      ts.isExportDeclaration(node) &&
      node.moduleSpecifier !== undefined &&
      ts.isStringLiteral(node.moduleSpecifier)
    ) {
      const clause = node.exportClause;
      const typeOnly =
        node.isTypeOnly ||
        (clause !== undefined &&
          ts.isNamedExports(clause) &&
          clause.elements.length > 0 &&
          clause.elements.every((e) => e.isTypeOnly));
      add(node, node.moduleSpecifier.text, typeOnly, "export");
    } else if (
      ts.isImportEqualsDeclaration(node) &&
      ts.isExternalModuleReference(node.moduleReference) &&
      ts.isStringLiteral(node.moduleReference.expression)
    ) {
      add(
        node,
        node.moduleReference.expression.text,
        node.isTypeOnly,
        "require",
      );
    } else if (ts.isCallExpression(node)) {
      const [arg] = node.arguments;
      const isImport = node.expression.kind === ts.SyntaxKind.ImportKeyword;
      const isRequire =
        ts.isIdentifier(node.expression) && node.expression.text === "require";
      if ((isImport || isRequire) && arg !== undefined) {
        // a computed specifier cannot be checked: report it so that it fails rather than slips through
        const specifier = ts.isStringLiteralLike(arg)
          ? arg.text
          : `<computed: ${arg.getText(source)}>`;
        add(node, specifier, false, isImport ? "dynamic" : "require");
      }
    } else if (
      ts.isImportTypeNode(node) &&
      ts.isLiteralTypeNode(node.argument) &&
      ts.isStringLiteral(node.argument.literal)
    ) {
      add(node, node.argument.literal.text, true, "type-import");
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return out;
}

/** Whether the file reads `process` (environment, argv, exit…), which app/core must not. */
function readsProcess(fileName: string, text: string): boolean {
  const source = ts.createSourceFile(
    fileName,
    text,
    ts.ScriptTarget.Latest,
    true,
  );
  let found = false;
  const visit = (node: ts.Node): void => {
    if (
      ts.isIdentifier(node) &&
      node.text === "process" &&
      !(ts.isPropertyAccessExpression(node.parent) && node.parent.name === node)
    )
      found = true;
    if (!found) ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

// ---------------------------------------------------------------------------------------------------------
// Resolving and classifying

const isTestFile = (file: string) => /\.test\.tsx?$/.test(file);
const isTestHelper = (file: string) =>
  /\.test-helpers\.tsx?$/.test(file) || /(^|\/)test-support\//.test(file);
const isTestCode = (file: string) => isTestFile(file) || isTestHelper(file);

type Target =
  | { kind: "file"; path: string }
  | { kind: "package"; name: string }
  | { kind: "builtin"; name: string }
  | { kind: "generated" }
  | { kind: "unresolved"; why: string };

const BUILTINS = new Set(builtinModules);

function packageName(specifier: string): string {
  const parts = specifier.split("/");
  return specifier.startsWith("@") ? parts.slice(0, 2).join("/") : parts[0]!;
}

/** Where a specifier seen from `from` (a path relative to the repository) lands. */
function resolve(from: string, specifier: string): Target {
  if (specifier.startsWith("<computed"))
    return { kind: "unresolved", why: specifier };
  const bare = specifier.replace(/\?.*$/, "");
  if (bare.startsWith("node:") || BUILTINS.has(bare.split("/")[0]!))
    return { kind: "builtin", name: bare };
  let base: string;
  if (bare.startsWith("~/")) base = join("app", bare.slice(2));
  else if (
    bare.startsWith("./") ||
    bare.startsWith("../") ||
    bare === "." ||
    bare === ".."
  )
    base = normalize(join(dirname(from), bare));
  else return { kind: "package", name: packageName(bare) };
  // React Router's generated route types (.react-router/types, through tsconfig's rootDirs)
  if (/(^|\/)\+types\//.test(bare)) return { kind: "generated" };
  for (const candidate of [
    base,
    `${base}.ts`,
    `${base}.tsx`,
    `${base}/index.ts`,
    `${base}/index.tsx`,
  ]) {
    const abs = join(ROOT, candidate);
    if (existsSync(abs) && statSync(abs).isFile())
      return { kind: "file", path: candidate };
  }
  return { kind: "unresolved", why: `${specifier} (no file at ${base})` };
}

function matches(pattern: string, path: string): "file" | "folder" | null {
  if (pattern.endsWith("/**")) {
    const folder = pattern.slice(0, -3);
    return path === folder || path.startsWith(`${folder}/`) ? "folder" : null;
  }
  return path === pattern
    ? /\.tsx?$/.test(pattern)
      ? "file"
      : "folder"
    : null;
}

/** The layer of a file under app/ (a single-file row wins over its folder's row), or null. */
function layerOfFile(file: string): Layer | null {
  const exact = LAYERS.find((l) =>
    l.paths.some((p) => matches(p, file) === "file"),
  );
  if (exact) return exact;
  const folder = dirname(file);
  return (
    LAYERS.find((l) => l.paths.some((p) => matches(p, folder) === "folder")) ??
    null
  );
}

/** Layers whose rows cover a folder (exactly one is right). */
function layersOfFolder(folder: string): Layer[] {
  return LAYERS.filter((l) =>
    l.paths.some((p) => matches(p, folder) === "folder"),
  );
}

function walk(
  dir: string,
  files: string[] = [],
  dirs: string[] = [],
): { files: string[]; dirs: string[] } {
  dirs.push(dir);
  for (const entry of readdirSync(join(ROOT, dir), { withFileTypes: true })) {
    const path = `${dir}/${entry.name}`;
    if (entry.isDirectory()) walk(path, files, dirs);
    else files.push(path);
  }
  return { files, dirs };
}

// ---------------------------------------------------------------------------------------------------------
// Checking

type Violation = { from: string; to: string; line: number; rule: string };

function packageAllowed(rule: Packages, name: string): boolean {
  switch (rule.kind) {
    case "any":
      return true;
    case "only":
      return rule.names.includes(name);
    case "browser":
      return !SERVER_ONLY_PACKAGES.includes(name);
    case "no-database":
      return name !== "drizzle-orm" && name !== "mysql2";
  }
}

/** The violations of one file's imports against the table. */
function checkFile(file: string, refs: ImportRef[]): Violation[] {
  const layer = layerOfFile(file);
  if (!layer)
    return [
      {
        from: file,
        to: "-",
        line: 0,
        rule: "no row in the layering table covers this file",
      },
    ];
  const testCode = isTestCode(file);
  const isCore = layer.name.startsWith("core/");
  const out: Violation[] = [];
  for (const ref of refs) {
    const target = resolve(file, ref.specifier);
    const v = (to: string, rule: string) =>
      out.push({ from: file, to, line: ref.line, rule });
    switch (target.kind) {
      case "generated":
        break;
      case "unresolved":
        v(ref.specifier, `cannot be resolved: ${target.why}`);
        break;
      case "builtin":
        if (
          isCore ||
          layer.packages.kind === "browser" ||
          layer.packages.kind === "only"
        )
          v(target.name, `${layer.name} may not import node built-ins`);
        break;
      case "package":
        if (TEST_ONLY_PACKAGES.includes(target.name)) {
          if (!testCode)
            v(
              target.name,
              "only test files and *.test-helpers may import test packages",
            );
        } else if (
          !packageAllowed(layer.packages, target.name) &&
          !(testCode && target.name === "csv-parse")
        )
          v(
            target.name,
            `${layer.name} may not import the package ${target.name}`,
          );
        break;
      case "file": {
        const to = target.path;
        if (layer.relativeOnly && ref.specifier.startsWith("~/"))
          v(
            to,
            `${layer.name} imports only relative paths (drizzle-kit cannot resolve ~/)`,
          );
        if (isTestHelper(to) && !testCode) {
          v(to, "only tests and test helpers may import a test helper");
          break;
        }
        if (isTestFile(to)) {
          v(to, "nothing imports a test file");
          break;
        }
        if (!to.startsWith("app/")) {
          if (!(testCode && TEST_SOURCES.some((s) => to.startsWith(`${s}/`))))
            v(
              to,
              `${layer.name} may not import from outside app/ (tests may read ${TEST_SOURCES.join(", ")})`,
            );
          break;
        }
        const targetLayer = layerOfFile(to);
        if (!targetLayer) {
          v(to, "the imported file has no row in the layering table");
          break;
        }
        if (targetLayer === layer) break;
        if (expand(layer.may).includes(targetLayer.name)) break;
        if (ref.typeOnly && layer.typesFrom?.includes(targetLayer.name)) break;
        // tests in app/core may combine the libraries (they are not shipped)
        if (testCode && isCore && targetLayer.name.startsWith("core/")) break;
        v(
          to,
          `${layer.name} may not import ${targetLayer.name}${layer.typesFrom?.includes(targetLayer.name) ? " (types only)" : ""}`,
        );
      }
    }
  }
  return out;
}

/** Strongly connected components with more than one file (Tarjan). */
function cycles(edges: Map<string, Set<string>>): string[][] {
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const found: string[][] = [];
  let counter = 0;
  const connect = (v: string): void => {
    index.set(v, counter);
    low.set(v, counter++);
    stack.push(v);
    onStack.add(v);
    for (const w of edges.get(v) ?? []) {
      if (!index.has(w)) {
        connect(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w))
        low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) === index.get(v)) {
      const component: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        component.push(w);
      } while (w !== v);
      if (component.length > 1) found.push(component.sort());
    }
  };
  for (const v of edges.keys()) if (!index.has(v)) connect(v);
  return found;
}

// ---------------------------------------------------------------------------------------------------------
// The tree

const { files: ALL_FILES, dirs: ALL_DIRS } = walk("app");
const SOURCES = ALL_FILES.filter((f) => /\.tsx?$/.test(f));
const IMPORTS = new Map(
  SOURCES.map((f) => [f, importsOf(f, readFileSync(join(ROOT, f), "utf8"))]),
);
const key = (v: { from: string; to: string }) => `${v.from} → ${v.to}`;

describe("the layering table", () => {
  test("every folder under app/ that holds files has exactly one row", () => {
    // (app/core holds only folders; a file put there directly fails below, as a file without a row)
    const withFiles = new Set(ALL_FILES.map((f) => dirname(f)));
    const problems = ALL_DIRS.filter((d) => withFiles.has(d))
      .map((d) => [d, layersOfFolder(d).map((l) => l.name)] as const)
      .filter(([, names]) => names.length !== 1)
      .map(
        ([d, names]) =>
          `${d}: ${names.length === 0 ? "no row" : `rows ${names.join(", ")}`}`,
      );
    expect(problems).toEqual([]);
  });

  test("every row names folders and files that exist", () => {
    const missing = LAYERS.flatMap((l) => l.paths)
      .map((p) => p.replace(/\/\*\*$/, ""))
      .filter((p) => !existsSync(join(ROOT, p)));
    expect(missing).toEqual([]);
  });

  test("app/core is listed in dependency order, every library once, and each folder of app/core has a place", () => {
    const libs = readdirSync(join(ROOT, "app/core"), { withFileTypes: true })
      .filter((e) => e.isDirectory())
      .map((e) => e.name)
      .sort();
    expect(CORE_ORDER.map((c) => c.lib).sort()).toEqual(libs);
    CORE_ORDER.forEach((c, i) => {
      const earlier = CORE_ORDER.slice(0, i).map((e) => e.lib);
      for (const u of c.uses)
        expect(
          earlier,
          `${c.lib} uses ${u}, which must come before it`,
        ).toContain(u);
    });
  });

  test("the rows name only layers that exist", () => {
    const names = new Set(LAYERS.map((l) => l.name));
    for (const l of LAYERS)
      for (const m of expand([...l.may, ...(l.typesFrom ?? [])]))
        expect(names, `${l.name} names ${m}`).toContain(m);
  });
});

describe("imports follow the table", () => {
  const found = SOURCES.flatMap((f) => checkFile(f, IMPORTS.get(f)!));

  test("the tree is read in full", () => {
    // a sanity check that the walk and the parser see the tree: hundreds of files and imports of every kind
    const refs = [...IMPORTS.values()].flat();
    expect(SOURCES.length).toBeGreaterThan(300);
    expect(
      refs.filter((r) => r.kind === "import" && r.typeOnly).length,
    ).toBeGreaterThan(50);
    expect(refs.some((r) => r.kind === "dynamic")).toBe(true);
    expect(refs.some((r) => r.kind === "export")).toBe(true);
  });

  test("no import breaks the table, except the known violations listed in this file", () => {
    const known = new Set(KNOWN_VIOLATIONS.map(key));
    const unexpected = found
      .filter((v) => !known.has(key(v)))
      .map((v) => `${v.from}:${v.line} → ${v.to}: ${v.rule}`);
    expect(unexpected).toEqual([]);
  });

  test("every known violation still happens (remove an entry once it is fixed)", () => {
    const seen = new Set(found.map(key));
    expect(KNOWN_VIOLATIONS.filter((k) => !seen.has(key(k))).map(key)).toEqual(
      [],
    );
  });

  test("app/core reads no environment and has no import cycle between its files", () => {
    const core = SOURCES.filter(
      (f) => f.startsWith("app/core/") && !isTestCode(f),
    );
    expect(
      core.filter((f) => readsProcess(f, readFileSync(join(ROOT, f), "utf8"))),
    ).toEqual([]);
    const edges = new Map<string, Set<string>>();
    for (const f of core) {
      const targets = new Set<string>();
      for (const ref of IMPORTS.get(f)!) {
        const t = resolve(f, ref.specifier);
        if (t.kind === "file" && t.path.startsWith("app/core/"))
          targets.add(t.path);
      }
      edges.set(f, targets);
    }
    expect(cycles(edges)).toEqual([]);
  });
});

describe("the checker itself", () => {
  const text = [
    "import {",
    "  a,",
    "  b,",
    '} from "~/components/x";',
    'import type { T } from "./types";',
    'import { type U, type V } from "~/core/units";',
    'import { type W, X } from "~/core/csv";',
    'export { Y } from "../lookup";',
    'export type { Z } from "../tables";',
    'export * from "./all";',
    'import "./side-effect.css";',
    'const m = await import("exceljs");',
    'type Q = typeof import("react");',
    'const r = require("node:fs");',
    "const d = import(name);",
  ].join("\n");

  test("reads every form of import, and which ones are types only", () => {
    const refs = importsOf("app/core/units/example.ts", text).map((r) => [
      r.specifier,
      r.kind,
      r.typeOnly,
    ]);
    expect(refs).toEqual([
      ["~/components/x", "import", false],
      ["./types", "import", true],
      ["~/core/units", "import", true],
      ["~/core/csv", "import", false],
      ["../lookup", "export", false],
      ["../tables", "export", true],
      ["./all", "export", false],
      ["./side-effect.css", "import", false],
      ["exceljs", "dynamic", false],
      ["react", "type-import", true],
      ["node:fs", "require", false],
      ["<computed: name>", "dynamic", false],
    ]);
  });

  test("reports what a core library may not import", () => {
    const refs = importsOf(
      "app/core/units/example.ts",
      [
        'import { useState } from "react";',
        'import { readFileSync } from "node:fs";',
        'import { getEnv } from "~/.server/env";',
        'import { Button } from "~/components/form";',
        'import { interpolateGrid } from "../interpolation";',
        'import { parseUnitLabel } from "./parse-unit-label";',
        'import fc from "fast-check";',
      ].join("\n"),
    );
    const rules = checkFile("app/core/units/example.ts", refs).map(
      (v) => `${v.to}: ${v.rule}`,
    );
    expect(rules).toEqual([
      "react: core/units may not import the package react",
      "node:fs: core/units may not import node built-ins",
      "app/.server/env.ts: core/units may not import .server",
      "app/components/form.tsx: core/units may not import components",
      "app/core/interpolation/index.ts: core/units may not import core/interpolation",
      "fast-check: only test files and *.test-helpers may import test packages",
    ]);
  });

  test("lets server code import a component's types but not its values, and never the other way", () => {
    const server = checkFile(
      "app/.server/samples/example.ts",
      importsOf(
        "app/.server/samples/example.ts",
        'import type { FieldErrors } from "~/components/form";\nimport { FieldError } from "~/components/form";',
      ),
    );
    expect(server.map((v) => v.rule)).toEqual([
      ".server may not import components (types only)",
    ]);
    const component = checkFile(
      "app/components/example.tsx",
      importsOf(
        "app/components/example.tsx",
        'import type { Env } from "~/.server/env";',
      ),
    );
    expect(component.map((v) => v.rule)).toEqual([
      "components may not import .server",
    ]);
  });

  test("finds a cycle", () => {
    const edges = new Map([
      ["a", new Set(["b"])],
      ["b", new Set(["c"])],
      ["c", new Set(["a"])],
      ["d", new Set(["a"])],
    ]);
    expect(cycles(edges)).toEqual([["a", "b", "c"]]);
  });
});

describe("DEVELOPERS.md", () => {
  test("its layering table is this file's table", () => {
    const text = readFileSync(join(ROOT, "DEVELOPERS.md"), "utf8");
    const section = text.split("<!-- layering-table -->")[1] ?? "";
    const lines = section.split("\n");
    const first = lines.findIndex((line) => line.startsWith("|"));
    const after = lines.findIndex(
      (line, i) => i > first && !line.startsWith("|"),
    );
    const rows = lines
      .slice(first, after)
      .slice(2) // header and rule
      .map((line) =>
        line
          .split("|")
          .slice(1, -1)
          .map((cell) => cell.trim()),
      );
    const cellOf = (names: string[]) =>
      names.map((n) => `\`${n}\``).join(", ") || "—";
    expect(rows).toEqual(
      LAYERS.map((l) => [
        `\`${l.name}\``,
        cellOf(l.paths),
        l.holds,
        cellOf(l.may),
        cellOf(l.typesFrom ?? []),
      ]),
    );
  });
});
