create trigger unit_evaluation_snapshot_append_only before update or delete on unit_evaluation_snapshot
    for each row execute function dockgate_refuse_change();
create trigger nonconformance_report_append_only before update or delete on nonconformance_report
    for each row execute function dockgate_refuse_change();
create trigger concession_approval_append_only before update or delete on concession_approval
    for each row execute function dockgate_refuse_change();
