-- The measurement chain of a reading (issue 11): the value the reference actually applied beside the nominal
-- set point, and the readout and excitation instruments beside the stimulus ("instrument"). Readings saved
-- before keep null here: their applied value is their set point and their readout was not recorded (the
-- evaluation says so). The register records a readout's resolution (its digit, in the instrument's unit).
alter table bench_reading add column applied double precision;
alter table bench_reading add column readout varchar(40);
alter table bench_reading add column excitation varchar(40);
alter table reference_instrument add column resolution double precision;
