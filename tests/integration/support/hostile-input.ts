import fc from "fast-check";
import { expect } from "vitest";

/**
 * Hostile request parts for the property tests in tests/integration/hostile/: strings, JSON values,
 * bodies bent from an accepted one, query strings and route ids, and the check every answer must
 * pass (never a 5xx; every refusal in the documented error shape, 400s naming their fields).
 */

/** A JSON token written as it stands: numbers `JSON.stringify` cannot write (1e309, -0) or rewrites. */
export class RawJson {
  constructor(readonly text: string) {}
}

/** JSON text of `value`, with `RawJson` leaves written verbatim. */
export function jsonText(value: unknown): string {
  if (value instanceof RawJson) return value.text;
  if (Array.isArray(value)) return `[${value.map(jsonText).join(",")}]`;
  if (value !== null && typeof value === "object") {
    return `{${Object.entries(value).map(([key, item]) => `${JSON.stringify(key)}:${jsonText(item)}`).join(",")}}`;
  }
  return JSON.stringify(value) ?? "null";
}

/** Text an attacker or a careless script sends: SQL, paths, markup, encodings, control characters. */
export const sqlLookingTexts = [
  "'); DROP TABLE targets; --",
  "1 OR 1=1",
  "' OR '1'='1",
  "$1",
  "$1::text; DELETE FROM notes",
  "$$; DROP TABLE proposals; $$",
  "\\",
  "\\'; SELECT pg_sleep(5); --",
  "%_%",
  "E'\\x41'",
  '"; TRUNCATE activity; --',
  "Robert'); DROP TABLE users;--",
];

const pathLookingTexts = ["../../etc/passwd", "..%2F..%2Fetc%2Fpasswd", "....//....//", "%2e%2e%2f", "..\\..\\boot.ini", "/", "%00", "?", "#", "&", "="];

// Unpaired UTF-16 halves, bidi overrides, zero-width and combining characters, astral planes, NUL.
const unicodeTexts = ["\u202eTB-ML", "\u200b", "e\u0301\u0301", "🔭🌌✨", "𝕬𝖗𝖈", "\ud800", "x\udc00", "\uffff", "\u0000", "a\u0000b", "١٢٣", "１２３", "\u2028\u2029", "\t\n\r\v\f", "<script>alert(1)</script>", "${7*7}{{7*7}}"];

const numberLookingTexts = ["NaN", "Infinity", "-Infinity", "1e309", "-1e309", "-0", "0x1F", " 12 ", "", " ", "1,5", "1e-400", "9007199254740993", "+5", ".5", "5.", "0b101", "1_000", "2e3", "-1", "0", "5e-324", "1e-300", "1e300", "1e-300 Msun", "1e300 km/s", "1e-30 kpc", "1e30 d", "-5 mas/yr"];

/** Lengths just inside and just past the limits the schemas state (tags 32, cycle 40, token 43, name 120 …). */
const boundaryLengths = [1, 32, 33, 40, 41, 43, 44, 80, 81, 100, 101, 120, 121, 200, 201, 254, 255, 500, 501, 2000, 2001, 5000, 5001, 20_000, 20_001];

export const hostileText: fc.Arbitrary<string> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...sqlLookingTexts, ...pathLookingTexts, ...unicodeTexts, ...numberLookingTexts) },
  { weight: 2, arbitrary: fc.string({ unit: "binary", maxLength: 40 }) },
  { weight: 1, arbitrary: fc.string({ unit: "grapheme", maxLength: 40 }) },
  { weight: 1, arbitrary: fc.constantFrom(...boundaryLengths).map((n) => "x".repeat(n)) },
  { weight: 1, arbitrary: fc.uuid() },
);

/** Leaves of a hostile JSON body: wrong types, boundary numbers, the texts above, nested junk. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: hostileText },
  {
    weight: 2,
    arbitrary: fc.constantFrom<unknown>(null, true, false, 0, -1, 1, 0.5, 5, 1e308, -1e308, Number.MAX_SAFE_INTEGER, Number.MIN_VALUE, 2 ** 31, -(2 ** 31) - 1, 2 ** 53 + 2, [], {}, [null], { "": null }),
  },
  {
    weight: 2,
    arbitrary: fc.constantFrom("1e309", "-1e309", "-0", "-0.0", "1e-400", "123456789012345678901234567890", "0.1e1", "1E2").map((t) => new RawJson(t)),
  },
  { weight: 1, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.integer() },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 2 }) },
  { weight: 1, arbitrary: fc.array(hostileText, { maxLength: 3 }) },
);

/** Object keys an attacker tries: prototype keys, empty, the texts above. */
const hostileKey = fc.oneof(fc.constantFrom("__proto__", "constructor", "prototype", "", " ", "toString", "$where"), hostileText.filter((k) => k.length < 200));

