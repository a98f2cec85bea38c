import { describe, expect, it } from "vitest";
import { permissionsFor, roleCan } from "@/lib/workspace/roles";
import { allowedNextStatuses, canChangeStatus } from "@/lib/workspace/status";

describe("roles", () => {
  it("gives a PI everything, a Co-I editing, a viewer reading only", () => {
    expect(permissionsFor("pi")).toEqual({ canEdit: true, canManage: true, canDelete: true });
    expect(permissionsFor("coi")).toEqual({ canEdit: true, canManage: false, canDelete: false });
    expect(permissionsFor("viewer")).toEqual({ canEdit: false, canManage: false, canDelete: false });
    expect(roleCan("viewer", "read")).toBe(true);
  });
});

describe("status transitions", () => {
  it("follows candidate → accepted → scheduled → observed", () => {
    expect(canChangeStatus("candidate", "accepted")).toBe(true);
    expect(canChangeStatus("accepted", "scheduled")).toBe(true);
    expect(canChangeStatus("scheduled", "observed")).toBe(true);
  });

  it("allows dropping before observation and reinstating as a candidate", () => {
    expect(canChangeStatus("scheduled", "dropped")).toBe(true);
    expect(canChangeStatus("dropped", "candidate")).toBe(true);
    expect(canChangeStatus("dropped", "scheduled")).toBe(false);
  });

  it("never skips a step or leaves observed", () => {
    expect(canChangeStatus("candidate", "observed")).toBe(false);
    expect(canChangeStatus("candidate", "scheduled")).toBe(false);
    expect(allowedNextStatuses("observed")).toEqual([]);
    expect(canChangeStatus("observed", "observed")).toBe(true);
  });
});
