-- A sync batch's guarded writes hand this the number of rows they touched. When a rule in a
-- write's WHERE clause left a row out (another writer got there after the batch read it), it
-- raises serialization_failure: the transaction aborts in PostgreSQL itself, the COMMIT queued
-- behind the writes rolls it back, and the server retries the batch.
CREATE OR REPLACE FUNCTION sync_expect_rows(actual bigint, expected integer, what text) RETURNS bigint
LANGUAGE plpgsql AS $$
BEGIN
  IF actual IS DISTINCT FROM expected THEN
    RAISE EXCEPTION 'sync batch raced with another writer on %: % of % rows written', what, actual, expected
      USING ERRCODE = 'serialization_failure';
  END IF;
  RETURN actual;
END
$$;
