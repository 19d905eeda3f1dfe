-- The scan floor: one grouped pass over each source table the recipe reads, with no cohort, no cutoffs and
-- no windows. No correct answer can read less; quern's time is compared with this.
select 'rides' as source, member_id, count(*) as row_count, sum(distance_km) as sum_x, sum(duration_min) as sum_y
from rides
group by member_id
union all
select 'payments' as source, member_id, count(*) as row_count, sum(amount) as sum_x, null as sum_y
from payments
group by member_id;
