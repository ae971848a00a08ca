-- WPS revisions: a published revision never changes, whoever asks (the app's role, the owner, a superuser).
-- The one change allowed to it is going out of use: status published -> retired with who, when and why,
-- every other column as it was. A retired revision never changes at all. Only a draft may be deleted.
-- Safe to run again: functions are replaced, triggers dropped first.

create or replace function gusset_wps_revision_guard() returns trigger
language plpgsql as $$
declare
  -- The columns that may change when a published revision is retired.
  retire_columns constant text[] := array['status', 'retired_at', 'retired_by', 'retire_note', 'updated_at'];
begin
  if tg_op = 'DELETE' then
    if old.status <> 'draft' then
      raise exception 'WPS revision % (%) is %: it is never deleted', old.number, old.id, old.status
        using errcode = 'integrity_constraint_violation', hint = 'wps_revision_immutable';
    end if;
    return old;
  end if;

  if new.id <> old.id or new.shop_id <> old.shop_id or new.wps_id <> old.wps_id or new.number <> old.number then
    raise exception 'WPS revision % (%) keeps its shop, WPS and number', old.number, old.id
      using errcode = 'integrity_constraint_violation', hint = 'wps_revision_immutable';
  end if;

  if old.status = 'published' then
    if new.status <> 'retired'
       or (to_jsonb(new) - retire_columns) is distinct from (to_jsonb(old) - retire_columns) then
      raise exception 'WPS revision % (%) is published and never changes; start a new revision', old.number, old.id
        using errcode = 'integrity_constraint_violation', hint = 'wps_revision_immutable';
    end if;
  elsif old.status = 'retired' then
    raise exception 'WPS revision % (%) is retired and never changes', old.number, old.id
      using errcode = 'integrity_constraint_violation', hint = 'wps_revision_immutable';
  elsif new.status = 'retired' then
    -- A draft goes to published first; retiring is for revisions that were in use.
    raise exception 'WPS revision % (%) is a draft: publish it before it can be retired', old.number, old.id
      using errcode = 'integrity_constraint_violation', hint = 'wps_revision_immutable';
  end if;
  return new;
end;
$$;

drop trigger if exists wps_revision_guard on wps_revision;
create trigger wps_revision_guard
  before update or delete on wps_revision
  for each row execute function gusset_wps_revision_guard();

-- A WPS's reference is quoted on weld steps and printed on travellers: it never changes, and a WPS with
-- any published or retired revision is never deleted.
create or replace function gusset_wps_guard() returns trigger
language plpgsql as $$
begin
  if tg_op = 'DELETE' then
    if exists (select 1 from wps_revision r where r.wps_id = old.id and r.status <> 'draft') then
      raise exception 'WPS % has published revisions: it is never deleted', old.reference
        using errcode = 'integrity_constraint_violation', hint = 'wps_revision_immutable';
    end if;
    return old;
  end if;
  if new.reference <> old.reference or new.shop_id <> old.shop_id or new.id <> old.id then
    raise exception 'WPS % keeps its reference and shop', old.reference
      using errcode = 'integrity_constraint_violation', hint = 'wps_revision_immutable';
  end if;
  return new;
end;
$$;

drop trigger if exists wps_guard on wps;
create trigger wps_guard
  before update or delete on wps
  for each row execute function gusset_wps_guard();