const absent = Symbol("absent");
const isPlainObject = (value: unknown): value is Record<string, unknown> => value !== null && typeof value === "object" && !Array.isArray(value) && !(value instanceof RawJson);

/**
 * The accepted `template` with each key kept, left out or given a hostile value, recursing into
 * nested objects ("right keys, wrong types"); sometimes valid as it stands.
 */
export function bentObject(template: Record<string, unknown>): fc.Arbitrary<Record<string, unknown>> {
  const entries = Object.entries(template).map(([key, value]) => {
    const kept = isPlainObject(value) ? bentObject(value) : fc.constant(value);
    return [key, fc.oneof({ weight: 3, arbitrary: kept as fc.Arbitrary<unknown> }, { weight: 2, arbitrary: hostileValue }, { weight: 1, arbitrary: fc.constant<unknown>(absent) })] as const;
  });
  return fc
    .record(Object.fromEntries(entries))
    .map((bent) => Object.fromEntries(Object.entries(bent).filter(([, value]) => value !== absent)));
}

/** Every path to a leaf of `value` (arrays are leaves), e.g. ["site", "latitudeDeg"]. */
function leafPaths(value: Record<string, unknown>, prefix: string[] = []): string[][] {
  return Object.entries(value).flatMap(([key, item]) => (isPlainObject(item) ? leafPaths(item, [...prefix, key]) : [[...prefix, key]]));
}

/** `template` with exactly one leaf given a hostile value or left out: what reaches the checks past the first. */
export function oneLeafBent(template: Record<string, unknown>, values: fc.Arbitrary<unknown> = hostileValue): fc.Arbitrary<Record<string, unknown>> {
  return fc.tuple(fc.constantFrom(...leafPaths(template)), fc.oneof({ weight: 4, arbitrary: values }, { weight: 1, arbitrary: fc.constant<unknown>(absent) })).map(([path, value]) => {
    const copy = structuredClone(template);
    const parent = path.slice(0, -1).reduce<Record<string, unknown>>((node, key) => node[key] as Record<string, unknown>, copy);
    if (value === absent) delete parent[path[path.length - 1]];
    else parent[path[path.length - 1]] = value;
    return copy;
  });
}

/** Request body text: any JSON, the template bent, random keys, non-JSON text. `undefined` sends none. */
export function hostileBodyText(template: Record<string, unknown> | undefined): fc.Arbitrary<string | undefined> {
  const json = fc.oneof(
    { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }) as fc.Arbitrary<unknown> },
    { weight: 1, arbitrary: fc.dictionary(hostileKey, hostileValue, { maxKeys: 5 }) as fc.Arbitrary<unknown> },
    ...(template ? [{ weight: 4, arbitrary: bentObject(template) as fc.Arbitrary<unknown> }, { weight: 4, arbitrary: oneLeafBent(template) as fc.Arbitrary<unknown> }] : []),
  );
  const notJson = fc.oneof(
    fc.constantFrom("{", "[1,", '{"a":}', "{'single': 'quotes'}", "undefined", "NaN", "\u0000", "\ufeff{}", "<xml/>", "a=1&b=2"),
    fc.string({ unit: "binary", maxLength: 40 }),
  );
  return fc.oneof({ weight: 8, arbitrary: json.map(jsonText) }, { weight: 2, arbitrary: notJson }, { weight: 1, arbitrary: fc.constant(undefined) });
}

/**
 * A query string (without "?"): the template's keys bent, known and unknown keys with hostile values,
 * or raw text with broken percent-escapes and repeated keys.
 */
export function hostileQueryText(template: Record<string, string>): fc.Arbitrary<string> {
  const keys = Object.keys(template);
  const known = keys.length > 0 ? fc.oneof(fc.constantFrom(...keys), hostileKey) : hostileKey;
  const bent = fc
    .record(Object.fromEntries(keys.map((k) => [k, fc.oneof({ weight: 2, arbitrary: fc.constant<string | typeof absent>(template[k]) }, { weight: 2, arbitrary: hostileText }, { weight: 1, arbitrary: fc.constant(absent) })])))
    .map((q) => Object.fromEntries(Object.entries(q).filter((e): e is [string, string] => e[1] !== absent)));
  const oneKey = keys.length === 0 ? bent : oneLeafBent(template, hostileText).map((q) => q as Record<string, string>);
  const dictionary = fc.dictionary(known, hostileText, { maxKeys: 6 });
  const raw = fc.oneof(
    fc.constantFrom("%", "%E0%A4%A", "%ZZ", "%00", "&&&", "=", "==&=", "a=%ff%fe", `${keys[0] ?? "q"}=a&${keys[0] ?? "q"}=b`, "%2e%2e%2f%2e%2e%2f"),
    fc.string({ unit: "binary", maxLength: 60 }),
  );
  const text = (q: Record<string, string>) => new URLSearchParams(q).toString();
  return fc.oneof({ weight: 3, arbitrary: bent.map(text) }, { weight: 3, arbitrary: oneKey.map(text) }, { weight: 2, arbitrary: dictionary.map(text) }, { weight: 1, arbitrary: raw });
}

