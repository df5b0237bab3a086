-- 0002: room for the wafer pipeline (SEM fields, analyses, model fits, reports) and an audit trail.
-- The rooms that fill these tables extend the store interface; the daemon only creates them.
CREATE TABLE wafers (
    id         INTEGER PRIMARY KEY,
    name       TEXT NOT NULL UNIQUE,
    run_id     INTEGER REFERENCES runs(id),
    created_us INTEGER NOT NULL,
    notes      TEXT
);

CREATE TABLE fields (
    id            INTEGER PRIMARY KEY,
    wafer_id      INTEGER NOT NULL REFERENCES wafers(id),
    file_path     TEXT NOT NULL,
    sha256        TEXT NOT NULL UNIQUE,
    width_px      INTEGER,
    height_px     INTEGER,
    nm_per_px     REAL,
    acquired_us   INTEGER,
    imported_us   INTEGER NOT NULL,
    metadata_json TEXT
);

CREATE TABLE analyses (
    id           INTEGER PRIMARY KEY,
    field_id     INTEGER NOT NULL REFERENCES fields(id),
    started_us   INTEGER NOT NULL,
    finished_us  INTEGER,
    status       TEXT NOT NULL,
    wire_count   INTEGER,
    results_json TEXT
);

CREATE TABLE model_fits (
    id           INTEGER PRIMARY KEY,
    process      TEXT NOT NULL,
    model        TEXT NOT NULL,
    fitted_us    INTEGER NOT NULL,
    params_json  TEXT NOT NULL,
    r_squared    REAL,
    rmse_nm      REAL,
    wafer_count  INTEGER
);

CREATE TABLE reports (
    id           INTEGER PRIMARY KEY,
    wafer_id     INTEGER NOT NULL REFERENCES wafers(id),
    created_us   INTEGER NOT NULL,
    verdict      TEXT,
    format       TEXT NOT NULL,
    file_path    TEXT NOT NULL,
    summary_json TEXT
);

CREATE TABLE audit_entries (
    id          INTEGER PRIMARY KEY,
    at_us       INTEGER NOT NULL,
    actor       TEXT NOT NULL,
    action      TEXT NOT NULL,
    subject     TEXT,
    detail_json TEXT
);
CREATE INDEX audit_by_time ON audit_entries (at_us DESC);
