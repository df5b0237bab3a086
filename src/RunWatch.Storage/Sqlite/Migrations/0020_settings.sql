-- 0020: settings an admin may edit from the dashboard, persisted so they survive a restart. Configuration seeds
-- them on first start; afterwards the stored row is the one in force. Every change also goes to audit_entries.
CREATE TABLE qc_specifications (
    recipe     TEXT PRIMARY KEY,  -- '' is the default specification for recipes not listed
    spec_json  TEXT NOT NULL,
    updated_us INTEGER NOT NULL,
    updated_by TEXT NOT NULL
);

CREATE TABLE reminder_settings (
    rule_id    TEXT PRIMARY KEY,
    threshold  REAL NOT NULL,
    unit       TEXT NOT NULL,
    window_s   REAL NOT NULL,
    updated_us INTEGER NOT NULL,
    updated_by TEXT NOT NULL
);
