-- Member features at 12 month ends as an analyst would write them by hand for DuckDB: the cohort
-- (members who had joined by the cutoff), each source LEFT JOINed on member and time range, one GROUP BY
-- per source with every window as a conditional aggregate.
-- A window of N days is the N whole days ending with the cutoff day: [cutoff - (N-1) days, cutoff + 1 day).
-- DuckDB's stddev_samp is the sample standard deviation, computed stably.
with
cutoffs(cutoff) as (values
  (date '2025-01-31'),
  (date '2025-02-28'),
  (date '2025-03-31'),
  (date '2025-04-30'),
  (date '2025-05-31'),
  (date '2025-06-30'),
  (date '2025-07-31'),
  (date '2025-08-31'),
  (date '2025-09-30'),
  (date '2025-10-31'),
  (date '2025-11-30'),
  (date '2025-12-31')
),
cohort as (
  select
    m.member_id,
    c.cutoff,
    c.cutoff - interval 29 day as from_30d,
    c.cutoff - interval 89 day as from_90d,
    c.cutoff - interval 364 day as from_365d,
    c.cutoff + interval 1 day as until
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
    stddev_samp(case when r.started_at >= co.from_30d then r.duration_min end) as rides_stddev_duration_min_30d,
    stddev_samp(case when r.started_at >= co.from_90d then r.duration_min end) as rides_stddev_duration_min_90d,
    stddev_samp(r.duration_min) as rides_stddev_duration_min_365d,
    max(case when r.started_at >= co.from_30d then r.distance_km end) as rides_max_distance_km_30d,
    max(case when r.started_at >= co.from_90d then r.distance_km end) as rides_max_distance_km_90d,
    max(r.distance_km) as rides_max_distance_km_365d,
    co.cutoff - cast(max(case when r.started_at >= co.from_30d then r.started_at end) as date) as rides_days_since_last_30d,
    co.cutoff - cast(max(case when r.started_at >= co.from_90d then r.started_at end) as date) as rides_days_since_last_90d,
    co.cutoff - cast(max(r.started_at) as date) as rides_days_since_last_365d
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
    stddev_samp(case when p.paid_at >= co.from_30d then p.amount end) as payments_stddev_amount_30d,
    stddev_samp(case when p.paid_at >= co.from_90d then p.amount end) as payments_stddev_amount_90d,
    stddev_samp(p.amount) as payments_stddev_amount_365d,
    max(case when p.paid_at >= co.from_30d then p.amount end) as payments_max_amount_30d,
    max(case when p.paid_at >= co.from_90d then p.amount end) as payments_max_amount_90d,
    max(p.amount) as payments_max_amount_365d,
    co.cutoff - cast(max(case when p.paid_at >= co.from_30d then p.paid_at end) as date) as payments_days_since_last_30d,
    co.cutoff - cast(max(case when p.paid_at >= co.from_90d then p.paid_at end) as date) as payments_days_since_last_90d,
    co.cutoff - cast(max(p.paid_at) as date) as payments_days_since_last_365d
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
