-- The public estimate API's per-address counters: written on every request, worth nothing after a
-- crash (losing them only restarts each address's minute). UNLOGGED skips the write-ahead log, so a
-- request no longer waits for a WAL flush; every app server still shares the one table.
ALTER TABLE "api_rate_counter" SET UNLOGGED;
