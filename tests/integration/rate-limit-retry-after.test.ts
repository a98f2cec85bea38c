import { randomUUID } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { errorResponse } from "@/lib/server/http";
import { consumeAttempt } from "@/lib/server/rate-limit";

afterAll(async () => {
  await dbClient().sql.end();
});

describe("a refused attempt says when to come back", () => {
  it("answers 429 with Retry-After: the seconds left in the limiter's window (RFC 9110 §10.2.3)", async () => {
    const limit = { bucket: `retry-after:${randomUUID()}`, limit: 1, windowSeconds: 600 };
    await consumeAttempt(limit, "sign-in");
    const refused = await consumeAttempt(limit, "sign-in").catch((e: unknown) => e);
    const response = errorResponse(refused);
    expect(response.status).toBe(429);
    expect(((await response.json()) as { error: { code: string } }).error.code).toBe("rate_limited:sign-in");
    const seconds = Number(response.headers.get("Retry-After"));
    // Fixed windows start on multiples of 600 s, so what is left lies in [1, 600].
    expect(Number.isInteger(seconds)).toBe(true);
    expect(seconds).toBeGreaterThanOrEqual(1);
    expect(seconds).toBeLessThanOrEqual(600);
  });

  it("sets no Retry-After on other errors", async () => {
    const { AppError } = await import("@/lib/errors");
    expect(errorResponse(new AppError("forbidden:target", "No.")).headers.get("Retry-After")).toBeNull();
  });
});
