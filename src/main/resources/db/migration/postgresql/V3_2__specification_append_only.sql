create trigger specification_revision_append_only before update or delete on specification_revision
    for each row execute function dockgate_refuse_change();
create trigger specification_revision_no_truncate before truncate on specification_revision
    for each statement execute function dockgate_refuse_change();
