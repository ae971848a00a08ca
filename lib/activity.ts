// Shop activity in words a lead reads at a glance.
export function describeActivity(action: string, detail: Record<string, unknown>, actorName: string | null): string {
  const who = actorName ?? "Someone";
  const email = typeof detail.email === "string" ? detail.email : "";
  const roles = Array.isArray(detail.to) ? detail.to.join(", ") : Array.isArray(detail.roles) ? detail.roles.join(", ") : "";
  switch (action) {
    case "person.invited":
      return `${who} invited ${email} as ${roles}`;
    case "person.joined":
      return `${who} joined as ${roles}`;
    case "person.roles_set":
      return `${who} changed roles to ${roles}`;
    case "person.deactivated":
      return `${who} deactivated a member`;
    case "person.reactivated":
      return `${who} reactivated a member`;
    case "pin.set":
      return `${who} set a signing PIN`;
    case "pin.reset":
      return `${who} reset a member's signing PIN`;
    default:
      return `${who}: ${action}`;
  }
}
