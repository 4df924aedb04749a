-- dockgate_refuse_change() is created in V2_2.
create trigger bench_reading_append_only before update or delete on bench_reading
    for each row execute function dockgate_refuse_change();
create trigger bench_reading_no_truncate before truncate on bench_reading
    for each statement execute function dockgate_refuse_change();
create trigger bench_conditions_append_only before update or delete on bench_conditions
    for each row execute function dockgate_refuse_change();
create trigger bench_conditions_no_truncate before truncate on bench_conditions
    for each statement execute function dockgate_refuse_change();
create trigger bench_import_append_only before update or delete on bench_import
    for each row execute function dockgate_refuse_change();
create trigger bench_import_no_truncate before truncate on bench_import
    for each statement execute function dockgate_refuse_change();
