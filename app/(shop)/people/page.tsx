import type { Metadata } from "next";
import { z } from "zod";
import { PageHeader } from "@/components/page-header";
import { ROLE_LABELS } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { listMembers, listOpenInvitations } from "@/db/queries/people";
import { archiveAddress } from "@/db/queries/shop-settings";
import { can } from "@/lib/authz";
import { ArchiveForm } from "./_components/archive-form";
import { InviteForm } from "./_components/invite-form";
import { MembersTable } from "./_components/members-table";

export const metadata: Metadata = { title: "People" };

const PAGE_SIZE = 20;
const querySchema = z.object({
  q: z.string().trim().max(100).optional().catch(undefined),
  page: z.coerce.number().int().min(1).max(10_000).catch(1),
  inactive: z.enum(["1"]).optional().catch(undefined),
});

export default async function PeoplePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("people:read");
  const query = querySchema.parse(await searchParams);
  const [{ rows, total }, invitations, archive] = await Promise.all([
    listMembers(ctx.shopId, { q: query.q, page: query.page, pageSize: PAGE_SIZE, includeInactive: query.inactive === "1" }),
    listOpenInvitations(ctx.shopId),
    can(ctx.roles, "shop:manage") ? archiveAddress(ctx.shopId) : null,
  ]);
  return (
    <>
      <PageHeader title="People" lead="Members, their roles and signing PINs. Deactivated people keep their past sign-offs readable." />
      <div className="grid gap-4 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-3">
          <form className="flex flex-wrap items-end gap-2" role="search">
            <div>
              <label className="field-label" htmlFor="q">Search name or e-mail</label>
              <input id="q" name="q" defaultValue={query.q} className="field-input w-64" />
            </div>
            <label className="flex min-h-11 items-center gap-2">
              <input type="checkbox" name="inactive" value="1" defaultChecked={query.inactive === "1"} className="h-5 w-5" />
              Show deactivated
            </label>
            <button className="btn btn-quiet" type="submit">Search</button>
          </form>
          <MembersTable
            data={rows.map((r) => ({ ...r, isMe: r.userId === ctx.userId }))}
            total={total}
            page={query.page}
            pageSize={PAGE_SIZE}
          />
        </div>
        <div className="space-y-4">
          <InviteForm />
          {archive ? <ArchiveForm email={archive.email} recipients={archive.recipients} /> : null}
          <section className="card p-4" aria-labelledby="inv-h">
            <h2 id="inv-h" className="font-bold">Open invitations</h2>
            {invitations.length === 0 ? (
              <p className="mt-2 text-graphite-600">None.</p>
            ) : (
              <ul className="mt-2 divide-y divide-graphite-100" data-testid="open-invitations">
                {invitations.map((i) => (
                  <li key={i.id} className="py-2">
                    <div className="font-semibold">{i.email}</div>
                    <div className="text-sm text-graphite-600">
                      {i.roles.map((r) => ROLE_LABELS[r]).join(", ")} · until <span className="figures">{i.expiresAt.toISOString().slice(0, 10)}</span>
                    </div>
                  </li>
                ))}
              </ul>
            )}
          </section>
        </div>
      </div>
    </>
  );
}
