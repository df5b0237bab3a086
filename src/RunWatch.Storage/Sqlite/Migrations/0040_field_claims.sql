-- 0040: a queued field is claimed by one worker for a while (its lease), so that daemons sharing a store analyse
-- each field once and a field whose worker died is picked up again when the lease runs out.
ALTER TABLE fields ADD COLUMN claimed_by TEXT;
ALTER TABLE fields ADD COLUMN claimed_until_us INTEGER;
