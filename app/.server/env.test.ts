import { expect, test } from "vitest";
import { EnvError, parseEnv } from "./env";

const PRODUCTION_OK = {
  NODE_ENV: "production",
  DATABASE_URL: "mysql://u:p@127.0.0.1:3316/isopleth",
  SESSION_SECRET: "s".repeat(40),
  API_TOKEN_SECRET: "t".repeat(40),
  APP_BASE_URL: "https://isopleth.example.com/",
};

test("development gets safe defaults: loopback host, port 3000, a local database URL", () => {
  const env = parseEnv({});
  expect(env.NODE_ENV).toBe("development");
  expect(env.HOST).toBe("127.0.0.1");
  expect(env.PORT).toBe(3000);
  expect(env.APP_BASE_URL).toBe("http://127.0.0.1:3000");
  expect(env.DATABASE_URL).toMatch(/^mysql:\/\/.*@127\.0\.0\.1:3316\//);
  expect(env.SMTP_SECURE).toBe(false);
});

test("production with every required value parses; the base URL loses its trailing slash", () => {
  const env = parseEnv(PRODUCTION_OK);
  expect(env.APP_BASE_URL).toBe("https://isopleth.example.com");
  expect(env.SESSION_SECRET).toBe("s".repeat(40));
});

test.each([
  "DATABASE_URL",
  "SESSION_SECRET",
  "API_TOKEN_SECRET",
  "APP_BASE_URL",
] as const)(
  "production without %s fails with a message naming the variable",
  (key) => {
    const source: Record<string, string | undefined> = {
      ...PRODUCTION_OK,
      [key]: undefined,
    };
    expect(() => parseEnv(source)).toThrow(EnvError);
    expect(() => parseEnv(source)).toThrow(
      new RegExp(`${key}: is required when NODE_ENV=production`),
    );
  },
);

test("bad values are reported by name: port out of range, short secret, non-MySQL URL", () => {
  try {
    parseEnv({
      PORT: "70000",
      SESSION_SECRET: "short",
      DATABASE_URL: "postgres://x",
    });
    expect.unreachable("parseEnv should have thrown");
  } catch (error) {
    expect(error).toBeInstanceOf(EnvError);
    const problems = (error as EnvError).problems.join("\n");
    expect(problems).toMatch(/^PORT:/m);
    expect(problems).toMatch(
      /^SESSION_SECRET: must be at least 32 characters/m,
    );
    expect(problems).toMatch(/^DATABASE_URL: must be a mysql:\/\/ URL/m);
  }
});

test("empty strings count as unset", () => {
  expect(parseEnv({ PORT: "", HOST: "" }).PORT).toBe(3000);
});

test("production: a missing secret is named even when another variable is also bad", () => {
  let problems: string[] = [];
  try {
    parseEnv({
      NODE_ENV: "production",
      DATABASE_URL: "mysql://u:p@127.0.0.1:3316/x",
      APP_BASE_URL: "https://isopleth.example",
      API_TOKEN_SECRET: "short",
      DATABASE_POOL_SIZE: "zero",
    });
  } catch (error) {
    problems = (error as EnvError).problems;
  }
  expect(problems.map((p) => p.split(":")[0]).sort()).toEqual([
    "API_TOKEN_SECRET",
    "DATABASE_POOL_SIZE",
    "SESSION_SECRET",
  ]);
});
