-- 0150: reports as records. Each issue of a wafer's report is a numbered revision, never overwritten, with what it
-- was made from and the hash of its content; requests (re-analysis, a new field) wait here until a revision answers.
CREATE TABLE report_revisions (
    id               INTEGER PRIMARY KEY,
    wafer            TEXT NOT NULL,
    revision         INTEGER NOT NULL,
    created_us       INTEGER NOT NULL,
    reason           TEXT NOT NULL,
    requester        TEXT NOT NULL,
    software_version TEXT NOT NULL,
    config_sha256    TEXT NOT NULL,
    config_json      TEXT NOT NULL,
    model_id         TEXT NOT NULL,
    inputs_json      TEXT NOT NULL,
    content_sha256   TEXT NOT NULL,
    folder           TEXT NOT NULL,
    verdict          TEXT NOT NULL,
    digest_json      TEXT NOT NULL,
    UNIQUE (wafer, revision)
);
CREATE INDEX report_revisions_by_hash ON report_revisions (content_sha256);

CREATE TABLE report_requests (
    id           INTEGER PRIMARY KEY,
    wafer        TEXT NOT NULL,
    requested_us INTEGER NOT NULL,
    requester    TEXT NOT NULL,
    reason       TEXT NOT NULL,
    revision     INTEGER
);
CREATE INDEX report_requests_pending ON report_requests (wafer, id) WHERE revision IS NULL;
