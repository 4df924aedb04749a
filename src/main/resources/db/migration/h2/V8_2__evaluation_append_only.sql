create trigger unit_evaluation_snapshot_append_only before update, delete on unit_evaluation_snapshot
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger nonconformance_report_append_only before update, delete on nonconformance_report
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger concession_approval_append_only before update, delete on concession_approval
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
