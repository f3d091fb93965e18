-- Several daemons share one journal: before a delivery attempt an instance claims the outbox row
-- for a while (a lease), so that two dispatchers never send the same delivery at once. A lease
-- left by an instance that died expires and another takes the row over.
ALTER TABLE delivery ADD COLUMN claimed_by VARCHAR(100);
ALTER TABLE delivery ADD COLUMN claimed_until TIMESTAMP WITH TIME ZONE;
