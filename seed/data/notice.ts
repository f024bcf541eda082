/**
 * The sentence shown wherever demo data appears (site banner, demo pages, API meta), so nobody
 * mistakes the invented figures for measurements.
 */
export const DEMO_NOTICE =
  'All members, results and notes in this demo are invented for demonstration and are not real measurements.';
