-- The record chain and QR tokens are append-only for every role, the owner and superusers included,
-- with the same refusal (SQLSTATE GS409) as the sign-offs they record (020-jobs.sql).
drop trigger if exists record_entry_append_only on record_entry;
create trigger record_entry_append_only before update or delete on record_entry
  for each row execute function gusset_jobs_append_only();

drop trigger if exists record_entry_no_truncate on record_entry;
create trigger record_entry_no_truncate before truncate on record_entry
  for each statement execute function gusset_jobs_append_only();

drop trigger if exists job_token_append_only on job_token;
create trigger job_token_append_only before update or delete on job_token
  for each row execute function gusset_jobs_append_only();

drop trigger if exists job_token_no_truncate on job_token;
create trigger job_token_no_truncate before truncate on job_token
  for each statement execute function gusset_jobs_append_only();

-- An earlier copy of the same refusal, no longer used by any trigger.
drop function if exists gusset_refuse_change();
