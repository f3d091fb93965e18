-- Recovery replays quotes in the pipeline's order (seq), not by row id: PostgreSQL hands identity
-- values to each connection in cached blocks, so ids need not follow commit order. This index
-- lets the replay read in that order without sorting the whole table.
CREATE INDEX quote_replay ON quote (seq, id);
