"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormMessage } from "@/components/form-message";

const MAX = 20 * 1024 * 1024;

// Sent to the API route rather than a server action: a certificate may be up to 20 MB.
export function CertificateUpload({ qualificationId, hasCertificate }: { qualificationId: string; hasCertificate: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | undefined>();
  const [ok, setOk] = useState<string | undefined>();
  const [pending, setPending] = useState(false);
  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setError(undefined);
    setOk(undefined);
    const file = new FormData(event.currentTarget).get("file");
    if (!(file instanceof File) || file.size === 0) return setError("Choose the certificate file.");
    if (file.size > MAX) return setError("A certificate may be at most 20 MB.");
    setPending(true);
    try {
      const body = new FormData();
      body.set("file", file);
      const res = await fetch(`/api/qualifications/${qualificationId}/certificate`, { method: "POST", body });
      const json = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
      if (!res.ok) return setError(json?.error?.message ?? "The upload failed; nothing was saved.");
      setOk("Certificate uploaded.");
      router.refresh();
    } catch {
      setError("The upload did not reach the server; nothing was saved. Try again.");
    } finally {
      setPending(false);
    }
  }
  return (
    <form onSubmit={onSubmit} className="space-y-2" data-testid="certificate-upload" noValidate>
      <label className="field-label" htmlFor="certificate-file">{hasCertificate ? "A newer certificate file" : "Certificate file"}</label>
      <input id="certificate-file" name="file" type="file" accept="application/pdf,image/jpeg,image/png" className="field-input" />
      <p className="text-xs text-graphite-600">PDF, or a JPEG or PNG photo; at most 20 MB. Photos are stored without their camera and location data.</p>
      <FormMessage ok={ok} errors={error ? [error] : undefined} testId="certificate" />
      <button className="btn btn-quiet" type="submit" disabled={pending}>{pending ? "Uploading…" : hasCertificate ? "Replace the certificate" : "Upload the certificate"}</button>
    </form>
  );
}
