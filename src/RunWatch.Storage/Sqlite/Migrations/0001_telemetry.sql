-- 0001: chambers, channels, samples, events, runs, alerts, dead letters, daemon heartbeat.
-- Timestamps are INTEGER microseconds since the Unix epoch (UTC).
CREATE TABLE chambers (
    id          INTEGER PRIMARY KEY,
    name        TEXT NOT NULL UNIQUE,
    site        TEXT NOT NULL,
    description TEXT
);

CREATE TABLE channels (
    id               INTEGER PRIMARY KEY,
    chamber_id       INTEGER NOT NULL REFERENCES chambers(id),
    name             TEXT NOT NULL,
    role             TEXT NOT NULL,
    unit             TEXT NOT NULL,
    min_value        REAL,
    max_value        REAL,
    calibration_json TEXT,
    UNIQUE (chamber_id, name)
);

-- Idempotent key (chamber, channel, timestamp, seq); seq is -1 when the publisher sent none.
CREATE TABLE samples (
    chamber_id INTEGER NOT NULL,
    channel_id INTEGER NOT NULL,
    t_us       INTEGER NOT NULL,
    seq        INTEGER NOT NULL,
    value      REAL NOT NULL,
    PRIMARY KEY (chamber_id, channel_id, t_us, seq)
) WITHOUT ROWID;

CREATE TABLE events (
    id           INTEGER PRIMARY KEY,
    chamber_id   INTEGER NOT NULL REFERENCES chambers(id),
    t_us         INTEGER NOT NULL,
    type         TEXT NOT NULL,
    run_name     TEXT,
    text         TEXT,
    payload_json TEXT NOT NULL,
    UNIQUE (chamber_id, t_us, type)
);

CREATE TABLE runs (
    id              INTEGER PRIMARY KEY,
    chamber_id      INTEGER NOT NULL REFERENCES chambers(id),
    name            TEXT NOT NULL,
    source          TEXT NOT NULL,
    status          TEXT NOT NULL,
    end_reason      TEXT,
    recipe          TEXT,
    wafers_json     TEXT NOT NULL DEFAULT '[]',
    setpoint_c      REAL,
    planned_s       REAL,
    started_us      INTEGER NOT NULL,
    ended_us        INTEGER,
    last_sample_us  INTEGER,
    l_nom_nm        REAL,
    l_eff_nm        REAL,
    t_eff_c         REAL,
    coverage        REAL,
    excursions_json TEXT,
    summary_json    TEXT,
    UNIQUE (chamber_id, name, started_us)
);
CREATE INDEX runs_by_start ON runs (started_us DESC);
CREATE INDEX runs_open ON runs (status) WHERE status = 'open';

CREATE TABLE alerts (
    id              INTEGER PRIMARY KEY,
    alert_key       TEXT NOT NULL,
    chamber         TEXT,
    run_id          INTEGER,
    kind            TEXT NOT NULL,
    severity        TEXT NOT NULL,
    state           TEXT NOT NULL,
    message         TEXT NOT NULL,
    raised_us       INTEGER NOT NULL,
    acknowledged_us INTEGER,
    acknowledged_by TEXT,
    cleared_us      INTEGER,
    updated_us      INTEGER NOT NULL,
    peak_value      REAL,
    detail_json     TEXT
);
CREATE INDEX alerts_by_raised ON alerts (raised_us DESC);
CREATE INDEX alerts_not_normal ON alerts (state) WHERE state <> 'normal';

CREATE TABLE dead_letters (
    id          INTEGER PRIMARY KEY AUTOINCREMENT,
    received_us INTEGER NOT NULL,
    topic       TEXT NOT NULL,
    reason      TEXT NOT NULL,
    detail      TEXT,
    payload     BLOB,
    payload_len INTEGER NOT NULL
);

CREATE TABLE daemon_heartbeat (
    id    INTEGER PRIMARY KEY CHECK (id = 1),
    at_us INTEGER NOT NULL
);
INSERT INTO daemon_heartbeat (id, at_us) VALUES (1, 0);
