import { describe, expect, it } from "vitest";
import { ACTIONS, can, HOME, type Action, type Actor } from "@/lib/auth/permissions";

const ACTORS: Actor[] = ["visitor", "student", "teacher", "admin"];
const allowed = (actor: Actor) => ACTIONS.filter((a) => can(actor, a));

describe("the permission table (PRODUCT.md §2)", () => {
  it("lets a visitor only browse the public catalogue and use the account doors", () => {
    // PRODUCT.md §2 and §5: a visitor may "browse the public catalogue … sign up" and see plans and prices; signing in, a reset link,
    // an address confirmation and an invitation link all start signed out.
    expect(allowed("visitor").sort()).toEqual(
      [
        "account:reset-password",
        "account:sign-in",
        "account:sign-out",
        "account:sign-up",
        "account:verify-email",
        "invitation:accept",
        "catalogue:view",
        "tune:view",
        "plans:view",
      ].sort(),
    );
  });

  it("gives each area to its own role only (admin: everything)", () => {
    const areas: Array<[Action, Actor[]]> = [
      ["area:learn", ["student", "admin"]],
      ["area:teach", ["teacher", "admin"]],
      ["area:admin", ["admin"]],
    ];
    for (const [area, who] of areas) {
      expect(ACTORS.filter((a) => can(a, area))).toEqual(who);
    }
  });

  it("lets teachers (not students) invite students and see a roster", () => {
    for (const action of ["students:invite", "roster:view"] as const) {
      expect(can("teacher", action)).toBe(true);
      expect(can("student", action)).toBe(false);
      expect(can("visitor", action)).toBe(false);
    }
  });

  it("gives assigning and reviewing to teachers, checking in and practice to students, money to admins", () => {
    const rules: Array<[Action, Actor[]]> = [
      ["assignment:manage", ["teacher", "admin"]],
      ["checkin:review", ["teacher", "admin"]],
      ["checkin:create", ["student", "admin"]],
      ["practice:write", ["student", "admin"]],
      ["recording:upload", ["student", "admin"]],
      ["billing:subscribe", ["student", "admin"]],
      ["plans:manage", ["admin"]],
      ["money:view", ["admin"]],
      ["payments:refund", ["admin"]],
      ["members:welcome", ["teacher", "admin"]],
      ["enrolments:reassign", ["admin"]],
    ];
    for (const [action, who] of rules) expect(ACTORS.filter((a) => can(a, action))).toEqual(who);
  });

  it("keeps the people list, teacher invitations and role changes to admins", () => {
    for (const action of ["people:list", "people:invite-teacher", "people:change-role"] as const) {
      expect(ACTORS.filter((a) => can(a, action))).toEqual(["admin"]);
    }
  });

  it("gives an admin every action, and every signed-in role more than a visitor", () => {
    expect(allowed("admin")).toEqual([...ACTIONS]);
    for (const role of ["student", "teacher"] as const) {
      for (const action of allowed("visitor")) expect(can(role, action)).toBe(true);
      expect(allowed(role).length).toBeGreaterThan(allowed("visitor").length);
    }
  });

  it("sends each role to a home inside an area it may enter", () => {
    expect(HOME.student.startsWith("/learn") && can("student", "area:learn")).toBe(true);
    expect(HOME.teacher.startsWith("/teach") && can("teacher", "area:teach")).toBe(true);
    expect(HOME.admin.startsWith("/admin") && can("admin", "area:admin")).toBe(true);
  });
});
