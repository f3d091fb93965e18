-- Checkpoints of each curve's in-memory state (its recent snapshots, its spreads' monitors): a
-- cache that lets a start replay only the quotes recorded after it. One row per curve, replaced as
-- a whole; the quotes stay the record. A row written under other watches, or in another layout,
-- is passed over and that curve rebuilt from its quotes.
CREATE TABLE curve_checkpoint (
    curve        VARCHAR(100)  PRIMARY KEY,
    seq          BIGINT        NOT NULL,
    watches      VARCHAR(64)   NOT NULL,
    layout       INTEGER       NOT NULL,
    image        BYTEA         NOT NULL,
    recorded_at  TIMESTAMP WITH TIME ZONE NOT NULL
);

-- a quote for a date the daemon no longer holds in memory is merged into that date's snapshot as
-- the journal has it: found by curve and date
CREATE INDEX quote_curve_date ON quote (curve, market_date);

-- whether another instance moved a curve on: its highest sequence number, one index lookup
CREATE INDEX quote_curve_seq ON quote (curve, seq);
