import { describe, expect, it } from "vitest";
import { EnvError, parseProxyEnv, parseServerEnv } from "@/lib/env";

const valid = { DATABASE_URL: "postgres://arc:pw@127.0.0.1:54329/arcwright" };

describe("parseServerEnv", () => {
  it("accepts a postgres URL and fills the documented defaults", () => {
    const env = parseServerEnv(valid);
    expect(env.DATABASE_URL).toBe(valid.DATABASE_URL);
    expect(env.NODE_ENV).toBe("development");
    expect(env.DATABASE_POOL_MAX).toBe(10);
    expect(env.DATABASE_TIMEOUT_SECONDS).toBe(4);
  });

  it("coerces numeric settings from their string form, keeping 0-free bounds", () => {
    const env = parseServerEnv({ ...valid, DATABASE_POOL_MAX: "3", DATABASE_TIMEOUT_SECONDS: "2.5" });
    expect(env.DATABASE_POOL_MAX).toBe(3);
    expect(env.DATABASE_TIMEOUT_SECONDS).toBe(2.5);
  });

  it("names the variable when DATABASE_URL is missing", () => {
    expect(() => parseServerEnv({})).toThrow(EnvError);
    expect(() => parseServerEnv({})).toThrow(/DATABASE_URL/);
  });

  it("rejects a URL of another scheme, naming the variable", () => {
    expect(() => parseServerEnv({ DATABASE_URL: "mysql://x@y/z" })).toThrow(/DATABASE_URL: .*postgres/);
  });

  it("rejects a pool size of 0 and an unknown NODE_ENV, naming both", () => {
    try {
      parseServerEnv({ ...valid, DATABASE_POOL_MAX: "0", NODE_ENV: "staging" });
      expect.unreachable("parseServerEnv accepted a pool of 0");
    } catch (error) {
      expect(error).toBeInstanceOf(EnvError);
      const variables = (error as EnvError).issues.map((i) => i.variable).sort();
      expect(variables).toEqual(["DATABASE_POOL_MAX", "NODE_ENV"]);
    }
  });
});

describe("parseProxyEnv", () => {
  it("needs none of the database's settings: an empty environment gives the documented defaults", () => {
    const env = parseProxyEnv({});
    expect(env).toEqual({ NODE_ENV: "development", NEXTAUTH_URL: "http://127.0.0.1:3000" });
  });

  it("ignores the settings it does not read, even invalid ones", () => {
    const env = parseProxyEnv({ DATABASE_URL: "mysql://x@y/z", DATABASE_POOL_MAX: "0", UPLOADTHING_UFS_HOST: "localhost:9100" });
    expect(env.UPLOADTHING_UFS_HOST).toBe("localhost:9100");
    expect(env).not.toHaveProperty("DATABASE_URL");
  });

  it("refuses a bad value of its own settings with the server's rule, naming the variable", () => {
    try {
      parseProxyEnv({ NEXTAUTH_URL: "example.org", UPLOADTHING_UFS_HOST: "http://localhost:9100" });
      expect.unreachable("parseProxyEnv accepted a relative NEXTAUTH_URL");
    } catch (error) {
      expect(error).toBeInstanceOf(EnvError);
      expect((error as EnvError).issues.map((i) => i.variable).sort()).toEqual(["NEXTAUTH_URL", "UPLOADTHING_UFS_HOST"]);
    }
  });
});
