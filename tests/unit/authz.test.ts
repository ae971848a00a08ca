import { describe, expect, it } from "vitest";
import { ACTIONS, assertDifferentPeople, assertSameShop, authorize, can, homePathFor, ROLES, type Action, type Principal } from "@/lib/authz";
import { AppError } from "@/lib/errors";

// The shop's own rules of who does what (DESIGN.md "Roles"): the table every handler and action consults.
const EXPECTED: Record<Action, string[]> = {
  "shop:read": ["lead", "welder", "inspector", "auditor"],
  "people:read": ["lead"],
  "people:manage": ["lead"],
  "shop:manage": ["lead"],
  "pin:reset": ["lead"],
  "mailbox:read": ["lead"],
  "devices:manage": ["lead"],
  "procedure:read": ["lead", "welder", "inspector", "auditor"],
  "procedure:write": ["lead"],
  "job:read": ["lead", "welder", "inspector", "auditor"],
  "job:write": ["lead"],
  "job:release": ["lead"],
  "step:sign": ["lead", "welder"],
  "weld:log": ["welder"],
  "weld:override": ["lead"],
  "weldmap:rebase": ["lead", "welder"],
  "material:record": ["lead", "welder", "inspector"],
  "inspection:sign": ["inspector"],
  "nonconformance:raise": ["lead", "welder", "inspector"],
  "nonconformance:disposition": ["lead", "inspector"],
  "wps:write": ["lead"],
  "qualification:write": ["lead"],
  "audit:search": ["lead", "inspector", "auditor"],
  "calc:use": ["lead", "welder", "inspector", "auditor"],
  // Quality figures: everyone reads them; a welder only those of their own work (scoped by the route).
  "quality:read": ["lead", "welder", "inspector", "auditor"],
  "quality:shop": ["lead", "inspector", "auditor"],
};

const principal = (roles: string[], active = true): Principal => ({ userId: "u1", shopId: "s1", roles, active });

describe("can / authorize: each role × each action", () => {
  it("covers every action in the table", () => {
    expect([...ACTIONS].sort()).toEqual(Object.keys(EXPECTED).sort());
  });

  for (const action of Object.keys(EXPECTED) as Action[]) {
    for (const role of ROLES) {
      const allowed = EXPECTED[action].includes(role);
      it(`${role} ${allowed ? "may" : "may not"} ${action}`, () => {
        expect(can([role], action)).toBe(allowed);
        if (allowed) expect(() => authorize(principal([role]), action)).not.toThrow();
        else {
          try {
            authorize(principal([role]), action);
            expect.unreachable("authorize should refuse");
          } catch (error) {
            expect(error).toBeInstanceOf(AppError);
            expect((error as AppError).status).toBe(403);
          }
        }
      });
    }
  }

  it("denies by default: an unknown action or role is allowed to nobody", () => {
    expect(can(["lead", "welder", "inspector", "auditor"], "launch:rockets" as Action)).toBe(false);
    expect(can(["owner"], "people:read")).toBe(false);
    expect(can([], "shop:read")).toBe(false);
  });

  it("one person may hold several roles: the union applies", () => {
    expect(can(["welder", "inspector"], "inspection:sign")).toBe(true);
    expect(can(["welder", "inspector"], "weld:log")).toBe(true);
    expect(can(["welder", "inspector"], "people:manage")).toBe(false);
  });

  it("signed out is 401, a deactivated member 403", () => {
    expect(() => authorize(null, "shop:read")).toThrow(expect.objectContaining({ status: 401 }));
    expect(() => authorize(principal(["lead"], false), "shop:read")).toThrow(expect.objectContaining({ status: 403 }));
  });
});

describe("records and people", () => {
  it("another shop's record reads as not found (404), never forbidden", () => {
    expect(() => assertSameShop(principal(["lead"]), { shopId: "s2" })).toThrow(expect.objectContaining({ status: 404 }));
    expect(() => assertSameShop(principal(["lead"]), null)).toThrow(expect.objectContaining({ status: 404 }));
    expect(() => assertSameShop(principal(["lead"]), { shopId: "s1" })).not.toThrow();
  });

  it("separation of duties refuses the same person, whatever their roles", () => {
    expect(() => assertDifferentPeople("u1", ["u2", "u1"], "You welded this joint.")).toThrow(expect.objectContaining({ status: 403, message: "You welded this joint." }));
    expect(() => assertDifferentPeople("u1", ["u2", null], "x")).not.toThrow();
  });

  it("each role lands on its own desk", () => {
    expect(homePathFor(["auditor"])).toBe("/home/auditor");
    expect(homePathFor(["welder"])).toBe("/home/welder");
    expect(homePathFor(["inspector"])).toBe("/home/inspector");
    expect(homePathFor(["welder", "lead"])).toBe("/home/lead");
  });
});
