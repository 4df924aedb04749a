-- Signed certificates never change (issue 6): the database refuses UPDATE and DELETE on the register.
create trigger issued_certificate_append_only before update, delete on issued_certificate
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger issued_certificate_serial_append_only before update, delete on issued_certificate_serial
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger certificate_supersession_append_only before update, delete on certificate_supersession
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
