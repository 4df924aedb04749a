-- A calibration states the range it was calibrated over and the smallest U it gives anywhere
-- (U = max(floor, band figure)), so a percent-of-reading band never gives U = 0 at zero input and an
-- instrument is not used outside the range its certificate covers. Records entered earlier keep null here:
-- their calibrated range is the instrument's range and their floor is derived (see InstrumentView).
alter table instrument_calibration add column calibrated_min double precision;
alter table instrument_calibration add column calibrated_max double precision;
alter table instrument_calibration add column uncertainty_floor double precision;
alter table instrument_calibration add constraint ck_instrument_calibration_calibrated_range
    check (calibrated_min is null or calibrated_max is null or calibrated_max > calibrated_min);
alter table instrument_calibration add constraint ck_instrument_calibration_floor
    check (uncertainty_floor is null or uncertainty_floor > 0);
