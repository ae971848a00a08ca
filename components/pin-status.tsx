import Link from "next/link";
import { StatusBadge } from "./status-badge";

export function PinStatus({ hasPin, locked, showLink = true }: { hasPin: boolean; locked: boolean; showLink?: boolean }) {
  return (
    <section className="card p-4" aria-labelledby="pin-h">
      <h2 id="pin-h" className="font-bold">Signing PIN</h2>
      <p className="mt-2">
        {locked ? (
          <StatusBadge tone="fail">Locked after 5 wrong tries: ask a lead to reset it</StatusBadge>
        ) : hasPin ? (
          <StatusBadge tone="pass">Set: your sign-offs ask for it</StatusBadge>
        ) : (
          <StatusBadge tone="warn">Not set: you cannot sign steps yet</StatusBadge>
        )}
      </p>
      {showLink ? <Link className="btn btn-quiet mt-3" href="/account">Change PIN</Link> : null}
    </section>
  );
}
