-- Several daemons share one journal and each decides the notices of its own curves, so what a
-- person sets on one instance must hold on every instance.
--
-- desk_change: one row whose counter goes up in the same transaction as every quiet period set
-- or lifted and every acknowledgement. An instance reads this row before it lets a notice out and
-- reads quiet periods and acknowledgements again only when the counter moved. A counter rather
-- than the highest id: identity values are handed out before commit, so a row with a lower id can
-- become visible after one with a higher id, and a lift changes no id at all.
CREATE TABLE desk_change (
    id       INTEGER  PRIMARY KEY,
    counter  BIGINT   NOT NULL
);
INSERT INTO desk_change (id, counter) VALUES (1, 0);

-- what-if jobs of the API: run by the instance that accepted them, readable from every instance.
-- The running instance writes progress and heartbeat_at every second and the result (JSON) at the
-- end; a job still running whose heartbeat has stopped is shown as abandoned.
CREATE TABLE what_if_job (
    id            VARCHAR(40)    PRIMARY KEY,
    history       VARCHAR(200)   NOT NULL,
    state         VARCHAR(10)    NOT NULL,
    quotes_done   BIGINT         NOT NULL,
    quotes_total  BIGINT         NOT NULL,
    submitted_at  TIMESTAMP WITH TIME ZONE NOT NULL,
    started_at    TIMESTAMP WITH TIME ZONE,
    finished_at   TIMESTAMP WITH TIME ZONE,
    heartbeat_at  TIMESTAMP WITH TIME ZONE NOT NULL,
    result        TEXT,
    error         VARCHAR(1000),
    recorded_at   TIMESTAMP WITH TIME ZONE NOT NULL
);
CREATE INDEX what_if_job_submitted ON what_if_job (submitted_at);
