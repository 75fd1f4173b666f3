-- Block reads per single-row insert into wheel_run_events, per index, with a time-ordered key
-- (UUIDv7, as phones make event ids now) beside a random one (v4, as they did and old phones'
-- queued events still do). Run on the growth bench's kept database (BENCH_KEEP=1 npm run
-- bench:growth, then):
--   psql "$(npx tsx -e "import('@/db/cluster').then(m => console.log(m.clusterUrl('ringpass_bench_growth')))")" -f tests/bench/growth-key-reads.sql
-- It first builds `bench_random_key`, an index on a random uuid of each row (md5 of its key): the
-- shape of the former surrogate `id` and of a v4 client key. Each insert is its own statement; all
-- are rolled back, on a wheel the bench does not measure (ord 21: its measured wheels are 1–20),
-- and vacuumed away; the index is dropped at the end. A read is a block not found in shared_buffers
-- (this cluster: 128 MB); reads 0 means the insert touched only pages already in memory.
select pg_backend_pid() as pid \gset
\! renice -n 19 -p :pid > /dev/null
set maintenance_work_mem = '256MB';
create index if not exists bench_random_key on wheel_run_events ((md5(client_id::text)::uuid));

create temp table reads (kind text, rel text, rd bigint, hit bigint);
create function pg_temp.counters() returns table (rel text, rd bigint, hit bigint) language sql as $$
  select indexrelname::text, idx_blks_read, idx_blks_hit from pg_statio_user_indexes where relname = 'wheel_run_events'
  union all select 'heap', heap_blks_read, heap_blks_hit from pg_statio_user_tables where relname = 'wheel_run_events' $$;
create function pg_temp.inserts(key_sql text, n int) returns void language plpgsql as $$
begin
  for i in 1..n loop
    execute format($q$insert into wheel_run_events (shop_id, job_id, wheel_id, client_id, type, payload, by_id, client_at)
      select shop_id, job_id, wheel_id, %s, 'bolt_confirmed', '{"pass":1,"bolt":1}', by_id, now()
      from bench_wheels where ord = 21$q$, key_sql);
  end loop;
end $$;

-- Warm-up: the random index was just built outside shared_buffers; let inserts settle its pages
-- into the cache as steady work would (the heap and the key index take theirs too).
begin; select pg_temp.inserts('bench_uuid7(clock_timestamp())', 3000); rollback;
select pg_sleep(1.5), pg_stat_clear_snapshot();
-- Counters reach the statistics views when a transaction ends (then a moment later).
\set n 300
insert into reads select 'before v7', * from pg_temp.counters();
begin; select pg_temp.inserts('bench_uuid7(clock_timestamp())', :n); rollback;
select pg_sleep(1.5), pg_stat_clear_snapshot();
insert into reads select 'after v7', * from pg_temp.counters();
begin; select pg_temp.inserts('gen_random_uuid()', :n); rollback;
select pg_sleep(1.5), pg_stat_clear_snapshot();
insert into reads select 'after v4', * from pg_temp.counters();

select a.rel as relation,
  round((b.rd - a.rd)::numeric / :n, 3) as v7_reads_per_insert, round((b.hit - a.hit)::numeric / :n, 2) as v7_hits,
  round((c.rd - b.rd)::numeric / :n, 3) as v4_reads_per_insert, round((c.hit - b.hit)::numeric / :n, 2) as v4_hits,
  pg_size_pretty(case when a.rel = 'heap' then pg_relation_size('wheel_run_events') else pg_relation_size(a.rel::regclass) end) as size
from reads a join reads b on b.rel = a.rel and b.kind = 'after v7' join reads c on c.rel = a.rel and c.kind = 'after v4'
where a.kind = 'before v7' order by 1;
drop index bench_random_key;
-- The rolled-back rows' index entries would otherwise be read by every later scan of that wheel.
vacuum (index_cleanup on) wheel_run_events;