/** UUIDs as RFC 9562 §4 writes them (version 1–8, variant 10xx), plus the Nil and Max UUIDs (§5.9, §5.10). */
const rfc9562Uuid = /^(?:[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}|0{8}-0{4}-0{4}-0{4}-0{12}|f{8}-f{4}-f{4}-f{4}-f{12})$/i;
export const isUuid = (text: string) => rfc9562Uuid.test(text);

/** A well-formed id that names no row. */
export const absentUuid = "00000000-0000-4000-8000-000000000000";

/** A route id other than `valid`: absent or foreign UUIDs, near-UUIDs, paths, very long, any text. */
export function hostileId(valid: string, otherIds: string[]): fc.Arbitrary<string> {
  return fc.oneof(
    fc.constantFrom(absentUuid, "00000000-0000-0000-0000-000000000000", "ffffffff-ffff-ffff-ffff-ffffffffffff", `{${valid}}`, `${valid} `, valid.replaceAll("-", ""), `${valid.slice(0, -1)}g`, `${valid}/../${valid}`, ...otherIds.filter((id) => id !== valid)),
    fc.constantFrom(...pathLookingTexts, ...sqlLookingTexts, "x".repeat(10_000), `${valid}`.repeat(40)),
    fc.uuid(),
    hostileText,
  );
}

/** The documented error kind of each refusal status (RFC 9110 §15.5; 429 from RFC 6585 §4). */
const kindByStatus: Record<number, string> = {
  400: "bad_request",
  401: "unauthorized",
  403: "forbidden",
  404: "not_found",
  409: "conflict",
  413: "payload_too_large",
  429: "rate_limited",
};

export interface Answer {
  status: number;
  contentType: string;
  body: unknown;
}

export async function answerOf(response: Response): Promise<Answer> {
  const contentType = response.headers.get("content-type") ?? "";
  const text = await response.text();
  return { status: response.status, contentType, body: contentType.startsWith("application/json") && text !== "" ? JSON.parse(text) : text };
}

export interface AnswerRules {
  /** Input names the request may carry (body keys, query keys); a 400 must name only these, or "_" for the whole request. */
  inputNames: readonly string[];
}

/**
 * The properties every answer holds: no 5xx; a refusal is `{ error: { code, message, fields?, details? } }`
 * with the code's kind matching the status (DEVELOPERS.md "Errors"); a 400 names the fields at fault,
 * each a name the request could carry, with at least one message each.
 */
export function expectDocumentedAnswer(answer: Answer, rules: AnswerRules): void {
  const shown = `${answer.status} ${typeof answer.body === "string" ? answer.body.slice(0, 300) : JSON.stringify(answer.body).slice(0, 600)}`;
  expect(answer.status, shown).toBeLessThan(500);
  if (answer.status < 400) return;
  expect(answer.contentType, shown).toMatch(/^application\/json/);
  const body = answer.body as { error?: Record<string, unknown> };
  expect(Object.keys(body), shown).toEqual(["error"]);
  const error = body.error!;
  expect(Object.keys(error).every((k) => ["code", "message", "fields", "details"].includes(k)), shown).toBe(true);
  const kind = kindByStatus[answer.status];
  expect(kind, `undocumented refusal status: ${shown}`).toBeDefined();
  expect(error.code, shown).toMatch(new RegExp(`^${kind}:[a-z][a-z -]*$`));
  expect(typeof error.message === "string" && error.message.trim().length > 0, shown).toBe(true);
  if (error.fields !== undefined) {
    const fields = error.fields as Record<string, unknown>;
    for (const [name, messages] of Object.entries(fields)) {
      expect(name === "_" || rules.inputNames.includes(name.split(".")[0]), `field "${name}" is no input of this request: ${shown}`).toBe(true);
      expect(Array.isArray(messages) && messages.length > 0 && messages.every((m) => typeof m === "string" && m.length > 0), shown).toBe(true);
    }
  }
  if (answer.status === 400) {
    expect(Object.keys((error.fields as object | undefined) ?? {}).length, `a 400 names no field: ${shown}`).toBeGreaterThan(0);
  }
}
