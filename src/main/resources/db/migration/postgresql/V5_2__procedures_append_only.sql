create trigger procedure_edit_append_only before update or delete on procedure_edit
    for each row execute function dockgate_refuse_change();
create trigger procedure_revision_append_only before update or delete on procedure_revision
    for each row execute function dockgate_refuse_change();
create trigger procedure_revision_no_truncate before truncate on procedure_revision
    for each statement execute function dockgate_refuse_change();
create trigger procedure_supersession_append_only before update or delete on procedure_supersession
    for each row execute function dockgate_refuse_change();
