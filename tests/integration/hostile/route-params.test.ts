import fc from "fast-check";
import { expect } from "vitest";
import { acceptedBodyOf, acceptedQueryOf, describeEveryEndpoint, type HostileCaller, type HostileEndpoint, type HostileWorld } from "../support/hostile-endpoints";
import { hostileId, hostileText, isUuid } from "../support/hostile-input";
import { catchMailDuringFile } from "../support/mail-catcher";

catchMailDuringFile();

/** Route params with at least one of them replaced by a hostile value. */
function hostileParams(endpoint: HostileEndpoint, w: HostileWorld): fc.Arbitrary<Record<string, string>> {
  const valid = endpoint.params(w);
  const otherIds = [w.proposalId, w.targetId, w.noteId, w.invitationId, w.fileId];
  const entries = Object.entries(valid).map(([key, value]) => {
    const choices = endpoint.paramChoices?.[key];
    const hostile = choices ? hostileText.filter((text) => !choices.includes(text)) : hostileId(value, otherIds);
    return [key, fc.oneof(fc.constant(value), hostile)] as const;
  });
  return fc.record(Object.fromEntries(entries)).filter((params) => Object.entries(params).some(([key, value]) => value !== valid[key]));
}

/**
 * What a request with these params must answer (DEVELOPERS.md "Roles"): an id that is no UUID, or a
 * figure that is none, names nothing (404, before the session is asked); a well-formed id of a row
 * that is not there is 401 signed out, 404 for the PI, and 403 for the PI on a site admin's endpoint.
 */
function expectedStatus(endpoint: HostileEndpoint, caller: HostileCaller, params: Record<string, string>): number {
  const isMalformed = Object.entries(params).some(([key, value]) => (endpoint.paramChoices?.[key] ? !endpoint.paramChoices[key].includes(value) : !isUuid(value)));
  if (isMalformed) return 404;
  if (caller === "signedOut") return 401;
  if (caller === "pi" && endpoint.name.includes("/admin/")) return 403;
  return 404;
}

describeEveryEndpoint("hostile route params: malformed ids 404 before anything else, absent rows 404 (401 signed out), never a 5xx", {
  only: (endpoint) => endpoint.route.includes("["),
  numRuns: () => 30,
  input: hostileParams,
  parts: (endpoint, world, params) => ({ params, query: acceptedQueryOf(endpoint, world), body: acceptedBodyOf(endpoint, world) }),
  expectAlso: (answer, endpoint, caller, parts) => expect(answer.status, JSON.stringify(answer.body)).toBe(expectedStatus(endpoint, caller, parts.params)),
});
