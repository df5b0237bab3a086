-- 0160: engineers' notes on runs and wafers (plain text, never edited; each insert has its audit entry).
CREATE TABLE engineer_notes (
    id         INTEGER PRIMARY KEY AUTOINCREMENT,
    subject    TEXT NOT NULL CHECK (subject IN ('run', 'wafer')),
    subject_id TEXT NOT NULL,
    body       TEXT NOT NULL,
    author     TEXT NOT NULL,
    written_us INTEGER NOT NULL
);
CREATE INDEX engineer_notes_by_subject ON engineer_notes (subject, subject_id, written_us DESC, id DESC);
