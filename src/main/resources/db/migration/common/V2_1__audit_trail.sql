-- The audit trail: append-only (vendor triggers in V2_2), hash-chained (entry_hash covers the entry's
-- canonical content and previous_hash). sequence_no is the position in the one linear chain.
create table audit_entry (
    sequence_no   bigint        primary key,
    occurred_at   timestamp(6) with time zone not null,
    actor_id      varchar(64)   not null,
    actor_name    varchar(200)  not null,
    channel       varchar(16)   not null,
    client        varchar(200)  not null,
    entity_type   varchar(64)   not null,
    entity_id     varchar(128)  not null,
    action        varchar(64)   not null,
    summary       varchar(2000) not null,
    changes       varchar       not null,
    reason        varchar(2000),
    previous_hash varchar(64)   not null,
    entry_hash    varchar(64)   not null
);
create index ix_audit_entry_entity on audit_entry (entity_type, entity_id, sequence_no);
create index ix_audit_entry_actor on audit_entry (actor_id, sequence_no);
create index ix_audit_entry_action on audit_entry (action, sequence_no);
create index ix_audit_entry_time on audit_entry (occurred_at);

-- The head of the chain. Appending locks this one row (select ... for update), which serialises
-- concurrent writers into one linear chain.
create table audit_head (
    id            integer     primary key,
    last_sequence bigint      not null,
    last_hash     varchar(64) not null
);
insert into audit_head (id, last_sequence, last_hash)
values (1, 0, '0000000000000000000000000000000000000000000000000000000000000000');

-- Seals: the head hash and entry count at a moment, signed with the lab's seal key (kept outside the
-- database). The seal is also an entry of the chain itself and written to a file.
create table audit_seal (
    sequence_no   bigint        primary key references audit_entry (sequence_no),
    sealed_count  bigint        not null,
    head_hash     varchar(64)   not null,
    sealed_at     timestamp(6) with time zone not null,
    seal_text     varchar(4000) not null
);

-- H2's TRUNCATE ignores triggers but refuses a table that a foreign key references.
create table audit_truncate_guard (
    guarded_entry bigint references audit_entry (sequence_no),
    guarded_seal  bigint references audit_seal (sequence_no)
);
