// Who may do what. Deny by default: an action missing from the table is allowed to nobody.
// Separation of duties between people is checked per record (see `assertDifferentPeople`).
import { AppError } from "@/lib/errors";

export const ROLES = ["lead", "welder", "inspector", "auditor"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  lead: "Lead",
  welder: "Welder",
  inspector: "Inspector",
  auditor: "Auditor",
};

const PERMISSIONS = {
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
  // Quality figures: a welder sees those of their own work; the others the whole shop's.
  "quality:read": ["lead", "welder", "inspector", "auditor"],
  "quality:shop": ["lead", "inspector", "auditor"],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof PERMISSIONS;
export const ACTIONS = Object.keys(PERMISSIONS) as Action[];

export function can(roles: readonly string[], action: Action): boolean {
  const allowed: readonly Role[] | undefined = PERMISSIONS[action];
  if (!allowed) return false;
  return roles.some((r) => (allowed as readonly string[]).includes(r));
}

export function rolesAllowed(action: Action): readonly Role[] {
  return PERMISSIONS[action] ?? [];
}

export type Principal = { userId: string; shopId: string; roles: readonly string[]; active: boolean };

// The one check every handler and action runs before touching data.
export function authorize(principal: Principal | null, action: Action): asserts principal is Principal {
  if (!principal) throw new AppError("unauthenticated", "Sign in to continue.");
  if (!principal.active) throw new AppError("forbidden", "Your membership of this shop is deactivated.");
  if (!can(principal.roles, action)) {
    const who = rolesAllowed(action).map((r) => ROLE_LABELS[r].toLowerCase());
    throw new AppError("forbidden", `Only a ${who.join(" or ") || "nobody"} may do this.`);
  }
}

// A record of another shop is reported as missing, so its existence does not leak.
export function assertSameShop(principal: Principal, record: { shopId: string } | null | undefined, what = "Record") {
  if (!record || record.shopId !== principal.shopId) throw new AppError("not_found", `${what} not found.`);
}

// Separation of duties: nobody checks their own work, whatever roles they hold.
export function assertDifferentPeople(actorId: string, others: readonly (string | null | undefined)[], message: string) {
  if (others.some((o) => o === actorId)) throw new AppError("forbidden", message);
}

// Where a role lands after signing in.
export function homePathFor(roles: readonly string[]): string {
  if (roles.includes("lead")) return "/home/lead";
  if (roles.includes("inspector")) return "/home/inspector";
  if (roles.includes("welder")) return "/home/welder";
  return "/home/auditor";
}
