-- 0010: fields may wait unassigned (no wafer yet), keep their place in the drop folder, position on the wafer and
-- intake status; wafers remember their process (recipe family); model fits carry their acceptance.
CREATE TABLE fields_new (
    id             INTEGER PRIMARY KEY,
    wafer_id       INTEGER REFERENCES wafers(id),
    file_path      TEXT NOT NULL,
    relative_path  TEXT NOT NULL DEFAULT '',
    sha256         TEXT NOT NULL UNIQUE,
    size_bytes     INTEGER NOT NULL DEFAULT 0,
    width_px       INTEGER,
    height_px      INTEGER,
    nm_per_px      REAL,
    position_x_mm  REAL,
    position_y_mm  REAL,
    acquired_us    INTEGER,
    imported_us    INTEGER NOT NULL,
    status         TEXT NOT NULL DEFAULT 'Unassigned',
    problem        TEXT,
    metadata_json  TEXT
);
INSERT INTO fields_new (id, wafer_id, file_path, sha256, width_px, height_px, nm_per_px, acquired_us, imported_us, metadata_json)
    SELECT id, wafer_id, file_path, sha256, width_px, height_px, nm_per_px, acquired_us, imported_us, metadata_json FROM fields;
DROP TABLE fields;
ALTER TABLE fields_new RENAME TO fields;
CREATE INDEX fields_by_wafer ON fields (wafer_id);
CREATE INDEX fields_by_status ON fields (status);

ALTER TABLE wafers ADD COLUMN process TEXT;
ALTER TABLE analyses ADD COLUMN diffusion_length_nm REAL;
ALTER TABLE analyses ADD COLUMN settings_json TEXT;
ALTER TABLE analyses ADD COLUMN problem TEXT;
CREATE INDEX analyses_by_field ON analyses (field_id, id DESC);
CREATE INDEX reports_by_wafer ON reports (wafer_id, id DESC);
ALTER TABLE model_fits ADD COLUMN accepted_us INTEGER;
ALTER TABLE model_fits ADD COLUMN accepted_by TEXT;
ALTER TABLE model_fits ADD COLUMN wafers_json TEXT;
CREATE INDEX model_fits_by_process ON model_fits (process, id DESC);
