/** How each demo shop differs; see the comment at the top of history.ts for the story. */
export const JOB_KINDS = ['battery_charging', 'solar_inverter', 'compressor', 'wiring_repair'] as const;
export type JobKind = (typeof JOB_KINDS)[number];

export interface LocationProfile {
  /** Builds taken in an average week of the year, once the shop is up to speed. */
  weeklyBuilds: number;
  /** Days before the clock the shop opened; the history reaches back two years at most. */
  openedDaysAgo: number;
  /** Labor hours of this shop against the network's usual hours for the same job. */
  laborFactor: number;
  jobMix: Record<JobKind, number>;
  /** Share of house batteries bought from Northvane; the rest come from Larkspur. */
  northvaneShare: number;
}

export const HISTORY_DAYS = 730;

const USUAL_MIX: Record<JobKind, number> = { battery_charging: 0.38, solar_inverter: 0.16, compressor: 0.2, wiring_repair: 0.26 };
const SOLAR_MIX: Record<JobKind, number> = { battery_charging: 0.27, solar_inverter: 0.45, compressor: 0.12, wiring_repair: 0.16 };

const established = (weeklyBuilds: number, openedDaysAgo: number): LocationProfile => ({
  weeklyBuilds,
  openedDaysAgo,
  laborFactor: 1,
  jobMix: USUAL_MIX,
  northvaneShare: 0.3,
});

export const LOCATION_PROFILES: Record<string, LocationProfile> = {
  DEN: established(5, 3100),
  BOI: { ...established(3.2, 1500), northvaneShare: 0.88 },
  PDX: { ...established(3.6, 2200), laborFactor: 1.6 },
  PHX: { ...established(4.2, 1900), jobMix: SOLAR_MIX },
  AUS: established(4, 1700),
  DLH: established(2.6, 1300),
  AVL: established(3.4, 2400),
  BTV: established(2.6, 200),
};

/** Requests by month (January first): the trade's busy season is spring and summer. */
export const MONTH_FACTORS = [0.55, 0.62, 0.85, 1.1, 1.3, 1.45, 1.45, 1.3, 1.1, 0.9, 0.7, 0.6] as const;

/** Requests by weekday (Sunday first): shops answer a few on Sundays, half a day on Saturdays. */
export const WEEKDAY_FACTORS = [0.1, 1.1, 1, 1, 1, 0.9, 0.5] as const;
