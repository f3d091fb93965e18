-- slopewatch's PostgreSQL journal: a login role and a database it owns, nothing more.
--
--   psql -v ON_ERROR_STOP=1 -h db.example.org -U postgres -d postgres \
--        -v password="$SLOPEWATCH_JOURNAL_PASSWORD" -f deploy/postgres/setup.sql
--
-- Variables (psql -v NAME=value):
--   password   required: the role's password; the same value goes into SLOPEWATCH_JOURNAL_PASSWORD
--   role       the login role   (default slopewatch)
--   dbname     the database     (default slopewatch)
--
-- Run it as a superuser, or a role with CREATEROLE and CREATEDB, connected to any database
-- ("postgres"). It can be run again: an existing role gets the new password (a way to rotate
-- it), an existing database is kept. The schema itself is not made here: the daemon's Flyway
-- migrations (db/journal, V1__journal, V2__alerts, ...) create and upgrade it on first start,
-- as the owner; two instances starting together take turns through Flyway's lock.
--
-- The password travels in the CREATE/ALTER ROLE statement: with log_statement = 'ddl' or 'all'
-- the server log records it. Turn that off for the run, or set the password afterwards with
-- psql's interactive \password command.
--
-- Least privilege:
--   - the role can log in and owns its database and the tables Flyway creates there; it is no
--     superuser and cannot create roles or databases, replicate or bypass row security;
--   - nobody else (PUBLIC) may connect to the database or create objects in its schema;
--   - a connection limit above what two instances use (8 pooled connections each by default,
--     slopewatch.journal.max-connections) leaves room for a migration and an operator session.

\set ON_ERROR_STOP on

\if :{?password}
\else
  \echo 'setup.sql: give the password: psql -v password=... -f deploy/postgres/setup.sql'
  DO $$ BEGIN RAISE EXCEPTION 'missing psql variable "password"'; END $$;
\endif
\if :{?role}
\else
  \set role slopewatch
\endif
\if :{?dbname}
\else
  \set dbname slopewatch
\endif

SELECT length(:'password') >= 12 AS password_long_enough \gset
\if :password_long_enough
\else
  DO $$ BEGIN RAISE EXCEPTION 'the password must have at least 12 characters'; END $$;
\endif

-- the role: created, or its password and attributes brought back to these
SELECT format('CREATE ROLE %I', :'role')
 WHERE NOT EXISTS (SELECT FROM pg_roles WHERE rolname = :'role') \gexec
SELECT format('ALTER ROLE %I WITH LOGIN PASSWORD %L NOSUPERUSER NOCREATEDB NOCREATEROLE NOINHERIT '
              'NOREPLICATION NOBYPASSRLS CONNECTION LIMIT 32', :'role', :'password') \gexec

-- the database, owned by the role
SELECT format('CREATE DATABASE %I OWNER %I ENCODING %L TEMPLATE template0', :'dbname', :'role', 'UTF8')
 WHERE NOT EXISTS (SELECT FROM pg_database WHERE datname = :'dbname') \gexec
SELECT format('ALTER DATABASE %I OWNER TO %I', :'dbname', :'role') \gexec
SELECT format('REVOKE ALL ON DATABASE %I FROM PUBLIC', :'dbname') \gexec
SELECT format('GRANT CONNECT, TEMPORARY ON DATABASE %I TO %I', :'dbname', :'role') \gexec

-- inside the database: the schema Flyway writes to belongs to the role and to nobody else
\connect :"dbname"
SELECT format('ALTER SCHEMA public OWNER TO %I', :'role') \gexec
REVOKE ALL ON SCHEMA public FROM PUBLIC;

\echo
\echo 'setup.sql: done; the daemon connects with (host and port as it reaches the server):'
\echo '  SLOPEWATCH_JOURNAL_URL=jdbc:postgresql://HOST:PORT/':dbname
\echo '  SLOPEWATCH_JOURNAL_USERNAME=':role
\echo '  SLOPEWATCH_JOURNAL_PASSWORD=(the password given here)'
