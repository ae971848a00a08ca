-- A membership's legal name (printed on its sign-offs) starts as the account's name when the insert names
-- none, so older callers and raw inserts keep working; afterwards only a lead changes it. Safe to re-run.

create or replace function gusset_membership_legal_name() returns trigger
language plpgsql as $$
begin
  if new.legal_name is null or length(trim(new.legal_name)) = 0 then
    select name into new.legal_name from "user" where id = new.user_id;
  end if;
  return new;
end;
$$;

drop trigger if exists membership_legal_name on membership;
create trigger membership_legal_name before insert on membership
  for each row execute function gusset_membership_legal_name();
