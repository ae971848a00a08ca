-- Jobs: database rules that hold for every role, the app's and the owner's alike.
-- Safe to run again: functions are replaced, triggers dropped and re-created, indexes "if not exists".
-- Refusals use SQLSTATE GS409 so the app can answer 409 should one ever get past its own checks.

-- Sign-offs, the activity log, nonconformances and their dispositions are append-only.
create or replace function gusset_jobs_append_only() returns trigger language plpgsql as $$
begin
  raise exception 'gusset: % is append-only; % refused', tg_table_name, lower(tg_op)
    using errcode = 'GS409', hint = 'Corrections are new rows that point at the old one.';
end;
$$;

drop trigger if exists sign_off_append_only on sign_off;
create trigger sign_off_append_only before update or delete on sign_off
  for each row execute function gusset_jobs_append_only();
drop trigger if exists sign_off_no_truncate on sign_off;
create trigger sign_off_no_truncate before truncate on sign_off
  for each statement execute function gusset_jobs_append_only();

drop trigger if exists job_activity_append_only on job_activity;
create trigger job_activity_append_only before update or delete on job_activity
  for each row execute function gusset_jobs_append_only();
drop trigger if exists job_activity_no_truncate on job_activity;
create trigger job_activity_no_truncate before truncate on job_activity
  for each statement execute function gusset_jobs_append_only();

drop trigger if exists nonconformance_append_only on nonconformance;
create trigger nonconformance_append_only before update or delete on nonconformance
  for each row execute function gusset_jobs_append_only();
drop trigger if exists nonconformance_no_truncate on nonconformance;
create trigger nonconformance_no_truncate before truncate on nonconformance
  for each statement execute function gusset_jobs_append_only();

drop trigger if exists nonconformance_disposition_append_only on nonconformance_disposition;
create trigger nonconformance_disposition_append_only before update or delete on nonconformance_disposition
  for each row execute function gusset_jobs_append_only();
drop trigger if exists nonconformance_disposition_no_truncate on nonconformance_disposition;
create trigger nonconformance_disposition_no_truncate before truncate on nonconformance_disposition
  for each statement execute function gusset_jobs_append_only();

-- A checklist step with a sign-off is frozen: its value and what it is may not change, nor may it go.
create or replace function gusset_job_step_frozen() returns trigger language plpgsql as $$
begin
  if exists (select 1 from sign_off where step_id = old.id) then
    if tg_op = 'DELETE' then
      raise exception 'gusset: job_step % is signed; delete refused', old.id using errcode = 'GS409';
    end if;
    if new.value is distinct from old.value or new.spec is distinct from old.spec or new.kind is distinct from old.kind
       or new.step_key is distinct from old.step_key or new.job_id is distinct from old.job_id
       or new.shop_id is distinct from old.shop_id or new.position is distinct from old.position
       or new.section_key is distinct from old.section_key or new.title is distinct from old.title then
      raise exception 'gusset: job_step % is signed; its value is frozen (amend it instead)', old.id
        using errcode = 'GS409', hint = 'Corrections are amendments: a new sign-off pointing at the original.';
    end if;
  end if;
  if tg_op = 'DELETE' then
    return old;
  end if;
  return new;
end;
$$;

drop trigger if exists job_step_frozen on job_step;
create trigger job_step_frozen before update or delete on job_step
  for each row execute function gusset_job_step_frozen();

-- Weld passes are never deleted; before their round is signed a pass may only be struck out (removed_at).
create or replace function gusset_weld_pass_guard() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then
    raise exception 'gusset: weld_pass rows are kept; strike a pass out instead' using errcode = 'GS409';
  end if;
  -- A pass belongs to its joint's round; once that round is signed by its welder the pass stays as it is.
  if exists (select 1 from sign_off where step_id = old.step_id and coalesce(round, 1) = old.round) then
    raise exception 'gusset: weld_pass % belongs to a signed round of its joint; update refused', old.id using errcode = 'GS409';
  end if;
  if (to_jsonb(new) - 'removed_at' - 'removed_by') is distinct from (to_jsonb(old) - 'removed_at' - 'removed_by')
     or old.removed_at is not null then
    raise exception 'gusset: a weld pass is recorded once; only striking it out is allowed' using errcode = 'GS409';
  end if;
  return new;
end;
$$;

drop trigger if exists weld_pass_guard on weld_pass;
create trigger weld_pass_guard before update or delete on weld_pass
  for each row execute function gusset_weld_pass_guard();

-- Photos are never deleted; before their step is signed they may be taken off it, or tied to a nonconformance.
create or replace function gusset_photo_guard() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then
    raise exception 'gusset: photos are kept; delete refused' using errcode = 'GS409';
  end if;
  if (to_jsonb(new) - 'removed_at' - 'removed_by' - 'nonconformance_id') is distinct from (to_jsonb(old) - 'removed_at' - 'removed_by' - 'nonconformance_id')
     or (old.nonconformance_id is not null and new.nonconformance_id is distinct from old.nonconformance_id)
     or (old.removed_at is not null and new.removed_at is distinct from old.removed_at) then
    raise exception 'gusset: photo % is recorded once; update refused', old.id using errcode = 'GS409';
  end if;
  if new.removed_at is distinct from old.removed_at and old.step_id is not null
     and exists (select 1 from sign_off where step_id = old.step_id) then
    raise exception 'gusset: photo % belongs to a signed step; it stays', old.id using errcode = 'GS409';
  end if;
  return new;
end;
$$;

drop trigger if exists photo_guard on photo;
create trigger photo_guard before update or delete on photo
  for each row execute function gusset_photo_guard();

-- A released or void job is closed: its row no longer changes.
create or replace function gusset_job_closed() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then
    raise exception 'gusset: jobs are never deleted (void them)' using errcode = 'GS409';
  end if;
  if old.status in ('released', 'void') then
    raise exception 'gusset: job % is %; its record is closed', old.number, old.status using errcode = 'GS409';
  end if;
  return new;
end;
$$;

drop trigger if exists job_closed on job;
create trigger job_closed before update or delete on job
  for each row execute function gusset_job_closed();

-- Search: trigram index on the job's search text when pg_trgm can be had (it is a trusted extension, so
-- the database owner may create it); without it the list still works, by sequential scan of the shop's jobs.
do $$
begin
  create extension if not exists pg_trgm;
exception when insufficient_privilege or undefined_file then
  raise notice 'gusset: pg_trgm not available; job search runs without a trigram index';
end;
$$;

do $$
begin
  if exists (select 1 from pg_extension where extname = 'pg_trgm') then
    -- fastupdate off: new jobs go straight into the index rather than a pending list the planner
    -- prices high, so a fresh shop's searches use the index from the first job on.
    execute 'create index if not exists job_search_trgm_idx on job using gin (search_text gin_trgm_ops) with (fastupdate = off)';
    execute 'alter index job_search_trgm_idx set (fastupdate = off)';
  end if;
end;
$$;
