// A step's sign-offs in order: the original, then each amendment pointing at what it corrects, with its
// reason. Printed name, role, meaning, server time and content hash, as the record keeps them.
import { MEANING_LABELS } from "@/lib/jobs/labels";
import type { SignOffView } from "@/lib/jobs/record";

export function SignOffList({ signOffs, summary }: { signOffs: SignOffView[]; summary?: (s: SignOffView) => React.ReactNode }) {
  if (!signOffs.length) return null;
  const byId = new Map(signOffs.map((s, i) => [s.id, i + 1]));
  return (
    <ol className="space-y-2" data-testid="sign-offs">
      {signOffs.map((s, i) => (
        <li key={s.id} className={`rounded-lg border-2 p-3 ${s.amendsSignOffId ? "border-graphite-700 bg-graphite-50" : "border-[#2f4a08] bg-[#eef5d6]"}`} data-testid={s.amendsSignOffId ? "amendment" : "sign-off"}>
          <p className="font-bold text-graphite-950">
            <span aria-hidden="true">{s.amendsSignOffId ? "◆ " : "● "}</span>
            {s.amendsSignOffId ? `Amendment ${i} (corrects #${byId.get(s.amendsSignOffId) ?? "?"})` : MEANING_LABELS[s.meaning]}
            {" by "}
            <span data-testid="signer-name">{s.printedName}</span>, <span className="capitalize">{s.role}</span>
          </p>
          <p className="text-sm text-graphite-950">
            {MEANING_LABELS[s.meaning]} · <time className="figures" dateTime={s.signedAt}>{s.signedAt.slice(0, 19).replace("T", " ")} UTC</time> · SHA-256{" "}
            <span className="figures break-all" title={s.contentHash}>{s.contentHash.slice(0, 16)}…</span>
          </p>
          {s.reason ? <p className="mt-1 text-graphite-950"><strong>Reason:</strong> {s.reason}</p> : null}
          {summary ? <div className="mt-1 text-graphite-950">{summary(s)}</div> : null}
        </li>
      ))}
    </ol>
  );
}
