create trigger bench_reading_append_only before update, delete on bench_reading
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger bench_conditions_append_only before update, delete on bench_conditions
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger bench_import_append_only before update, delete on bench_import
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
