-- 0140: the channel a reminder role reads on a chamber, when an admin sets it on the dashboard instead of the
-- chamber configuration's channel roles. channel NULL means "no channel": the role's reminders are not watched.
CREATE TABLE reminder_bindings (
    chamber    text NOT NULL,
    role       text NOT NULL,
    channel    text,
    updated_us bigint NOT NULL,
    updated_by text NOT NULL,
    PRIMARY KEY (chamber, role)
);
