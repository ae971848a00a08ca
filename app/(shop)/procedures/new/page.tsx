import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { starterTemplates } from "@/lib/procedures/templates";
import { NewProcedureForm } from "../_components/new-procedure-form";
import { ProcedureNote } from "../_components/procedure-note";

export const metadata: Metadata = { title: "New procedure" };

export default async function NewProcedurePage() {
  await requireShop("procedure:write");
  const templates = starterTemplates().map(({ slug, file }) => ({
    slug,
    title: file.procedure.title,
    scope: file.procedure.scope,
    code: file.procedure.code,
    steps: file.content.sections.reduce((n, s) => n + s.steps.length, 0),
  }));
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm"><Link href="/procedures" className="underline">Procedures</Link></nav>
      <PageHeader title="New procedure" lead="It starts as draft version 1. Nothing reaches a job until you publish it." />
      <div className="space-y-4">
        <NewProcedureForm templates={templates} />
        <ProcedureNote className="max-w-3xl" />
      </div>
    </>
  );
}
