/**
 * A seeded, deterministic generator of the sample database of a fictional cycle club: members who join,
 * ride, pay, open support tickets, switch plans, pause and cancel over 2024 and 2025.
 *
 * <p>The data exists to exercise Quern end to end, so it is realistic where features and labels depend on
 * it (seasons, commuting peaks, heavy and light riders, fading activity before a cancellation, failed
 * payments and unhappy tickets that raise the risk of cancelling) and it deliberately holds the edge cases
 * that point-in-time code gets wrong: events exactly at midnight and one second before it on month ends,
 * members who join after early cutoffs, plan histories, tickets still open at the end of the data, rides
 * whose speed shows the bike was on a train, and a current-state {@code status}/{@code updated_at} pair that
 * a leakage audit must flag. Everything in it (names, places, channels) is invented.
 *
 * <p>The same member count and seed always give the same rows: every random draw comes from a
 * {@link java.util.SplittableRandom} seeded from them, transcendental functions go through
 * {@link java.lang.StrictMath}, and nothing depends on hash order or the clock.
 */
package dev.quern.sample;
