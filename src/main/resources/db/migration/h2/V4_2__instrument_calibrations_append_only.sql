create trigger instrument_calibration_append_only before update, delete on instrument_calibration
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
create trigger instrument_uncertainty_band_append_only before update, delete on instrument_uncertainty_band
    for each row call 'org.dockgate.audit.AppendOnlyTrigger';
