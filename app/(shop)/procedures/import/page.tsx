import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { PROCEDURE_FILE_FORMAT, PROCEDURE_FILE_SCHEMA_PATH, PROCEDURE_FILE_VERSION } from "@/lib/procedures/file";
import { ImportForm } from "../_components/import-form";
import { ProcedureNote } from "../_components/procedure-note";

export const metadata: Metadata = { title: "Import a procedure" };

export default async function ImportPage() {
  await requireShop("procedure:write");
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm"><Link href="/procedures" className="underline">Procedures</Link></nav>
      <PageHeader
        title="Import a procedure file"
        lead="A Gusset procedure file becomes a new procedure with one draft. If anything in the file is wrong, every problem is listed and nothing is saved."
      />
      <div className="max-w-3xl space-y-4">
        <ImportForm />
        <p className="text-sm text-graphite-700">
          The file is JSON with <code>&quot;format&quot;: &quot;{PROCEDURE_FILE_FORMAT}&quot;</code> and <code>&quot;formatVersion&quot;: {PROCEDURE_FILE_VERSION}</code>, as
          written by Export on any version. Its JSON Schema is at{" "}
          <a className="underline" href={PROCEDURE_FILE_SCHEMA_PATH}>{PROCEDURE_FILE_SCHEMA_PATH}</a>.
        </p>
        <ProcedureNote />
      </div>
    </>
  );
}
