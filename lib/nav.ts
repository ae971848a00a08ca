import { can, type Action } from "@/lib/authz";

type NavItem = { href: string; label: string; action: Action; roles?: string[]; localMailOnly?: boolean };

// Role-aware navigation: a person sees the desks of every role they hold, and the tools their roles may use.
const NAV: NavItem[] = [
  { href: "/home/lead", label: "Lead desk", action: "people:manage", roles: ["lead"] },
  { href: "/home/welder", label: "Bench", action: "step:sign", roles: ["welder"] },
  { href: "/home/inspector", label: "Inspection desk", action: "inspection:sign", roles: ["inspector"] },
  { href: "/inspections", label: "Welds to inspect", action: "inspection:sign", roles: ["inspector"] },
  { href: "/home/auditor", label: "Record lookup", action: "audit:search", roles: ["auditor"] },
  { href: "/jobs", label: "Jobs", action: "job:read" },
  { href: "/records", label: "Released records", action: "audit:search", roles: ["lead", "inspector"] },
  { href: "/procedures", label: "Procedures", action: "procedure:read" },
  { href: "/people", label: "People", action: "people:read" },
  { href: "/wps", label: "WPS library", action: "procedure:read" },
  { href: "/qualifications", label: "Qualifications", action: "job:read" },
  { href: "/quality", label: "Quality", action: "quality:shop", roles: ["lead", "inspector", "auditor"] },
  { href: "/calc", label: "Calculators", action: "calc:use" },
  { href: "/devices", label: "Devices", action: "devices:manage", roles: ["lead"] },
  { href: "/mailbox", label: "Local mailbox", action: "mailbox:read", localMailOnly: true },
];

export function navFor(roles: readonly string[], localMailbox: boolean): NavItem[] {
  return NAV.filter(
    (item) => can(roles, item.action) && (!item.roles || item.roles.some((r) => roles.includes(r))) && (!item.localMailOnly || localMailbox),
  );
}
