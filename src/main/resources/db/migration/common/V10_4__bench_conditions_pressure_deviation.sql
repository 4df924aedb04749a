-- Environmental conditions gain the barometric pressure (optional) and, for conditions outside the
-- procedure's limits, the deviation from the procedure with its reason (printed on the certificate,
-- ISO/IEC 17025:2017 7.8.2.1 n). The departure text names each value and the limit it broke, as checked
-- when the row was saved. Rows stay append-only (triggers of V7_2 cover the new columns); older rows
-- have no pressure and no deviation.
alter table bench_conditions add column pressure_kpa double precision;
alter table bench_conditions add column deviation_reason varchar(2000);
alter table bench_conditions add column departure varchar(1000);
alter table bench_conditions add constraint ck_bench_conditions_deviation
    check ((deviation_reason is null) = (departure is null));
