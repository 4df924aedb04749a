create trigger specification_revision_append_only before update, delete on specification_revision
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
