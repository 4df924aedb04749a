-- Signed certificates never change (issue 6): the database refuses UPDATE, DELETE and TRUNCATE on the
-- register. dockgate_refuse_change() comes from V2_2.
create trigger issued_certificate_append_only before update or delete on issued_certificate
    for each row execute function dockgate_refuse_change();
create trigger issued_certificate_no_truncate before truncate on issued_certificate
    for each statement execute function dockgate_refuse_change();
create trigger issued_certificate_serial_append_only before update or delete on issued_certificate_serial
    for each row execute function dockgate_refuse_change();
create trigger issued_certificate_serial_no_truncate before truncate on issued_certificate_serial
    for each statement execute function dockgate_refuse_change();
create trigger certificate_supersession_append_only before update or delete on certificate_supersession
    for each row execute function dockgate_refuse_change();
create trigger certificate_supersession_no_truncate before truncate on certificate_supersession
    for each statement execute function dockgate_refuse_change();
