create or replace function dockgate_refuse_change() returns trigger language plpgsql as $$
begin
    raise exception 'Table % is append-only: % refused', tg_table_name, tg_op;
end;
$$;

create trigger audit_entry_append_only before update or delete on audit_entry
    for each row execute function dockgate_refuse_change();
create trigger audit_entry_no_truncate before truncate on audit_entry
    for each statement execute function dockgate_refuse_change();
create trigger audit_seal_append_only before update or delete on audit_seal
    for each row execute function dockgate_refuse_change();
create trigger audit_seal_no_truncate before truncate on audit_seal
    for each statement execute function dockgate_refuse_change();
