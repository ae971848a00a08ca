-- Procedure versions: a published or retired version never changes, whoever asks (the app's role or a
-- superuser). The one change allowed is published -> retired, touching only status and retired_at.
-- A draft may be edited, published or deleted; nothing else may be deleted. Safe to re-run.

create or replace function gusset_procedure_version_guard() returns trigger
language plpgsql as $$
declare
  owner_shop uuid;
begin
  if tg_op = 'DELETE' then
    if old.status <> 'draft' then
      raise exception 'procedure version % of procedure % is %: it can never be deleted', old.number, old.procedure_id, old.status
        using errcode = 'restrict_violation', hint = 'Retire it instead; a new version starts as a draft copy.';
    end if;
    return old;
  end if;

  if tg_op = 'INSERT' then
    select shop_id into owner_shop from procedure where id = new.procedure_id;
    if owner_shop is distinct from new.shop_id then
      raise exception 'procedure version shop does not match its procedure' using errcode = 'check_violation';
    end if;
  end if;

  if tg_op = 'UPDATE' then
    if (new.id, new.shop_id, new.procedure_id, new.number, new.author_id, new.created_at)
       is distinct from (old.id, old.shop_id, old.procedure_id, old.number, old.author_id, old.created_at) then
      raise exception 'procedure version % of procedure %: its identity never changes', old.number, old.procedure_id
        using errcode = 'restrict_violation';
    end if;
    if old.status = 'published' and new.status = 'retired' then
      if (new.title, new.scope, new.code, new.content, new.content_hash, new.change_note, new.publisher_id, new.updated_at, new.published_at)
         is distinct from (old.title, old.scope, old.code, old.content, old.content_hash, old.change_note, old.publisher_id, old.updated_at, old.published_at)
         or new.retired_at is null then
        raise exception 'procedure version % of procedure %: retiring changes only status and retired_at', old.number, old.procedure_id
          using errcode = 'restrict_violation';
      end if;
      return new;
    end if;
    if old.status <> 'draft' then
      raise exception 'procedure version % of procedure % is %: it never changes', old.number, old.procedure_id, old.status
        using errcode = 'restrict_violation', hint = 'Start a new version: it begins as a draft copy of the latest.';
    end if;
    if new.status = 'retired' then
      raise exception 'procedure version % of procedure %: a draft is published before it can be retired', old.number, old.procedure_id
        using errcode = 'restrict_violation';
    end if;
  end if;

  -- Whatever is published (inserted or updated into it) carries its seal, note and publisher.
  if new.status in ('published', 'retired') then
    if new.content_hash is null or new.content_hash !~ '^[0-9a-f]{64}$' then
      raise exception 'a published procedure version needs its SHA-256 content hash' using errcode = 'check_violation';
    end if;
    if new.change_note is null or length(btrim(new.change_note)) = 0 then
      raise exception 'a published procedure version needs a change note' using errcode = 'check_violation';
    end if;
    if new.publisher_id is null or new.published_at is null then
      raise exception 'a published procedure version needs its publisher and publication time' using errcode = 'check_violation';
    end if;
  end if;
  if new.status = 'retired' and new.retired_at is null then
    raise exception 'a retired procedure version needs its retirement time' using errcode = 'check_violation';
  end if;
  if new.status = 'draft' and (new.published_at is not null or new.retired_at is not null or new.publisher_id is not null) then
    raise exception 'a draft has no publisher, publication or retirement time' using errcode = 'check_violation';
  end if;
  return new;
end;
$$;

drop trigger if exists procedure_version_guard on procedure_version;
create trigger procedure_version_guard
  before insert or update or delete on procedure_version
  for each row execute function gusset_procedure_version_guard();

-- TRUNCATE skips row triggers: refuse it while any version is published or retired.
create or replace function gusset_procedure_version_truncate_guard() returns trigger
language plpgsql as $$
begin
  if exists (select 1 from procedure_version where status <> 'draft') then
    raise exception 'procedure_version holds published or retired versions: it can never be truncated'
      using errcode = 'restrict_violation';
  end if;
  return null;
end;
$$;

drop trigger if exists procedure_version_truncate_guard on procedure_version;
create trigger procedure_version_truncate_guard
  before truncate on procedure_version
  for each statement execute function gusset_procedure_version_truncate_guard();

-- A procedure never moves to another shop.
create or replace function gusset_procedure_guard() returns trigger
language plpgsql as $$
begin
  if new.id is distinct from old.id or new.shop_id is distinct from old.shop_id or new.created_at is distinct from old.created_at then
    raise exception 'procedure %: its identity and shop never change', old.id using errcode = 'restrict_violation';
  end if;
  return new;
end;
$$;

drop trigger if exists procedure_guard on procedure;
create trigger procedure_guard
  before update on procedure
  for each row execute function gusset_procedure_guard();
