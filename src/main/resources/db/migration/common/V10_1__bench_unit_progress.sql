-- Per-unit progress for the work queue: how many test points of each unit have a reading. Kept up to date
-- in the transaction that saves the readings (BenchService, ReadingImport), so the queue reads one row per
-- unit instead of counting every reading of every open lot. A correction adds no point. Back-filled from
-- the readings saved so far.
create table bench_unit_progress (
    lot_id     bigint       not null,
    serial     varchar(100) not null,
    slots_done integer      not null,
    constraint pk_bench_unit_progress primary key (lot_id, serial)
);

insert into bench_unit_progress (lot_id, serial, slots_done)
select lot_id, serial, count(distinct slot_no) from bench_reading group by lot_id, serial;
