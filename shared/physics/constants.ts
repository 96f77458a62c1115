// Physical and astronomical constants shared by the physics modules, each with its source.

/** Total solar irradiance at 1 AU, W/m^2: IAU 2015 Resolution B3 nominal (Kopp & Lean 2011: 1360.8 +/- 0.5). */
export const SOLAR_CONSTANT_WM2 = 1361;

/** Stefan-Boltzmann constant, W/(m^2 K^4), CODATA 2018 (exact since the 2019 SI). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;

/** Astronomical unit, km, IAU 2012 Resolution B2 (exact). */
export const AU_KM = 149597870.7;

/** Nominal solar radius, km, IAU 2015 Resolution B3. */
export const SUN_RADIUS_KM = 695700;

/** Mean obliquity of the ecliptic at J2000, degrees: 23 deg 26' 21.448" (Meeus, Astronomical Algorithms, eq. 22.2). */
export const OBLIQUITY_J2000_DEG = 23.4392911;

/**
 * TT - UTC in seconds: 32.184 s + 37 leap seconds (IERS, since 2017-01-01). Held constant because a
 * minute's error moves the Sun by 0.0007 deg, far below what a thermal environment notices.
 */
export const TT_MINUS_UTC_S = 69.184;

export const SECONDS_PER_DAY = 86400;
/** A day of 86 400 s in milliseconds, as Date counts time (UTC days; leap seconds are not counted). */
export const DAY_MS = SECONDS_PER_DAY * 1000;
export const DAYS_PER_JULIAN_CENTURY = 36525;
/** Julian date of J2000.0 (2000-01-01 12:00 TT). */
export const J2000_JD = 2451545.0;
