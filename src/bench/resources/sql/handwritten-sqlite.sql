-- Member features at 12 month ends as an analyst would write them by hand for SQLite: the cohort
-- (members who had joined by the cutoff), each source LEFT JOINed on member and time range, one GROUP BY
-- per source with every window as a conditional aggregate.
-- A window of N days is the N whole days ending with the cutoff day: [cutoff - (N-1) days, cutoff + 1 day).
-- Times are ISO text, which compares correctly with a 'YYYY-MM-DD' day boundary.
-- SQLite has no standard deviation aggregate: this uses the one-pass sum-of-squares form
-- sqrt((sum(x*x) - sum(x)^2/n) / (n - 1)), floored at 0 against rounding. It is what most analysts write,
-- and it loses precision when the spread is tiny next to the mean (quern computes deviations from the
-- window's mean instead); the benchmark's equality check allows for that (see MatrixComparison.java).
with
cutoffs(cutoff) as (values
  ('2025-01-31'),
  ('2025-02-28'),
  ('2025-03-31'),
  ('2025-04-30'),
  ('2025-05-31'),
  ('2025-06-30'),
  ('2025-07-31'),
  ('2025-08-31'),
  ('2025-09-30'),
  ('2025-10-31'),
  ('2025-11-30'),
  ('2025-12-31')
),
cohort as (
  select
    m.member_id,
    c.cutoff,
    date(c.cutoff, '-29 days') as from_30d,
    date(c.cutoff, '-89 days') as from_90d,
    date(c.cutoff, '-364 days') as from_365d,
    date(c.cutoff, '+1 day') as until
  from members m
  cross join cutoffs c
  where m.joined_on <= c.cutoff
),
rides_features as (
  select
    co.member_id,
    co.cutoff,
    count(case when r.started_at >= co.from_30d then r.ride_id end) as rides_count_30d,
    count(case when r.started_at >= co.from_90d then r.ride_id end) as rides_count_90d,
    count(r.ride_id) as rides_count_365d,
    coalesce(sum(case when r.started_at >= co.from_30d then r.distance_km end), 0) as rides_sum_distance_km_30d,
    coalesce(sum(case when r.started_at >= co.from_90d then r.distance_km end), 0) as rides_sum_distance_km_90d,
    coalesce(sum(r.distance_km), 0) as rides_sum_distance_km_365d,
    avg(case when r.started_at >= co.from_30d then r.duration_min end) as rides_mean_duration_min_30d,
    avg(case when r.started_at >= co.from_90d then r.duration_min end) as rides_mean_duration_min_90d,
    avg(r.duration_min) as rides_mean_duration_min_365d,
    sqrt(max(0, (sum(case when r.started_at >= co.from_30d then r.duration_min * r.duration_min end) - sum(case when r.started_at >= co.from_30d then r.duration_min end) * sum(case when r.started_at >= co.from_30d then r.duration_min end) / count(case when r.started_at >= co.from_30d then r.ride_id end)) / nullif(count(case when r.started_at >= co.from_30d then r.ride_id end) - 1, 0))) as rides_stddev_duration_min_30d,
    sqrt(max(0, (sum(case when r.started_at >= co.from_90d then r.duration_min * r.duration_min end) - sum(case when r.started_at >= co.from_90d then r.duration_min end) * sum(case when r.started_at >= co.from_90d then r.duration_min end) / count(case when r.started_at >= co.from_90d then r.ride_id end)) / nullif(count(case when r.started_at >= co.from_90d then r.ride_id end) - 1, 0))) as rides_stddev_duration_min_90d,
    sqrt(max(0, (sum(r.duration_min * r.duration_min) - sum(r.duration_min) * sum(r.duration_min) / count(r.ride_id)) / nullif(count(r.ride_id) - 1, 0))) as rides_stddev_duration_min_365d,
    max(case when r.started_at >= co.from_30d then r.distance_km end) as rides_max_distance_km_30d,
    max(case when r.started_at >= co.from_90d then r.distance_km end) as rides_max_distance_km_90d,
    max(r.distance_km) as rides_max_distance_km_365d,
    cast(julianday(co.cutoff) - julianday(date(max(case when r.started_at >= co.from_30d then r.started_at end))) as integer) as rides_days_since_last_30d,
    cast(julianday(co.cutoff) - julianday(date(max(case when r.started_at >= co.from_90d then r.started_at end))) as integer) as rides_days_since_last_90d,
    cast(julianday(co.cutoff) - julianday(date(max(r.started_at))) as integer) as rides_days_since_last_365d
  from cohort co
  left join rides r
    on r.member_id = co.member_id
   and r.started_at >= co.from_365d
   and r.started_at < co.until
  group by co.member_id, co.cutoff
),
payments_features as (
  select
    co.member_id,
    co.cutoff,
    count(case when p.paid_at >= co.from_30d then p.payment_id end) as payments_count_30d,
    count(case when p.paid_at >= co.from_90d then p.payment_id end) as payments_count_90d,
    count(p.payment_id) as payments_count_365d,
    coalesce(sum(case when p.paid_at >= co.from_30d then p.amount end), 0) as payments_sum_amount_30d,
    coalesce(sum(case when p.paid_at >= co.from_90d then p.amount end), 0) as payments_sum_amount_90d,
    coalesce(sum(p.amount), 0) as payments_sum_amount_365d,
    avg(case when p.paid_at >= co.from_30d then p.amount end) as payments_mean_amount_30d,
    avg(case when p.paid_at >= co.from_90d then p.amount end) as payments_mean_amount_90d,
    avg(p.amount) as payments_mean_amount_365d,
    sqrt(max(0, (sum(case when p.paid_at >= co.from_30d then p.amount * p.amount end) - sum(case when p.paid_at >= co.from_30d then p.amount end) * sum(case when p.paid_at >= co.from_30d then p.amount end) / count(case when p.paid_at >= co.from_30d then p.payment_id end)) / nullif(count(case when p.paid_at >= co.from_30d then p.payment_id end) - 1, 0))) as payments_stddev_amount_30d,
    sqrt(max(0, (sum(case when p.paid_at >= co.from_90d then p.amount * p.amount end) - sum(case when p.paid_at >= co.from_90d then p.amount end) * sum(case when p.paid_at >= co.from_90d then p.amount end) / count(case when p.paid_at >= co.from_90d then p.payment_id end)) / nullif(count(case when p.paid_at >= co.from_90d then p.payment_id end) - 1, 0))) as payments_stddev_amount_90d,
    sqrt(max(0, (sum(p.amount * p.amount) - sum(p.amount) * sum(p.amount) / count(p.payment_id)) / nullif(count(p.payment_id) - 1, 0))) as payments_stddev_amount_365d,
    max(case when p.paid_at >= co.from_30d then p.amount end) as payments_max_amount_30d,
    max(case when p.paid_at >= co.from_90d then p.amount end) as payments_max_amount_90d,
    max(p.amount) as payments_max_amount_365d,
    cast(julianday(co.cutoff) - julianday(date(max(case when p.paid_at >= co.from_30d then p.paid_at end))) as integer) as payments_days_since_last_30d,
    cast(julianday(co.cutoff) - julianday(date(max(case when p.paid_at >= co.from_90d then p.paid_at end))) as integer) as payments_days_since_last_90d,
    cast(julianday(co.cutoff) - julianday(date(max(p.paid_at))) as integer) as payments_days_since_last_365d
  from cohort co
  left join payments p
    on p.member_id = co.member_id
   and p.paid_at >= co.from_365d
   and p.paid_at < co.until
  group by co.member_id, co.cutoff
)
select
  rf.member_id,
  rf.cutoff,
  rf.rides_count_30d,
  rf.rides_count_90d,
  rf.rides_count_365d,
  rf.rides_sum_distance_km_30d,
  rf.rides_sum_distance_km_90d,
  rf.rides_sum_distance_km_365d,
  rf.rides_mean_duration_min_30d,
  rf.rides_mean_duration_min_90d,
  rf.rides_mean_duration_min_365d,
  rf.rides_stddev_duration_min_30d,
  rf.rides_stddev_duration_min_90d,
  rf.rides_stddev_duration_min_365d,
  rf.rides_max_distance_km_30d,
  rf.rides_max_distance_km_90d,
  rf.rides_max_distance_km_365d,
  rf.rides_days_since_last_30d,
  rf.rides_days_since_last_90d,
  rf.rides_days_since_last_365d,
  pf.payments_count_30d,
  pf.payments_count_90d,
  pf.payments_count_365d,
  pf.payments_sum_amount_30d,
  pf.payments_sum_amount_90d,
  pf.payments_sum_amount_365d,
  pf.payments_mean_amount_30d,
  pf.payments_mean_amount_90d,
  pf.payments_mean_amount_365d,
  pf.payments_stddev_amount_30d,
  pf.payments_stddev_amount_90d,
  pf.payments_stddev_amount_365d,
  pf.payments_max_amount_30d,
  pf.payments_max_amount_90d,
  pf.payments_max_amount_365d,
  pf.payments_days_since_last_30d,
  pf.payments_days_since_last_90d,
  pf.payments_days_since_last_365d
from rides_features rf
join payments_features pf
  on pf.member_id = rf.member_id
 and pf.cutoff = rf.cutoff
order by rf.cutoff, rf.member_id;
