"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormMessage } from "@/components/form-message";
import { PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES } from "@/lib/procedures/file";

type Problem = { path: string; where: string; message: string };

// Sends the chosen file as the body of POST /api/procedures/import and lists every problem it reports.
export function ImportForm() {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [message, setMessage] = useState<string | undefined>();
  const [problems, setProblems] = useState<Problem[]>([]);
  const [fileError, setFileError] = useState<string | undefined>();

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setMessage(undefined);
    setProblems([]);
    const file = (event.currentTarget.elements.namedItem("file") as HTMLInputElement).files?.[0];
    if (!file) {
      setFileError("Choose a procedure file.");
      return;
    }
    setFileError(undefined);
    if (file.size > PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES) {
      setMessage(`The file is ${Math.ceil(file.size / 1024)} KB; a procedure file is at most ${PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES / 1024} KB. Nothing was saved.`);
      return;
    }
    setPending(true);
    try {
      const res = await fetch("/api/procedures/import", { method: "POST", headers: { "content-type": "application/json" }, body: await file.text() });
      const json = await res.json().catch(() => null);
      if (res.status === 201 && json?.procedure?.id) {
        router.push(`/procedures/${json.procedure.id}/versions/1/edit`);
        return;
      }
      setMessage(json?.error?.message ?? `The import was refused (${res.status}). Nothing was saved.`);
      setProblems(Array.isArray(json?.error?.problems) ? json.error.problems : []);
    } catch {
      setMessage("The file could not be sent. Check the connection and try again.");
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={onSubmit} className="card max-w-3xl space-y-3 p-4" noValidate data-testid="import-form">
      <div>
        <label className="field-label" htmlFor="import-file">Procedure file (.gusset-procedure.json, at most 1 MB)</label>
        <input id="import-file" name="file" type="file" accept=".json,application/json" className="field-input" aria-describedby="import-file-error" />
        <p className="field-error" id="import-file-error">{fileError}</p>
      </div>
      <FormMessage errors={message ? [message] : undefined} testId="import" />
      {problems.length ? (
        <ol className="list-decimal space-y-1 pl-6 text-sm" data-testid="import-problems">
          {problems.map((p, i) => (
            <li key={i}>
              <strong>{p.where}</strong>
              {p.path ? <code className="ml-1 text-xs text-graphite-600">{p.path}</code> : null}: {p.message}
            </li>
          ))}
        </ol>
      ) : null}
      <button type="submit" className="btn btn-primary" disabled={pending}>{pending ? "Checking…" : "Import as a new draft"}</button>
    </form>
  );
}
