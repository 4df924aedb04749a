create trigger procedure_edit_append_only before update, delete on procedure_edit
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger procedure_revision_append_only before update, delete on procedure_revision
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger procedure_supersession_append_only before update, delete on procedure_supersession
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
