import { describe, expect, it } from "vitest";
import { ACTIONS, ROLES, can } from "./permissions";

// The expected table is PRODUCT.md's "Roles" table, transcribed cell by cell.
const EXPECTED: Record<string, Record<string, boolean>> = {
  read: { owner: true, analyst: true, reviewer: true, viewer: true },
  edit: { owner: true, analyst: true, reviewer: false, viewer: false },
  comment: { owner: true, analyst: true, reviewer: true, viewer: false },
  decide: { owner: true, analyst: false, reviewer: true, viewer: false },
  export: { owner: true, analyst: true, reviewer: true, viewer: true },
  manage_team: { owner: true, analyst: false, reviewer: false, viewer: false },
};

describe("role matrix", () => {
  for (const action of ACTIONS) {
    for (const role of ROLES) {
      it(`${EXPECTED[action][role] ? "allows" : "refuses"} ${action} for ${role}`, () => {
        expect(can(role, action)).toBe(EXPECTED[action][role]);
      });
    }
  }
});
