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
    case "person.legal_name_set":
      return `${who} set the name printed on sign-offs from “${typeof detail.from === "string" ? detail.from : "?"}” to “${typeof detail.to === "string" ? detail.to : "?"}”`;
    case "shop.archive_email_set":
      return `${who} set the seal archive address to ${typeof detail.to === "string" ? detail.to : "the shop's leads"}`;
    case "person.deactivated":
      return `${who} deactivated a member`;
    case "person.reactivated":
      return `${who} reactivated a member`;
    case "pin.set":
      return `${who} set a signing PIN`;
    case "pin.reset":
      return `${who} reset a member's signing PIN`;
    case "procedure.created":
      return `${who} created procedure ${title(detail)}`;
    case "procedure.imported":
      return `${who} imported procedure ${title(detail)}`;
    case "procedure.published":
      return `${who} published ${title(detail)}${version(detail)}`;
    case "procedure.retired":
      return `${who} retired ${title(detail)}${version(detail)}`;
    case "procedure.version_started":
      return `${who} started a new draft of ${title(detail)}${version(detail)}`;
    case "procedure.draft_discarded":
      return `${who} discarded a draft of ${title(detail)}${version(detail)}`;
    default:
      return `${who}: ${action.replace(/[._]/g, " ")}`;
  }
}

function title(detail: Record<string, unknown>) {
  return typeof detail.title === "string" ? `“${detail.title}”` : "a procedure";
}

function version(detail: Record<string, unknown>) {
  const n = detail.number ?? detail.version;
  return typeof n === "number" ? ` (version ${n})` : "";
}
