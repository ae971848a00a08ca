import "server-only";
// The welder's side of a rejection: joints sent back for repair on open jobs this welder is assigned to or
// welded, with what the inspector found.
import { sql } from "drizzle-orm";
import { db } from "@/lib/db";

export type RepairWaiting = { jobId: string; jobNumber: string; axleTag: string; stepKey: string; stepTitle: string; jointId: string; round: number; inspectorName: string; rejectedAt: string; notes: string; rejectedItems: string[] };

export async function repairsWaiting(shopId: string, welderId: string, limit = 20): Promise<RepairWaiting[]> {
  const rows = await db().execute<{ job_id: string; job_number: string; axle_tag: string; step_key: string; step_title: string; joint_id: string; round: number; inspector_name: string; inspected_at: Date; notes: string; items: { item: string; ok: boolean }[] }>(sql`
    select j.id as job_id, j.number as job_number, j.axle_tag, s.step_key, s.title as step_title, s.spec->>'jointId' as joint_id,
      i.round, u.name as inspector_name, i.inspected_at, i.notes, i.items
    from weld_inspection i
    join job_step s on s.id = i.step_id
    join job j on j.id = i.job_id
    join "user" u on u.id = i.inspector_id
    where i.shop_id = ${shopId} and i.decision = 'rejected' and j.status not in ('released', 'void')
      and i.round = (select max(x.round) from weld_inspection x where x.step_id = i.step_id)
      -- the repair round is not signed yet
      and not exists (select 1 from sign_off so where so.step_id = s.id and so.meaning = 'performed' and so.round = i.round + 1)
      and (exists (select 1 from job_assignment a where a.job_id = j.id and a.user_id = ${welderId} and a.role = 'welder')
        or exists (select 1 from weld_pass p where p.step_id = s.id and p.welder_id = ${welderId}))
    order by i.inspected_at
    limit ${limit}`);
  return rows.rows.map((r) => ({
    jobId: r.job_id,
    jobNumber: r.job_number,
    axleTag: r.axle_tag,
    stepKey: r.step_key,
    stepTitle: r.step_title,
    jointId: r.joint_id,
    round: Number(r.round) + 1,
    inspectorName: r.inspector_name,
    rejectedAt: new Date(r.inspected_at).toISOString(),
    notes: r.notes,
    rejectedItems: (r.items ?? []).filter((x) => !x.ok).map((x) => x.item),
  }));
}
