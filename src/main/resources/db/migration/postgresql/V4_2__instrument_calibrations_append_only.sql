-- dockgate_refuse_change() is created in V2_2.
create trigger instrument_calibration_append_only before update or delete on instrument_calibration
    for each row execute function dockgate_refuse_change();
create trigger instrument_calibration_no_truncate before truncate on instrument_calibration
    for each statement execute function dockgate_refuse_change();
create trigger instrument_uncertainty_band_append_only before update or delete on instrument_uncertainty_band
    for each row execute function dockgate_refuse_change();
create trigger instrument_uncertainty_band_no_truncate before truncate on instrument_uncertainty_band
    for each statement execute function dockgate_refuse_change();
