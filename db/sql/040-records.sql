-- The record chain and QR tokens are append-only for every role, the owner and superusers included.
create or replace function gusset_refuse_change() returns trigger language plpgsql as $$
begin
  raise exception '% rows are append-only: % refused', tg_table_name, tg_op using errcode = 'P0001';
end $$;

drop trigger if exists record_entry_append_only on record_entry;
create trigger record_entry_append_only before update or delete on record_entry
  for each row execute function gusset_refuse_change();

drop trigger if exists record_entry_no_truncate on record_entry;
create trigger record_entry_no_truncate before truncate on record_entry
  for each statement execute function gusset_refuse_change();

drop trigger if exists job_token_append_only on job_token;
create trigger job_token_append_only before update or delete on job_token
  for each row execute function gusset_refuse_change();
