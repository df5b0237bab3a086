-- 0040: a queued field is claimed by one worker for a while (its lease), so that daemons sharing the store analyse
-- each field once (claims use FOR UPDATE SKIP LOCKED) and a field whose worker died is taken again after its lease.
ALTER TABLE fields ADD COLUMN claimed_by text;
ALTER TABLE fields ADD COLUMN claimed_until_us bigint;
CREATE INDEX fields_queued ON fields (id) WHERE status = 'Queued';
