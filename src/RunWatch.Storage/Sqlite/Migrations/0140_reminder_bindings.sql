-- 0140: the channel a reminder role reads on a chamber, when an admin sets it on the dashboard instead of the
-- chamber configuration's channel roles. channel NULL means "no channel": the role's reminders are not watched.
CREATE TABLE reminder_bindings (
    chamber    TEXT NOT NULL,
    role       TEXT NOT NULL,
    channel    TEXT,
    updated_us INTEGER NOT NULL,
    updated_by TEXT NOT NULL,
    PRIMARY KEY (chamber, role)
);
