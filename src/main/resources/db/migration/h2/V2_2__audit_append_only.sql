create trigger audit_entry_append_only before update, delete on audit_entry
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger audit_seal_append_only before update, delete on audit_seal
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
