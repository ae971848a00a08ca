-- Weld inspections, lead overrides of out-of-range passes and material traceability: written once, kept for
-- good, for every role. A correction of a material is a new row pointing at the old one.
-- Safe to run again: triggers are dropped and re-created.

drop trigger if exists weld_inspection_append_only on weld_inspection;
create trigger weld_inspection_append_only before update or delete on weld_inspection
  for each row execute function gusset_jobs_append_only();
drop trigger if exists weld_inspection_no_truncate on weld_inspection;
create trigger weld_inspection_no_truncate before truncate on weld_inspection
  for each statement execute function gusset_jobs_append_only();

drop trigger if exists weld_pass_override_append_only on weld_pass_override;
create trigger weld_pass_override_append_only before update or delete on weld_pass_override
  for each row execute function gusset_jobs_append_only();
drop trigger if exists weld_pass_override_no_truncate on weld_pass_override;
create trigger weld_pass_override_no_truncate before truncate on weld_pass_override
  for each statement execute function gusset_jobs_append_only();

drop trigger if exists job_material_append_only on job_material;
create trigger job_material_append_only before update or delete on job_material
  for each row execute function gusset_jobs_append_only();
drop trigger if exists job_material_no_truncate on job_material;
create trigger job_material_no_truncate before truncate on job_material
  for each statement execute function gusset_jobs_append_only();
