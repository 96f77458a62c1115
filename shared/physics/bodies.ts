// The catalogue of central bodies: gravity, size, oblateness (J2), the IAU pole that defines each
// body's equator, the heliocentric orbit (a moon takes its planet's) and the albedo and outgoing-IR
// ranges a thermal engineer starts from.
// Leaves out: higher zonal harmonics, prime meridians (no body-fixed frames are needed), rings, and
// any spatial map of albedo or IR. Sources are named per value in `sources`; "from memory" marks a
// value recalled from the named publication and not re-read here.
import { AU_KM, SOLAR_CONSTANT_WM2, STEFAN_BOLTZMANN } from './constants';
import { PhysicsError } from './physics-error';

export const bodyIds = [
  'mercury', 'venus', 'earth', 'moon', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune',
  'io', 'europa', 'ganymede', 'callisto', 'titan', 'enceladus',
] as const;
export type BodyId = (typeof bodyIds)[number];
/** A workspace's own body (custom-bodies.ts): the prefix keeps it apart from the catalogue's names. */
export type CustomBodyId = `custom-${string}`;
/** Any body a mission or a computation may name: the catalogue's or a workspace's own. */
export type AnyBodyId = BodyId | CustomBodyId;
export type PlanetId = 'mercury' | 'venus' | 'earth' | 'mars' | 'jupiter' | 'saturn' | 'uranus' | 'neptune';

export interface Range {
  min: number;
  nominal: number;
  max: number;
}

/** One periodic term of an IAU pole: alpha += raAmpDeg sin(arg), delta += decAmpDeg cos(arg). */
export interface PoleTerm {
  raAmpDeg: number;
  decAmpDeg: number;
  phaseDeg: number;
  rateDegPerDay: number;
}

/** IAU rotational elements of the north pole, ICRF, T in Julian centuries TDB from J2000. */
export interface PoleModel {
  alpha0Deg: number;
  alphaRateDegPerCentury: number;
  delta0Deg: number;
  deltaRateDegPerCentury: number;
  terms: readonly PoleTerm[];
}

/** Which published theory places a moon about its planet (moon-ephemeris.ts). */
export type MoonTheory = 'meeus-moon' | 'meeus-galilean' | 'meeus-saturnian' | 'mean-elements';

/** A moon's orbit about its planet: the theory that places it and the mean elements checks and warnings use. */
export interface ParentOrbit {
  theory: MoonTheory;
  semiMajorAxisKm: number;
  eccentricity: number;
  periodDays: number;
  /** The plane the orbit keeps near: the ecliptic (Earth's Moon) or the planet's equator. */
  meanPlane: 'ecliptic' | 'parent-equator';
  /** Only for 'mean-elements': the mean longitude at J2000, measured in the mean plane from its node on the ICRF equator. */
  meanLongitudeJ2000Deg?: number;
  source: string;
}

/**
 * The surface temperature field of a body without a thick atmosphere: day side in radiative
 * equilibrium with the Sun at the local zenith angle, night side at a floor temperature; each
 * parameter with its published range (cap-radiance.ts integrates it over the cap a plate sees).
 */
export interface AirlessSurface {
  emissivity: Range;
  nightFloorK: Range;
  sources: { emissivity: string; nightFloorK: string };
}

/** A custom body's own path about the Sun (custom-bodies.ts); the catalogue's follow VSOP87. */
export interface HeliocentricOrbit {
  aAu: number;
  e: number;
  yearDays: number;
  /** The distances as entered, AU. */
  meanAu: number;
  minAu: number;
  maxAu: number;
}

export interface Body {
  id: AnyBodyId;
  name: string;
  kind: 'planet' | 'moon';
  /** The planet whose heliocentric position, plus the moon's own offset, places a moon. */
  planetId: PlanetId;
  /** The body a moon orbits (its shadow is added to the moon's); null for a planet. */
  parentId: PlanetId | null;
  parentOrbit: ParentOrbit | null;
  gmKm3S2: number;
  radiusKm: number;
  j2: number;
  pole: PoleModel;
  semiMajorAxisAu: number;
  eccentricity: number;
  /** The period of the node's advance a sun-synchronous orbit must match, in days. */
  solarYearDays: number;
  albedo: Range;
  olrWm2: Range;
  /** True where a range is a placeholder awaiting the published design tables. */
  provisional: boolean;
  /** Present for a body without a thick atmosphere: its IR comes from a surface temperature field. */
  airless: AirlessSurface | null;
  /** A custom body about the Sun: its Keplerian path in place of its planetId's VSOP87; null otherwise. */
  heliocentric: HeliocentricOrbit | null;
  /** True for a workspace's own body. */
  custom?: boolean;
  sources: Record<string, string>;
}

const CENTURY_DAYS = 36525;
const FACT_SHEET = 'NASA Goddard planetary fact sheet (from memory)';
const IAU_2015 = 'IAU WGCCRE 2015 (Archinal et al. 2018), as transcribed in NAIF pck00011';
const ENERGY_BALANCE = 'derived: (1 - Bond albedo) * S / 4 at the mean distance, S = 1361 W/m² (energy balance, no internal heat)';
const NO_RANGE = 'no published range sourced here: min = max = nominal';

const fixedPole = (alpha0Deg: number, delta0Deg: number, alphaRate = 0, deltaRate = 0, terms: PoleTerm[] = []): PoleModel => ({
  alpha0Deg, delta0Deg, alphaRateDegPerCentury: alphaRate, deltaRateDegPerCentury: deltaRate, terms,
});

const term = (raAmpDeg: number, decAmpDeg: number, phaseDeg: number, rateDegPerDay: number): PoleTerm => ({
  raAmpDeg, decAmpDeg, phaseDeg, rateDegPerDay,
});

// Jupiter-system arguments J3..J8 (degrees, degrees per century) of the IAU Galilean-moon poles.
const J3 = [283.9, 4850.7], J4 = [355.8, 1191.3], J5 = [119.9, 262.1], J6 = [229.8, 64.3], J7 = [352.25, 2382.6], J8 = [113.35, 6070.0];
const jTerm = (ra: number, dec: number, [phase, perCentury]: number[]) => term(ra, dec, phase, perCentury / CENTURY_DAYS);

/** Energy-balance OLR of a body without internal heat: (1 - A) S / 4 at distance aAu. */
export const equilibriumOlrWm2 = (bondAlbedo: number, aAu: number): number =>
  ((1 - bondAlbedo) * SOLAR_CONSTANT_WM2) / (4 * aAu * aAu);

const emittedWm2 = (temperatureK: number): number => STEFAN_BOLTZMANN * temperatureK ** 4;
const flat = (value: number): Range => ({ min: value, nominal: value, max: value });

interface PlanetOrbit {
  a: number;
  e: number;
  yearDays: number;
}
// Heliocentric mean elements at J2000 (semi-major axis AU, eccentricity) and sidereal periods.
const orbits: Record<PlanetId, PlanetOrbit> = {
  mercury: { a: 0.38709893, e: 0.20563069, yearDays: 87.969 },
  venus: { a: 0.72333199, e: 0.00677323, yearDays: 224.701 },
  // Earth's sun-synchronous condition follows the tropical year, the Sun's return to the equinox.
  earth: { a: 1.00000011, e: 0.01671022, yearDays: 365.242189 },
  mars: { a: 1.52366231, e: 0.09341233, yearDays: 686.98 },
  jupiter: { a: 5.20336301, e: 0.04839266, yearDays: 4332.589 },
  saturn: { a: 9.53707032, e: 0.0541506, yearDays: 10759.22 },
  uranus: { a: 19.19126393, e: 0.04716771, yearDays: 30685.4 },
  neptune: { a: 30.06896348, e: 0.00858587, yearDays: 60189 },
};
const ORBIT_SOURCE = 'JPL mean orbital elements at J2000 (Standish), as on the NASA Goddard fact sheets (from memory)';

interface BodyData {
  id: BodyId;
  name: string;
  planetId: PlanetId;
  gmKm3S2: number;
  radiusKm: number;
  j2: number;
  pole: PoleModel;
  albedo: Range;
  olrWm2: Range;
  provisional?: boolean;
  parentOrbit?: ParentOrbit;
  airless?: AirlessSurface;
  sources: Record<string, string>;
}

const SSD_MEAN = 'JPL SSD planetary satellite mean elements (from memory)';
const moonOrbit = (
  theory: MoonTheory, semiMajorAxisKm: number, eccentricity: number, periodDays: number, source: string,
): ParentOrbit => ({
  theory, semiMajorAxisKm, eccentricity, periodDays, meanPlane: theory === 'meeus-moon' ? 'ecliptic' : 'parent-equator',
  source: `position: ${source}; mean a, e, period: ${SSD_MEAN}`,
});
const MEEUS_MOON = 'Meeus, Astronomical Algorithms ch. 47 (ELP-2000/82 main terms), as in astronomia moonposition';
const MEEUS_GALILEAN = 'Meeus, Astronomical Algorithms ch. 44 high-accuracy theory (Lieske E5), as in astronomia jupitermoons';
const MEEUS_SATURNIAN = 'Meeus, Astronomical Algorithms ch. 46 (Harper & Taylor), as in astronomia saturnmoons';
const range = (min: number, nominal: number, max: number): Range => ({ min, nominal, max });
const ICY_EMISSIVITY = 'icy satellite surfaces 0.90..0.96, as used in thermal models of Galileo PPR and Cassini CIRS data (from memory)';
const icy = (nightFloorK: Range, floorSource: string): AirlessSurface => ({
  emissivity: range(0.9, 0.93, 0.96), nightFloorK, sources: { emissivity: ICY_EMISSIVITY, nightFloorK: floorSource },
});

const data: BodyData[] = [
  {
    id: 'mercury', name: 'Mercury', planetId: 'mercury', gmKm3S2: 22031.868, radiusKm: 2440.5, j2: 50.3e-6,
    pole: fixedPole(281.0103, 61.4155, -0.0328, -0.0049),
    albedo: range(0.068, 0.088, 0.088),
    airless: {
      emissivity: range(0.9, 0.95, 0.95),
      nightFloorK: range(90, 100, 110),
      sources: {
        emissivity: '0.90..0.95, the range used in Mercury surface thermal models (Vasavada, Paige & Wood 1999, Icarus 141; from memory)',
        nightFloorK: 'about 100 K before dawn at low latitudes (Vasavada, Paige & Wood 1999, Icarus 141; from memory)',
      },
    },
    // Day side near 700 K at perihelion, night side near 100 K: the extremes an airless body shows.
    olrWm2: { min: emittedWm2(100), nominal: equilibriumOlrWm2(0.088, orbits.mercury.a), max: emittedWm2(700) },
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: FACT_SHEET, j2: `${FACT_SHEET} (MESSENGER gravity field)`, pole: IAU_2015,
      albedo: `nominal and max ${FACT_SHEET}, Bond albedo; min 0.068 (Mallama, Wang & Howard 2002, Icarus 155; from memory)`,
      olrWm2: `nominal ${ENERGY_BALANCE}; min/max sigma*T^4 for surface temperatures of about 100 K and 700 K (from memory)`,
    },
  },
  {
    id: 'venus', name: 'Venus', planetId: 'venus', gmKm3S2: 324858.592, radiusKm: 6051.8, j2: 4.458e-6,
    pole: fixedPole(272.76, 67.16),
    albedo: flat(0.76),
    olrWm2: flat(equilibriumOlrWm2(0.76, orbits.venus.a)),
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: FACT_SHEET, j2: FACT_SHEET, pole: IAU_2015,
      albedo: `${FACT_SHEET}, Bond albedo; ${NO_RANGE}`, olrWm2: `${ENERGY_BALANCE}; ${NO_RANGE}`,
    },
  },
  {
    id: 'earth', name: 'Earth', planetId: 'earth', gmKm3S2: 398600.4418, radiusKm: 6378.137, j2: 1.08263e-3,
    // The orbit is defined against the J2000 mean equator; the IAU precession rates are not applied.
    pole: fixedPole(0, 90),
    albedo: { min: 0.06, nominal: 0.306, max: 0.5 },
    olrWm2: { min: 110, nominal: equilibriumOlrWm2(0.306, orbits.earth.a), max: 350 },
    provisional: true,
    sources: {
      gmKm3S2: 'WGS 84 / IERS Conventions (from memory)', radiusKm: 'WGS 84 equatorial radius (from memory)',
      j2: `${FACT_SHEET}, 1082.63e-6`, pole: 'J2000 mean equator and equinox (IAU pole 0, 90 at J2000)',
      albedo: `nominal ${FACT_SHEET}, Bond albedo; min/max PROVISIONAL: DOMAIN.md short-averaging extremes [M], NASA/TM-2001-211221 tables not confirmed`,
      olrWm2: `nominal ${ENERGY_BALANCE}; min/max PROVISIONAL: DOMAIN.md short-averaging extremes [M], NASA/TM-2001-211221 tables not confirmed`,
    },
  },
  {
    id: 'moon', name: 'Moon', planetId: 'earth', gmKm3S2: 4902.8, radiusKm: 1738.1, j2: 202.7e-6,
    // Main periodic terms E1..E4 of the IAU lunar pole (arguments in degrees and degrees per day).
    pole: fixedPole(269.9949, 66.5392, 0.0031, 0.013, [
      term(-3.8787, 1.5419, 125.045, -0.0529921), term(-0.1204, 0.0239, 250.089, -0.1059842),
      term(0.07, -0.0278, 260.008, 13.0120009), term(-0.0172, 0.0068, 176.625, 13.3407154),
    ]),
    albedo: range(0.07, 0.11, 0.16),
    airless: {
      emissivity: range(0.9, 0.95, 0.97),
      nightFloorK: range(90, 100, 120),
      sources: {
        emissivity: '0.95 in the Diviner-based thermal model, 0.90..0.97 over the measured range (Vasavada et al. 2012, JGR 117; from memory)',
        nightFloorK: 'equatorial night about 95-100 K before dawn, about 120 K early in the night (LRO Diviner: Williams et al. 2017, Icarus 283; Vasavada et al. 2012; from memory)',
      },
    },
    olrWm2: { min: emittedWm2(95), nominal: equilibriumOlrWm2(0.11, orbits.earth.a), max: emittedWm2(390) },
    parentOrbit: moonOrbit('meeus-moon', 384400, 0.0549, 27.321661, MEEUS_MOON),
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: `${FACT_SHEET}, equatorial radius`, j2: FACT_SHEET,
      pole: `${IAU_2015}, terms E1..E4 only`,
      albedo: `nominal ${FACT_SHEET}, Bond albedo; min/max 0.07 (maria) .. 0.16 (highlands), the normal albedo of the Diviner thermal model (Vasavada et al. 2012, JGR 117; from memory)`,
      olrWm2: `nominal ${ENERGY_BALANCE}; min/max sigma*T^4 for about 95 K night and 390 K subsolar surface (LRO Diviner, from memory)`,
    },
  },
  {
    id: 'mars', name: 'Mars', planetId: 'mars', gmKm3S2: 42828.37, radiusKm: 3396.2, j2: 1960.45e-6,
    pole: fixedPole(317.68143, 52.8865, -0.1061, -0.0609),
    albedo: flat(0.25),
    olrWm2: flat(equilibriumOlrWm2(0.25, orbits.mars.a)),
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: FACT_SHEET, j2: FACT_SHEET,
      pole: 'IAU WGCCRE 2009 (Archinal et al. 2011) linear model; the 2015 periodic terms are left out',
      albedo: `${FACT_SHEET}, Bond albedo; ${NO_RANGE}`, olrWm2: `${ENERGY_BALANCE}; ${NO_RANGE}`,
    },
  },
  {
    id: 'jupiter', name: 'Jupiter', planetId: 'jupiter', gmKm3S2: 126686534, radiusKm: 71492, j2: 14736e-6,
    pole: fixedPole(268.056595, 64.495303, -0.006499, 0.002413),
    albedo: flat(0.343),
    // Giant planets radiate internal heat: sigma*T_eff^4 with the measured effective temperature.
    olrWm2: flat(emittedWm2(124.4)),
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: `${FACT_SHEET}, 1 bar level`, j2: FACT_SHEET,
      pole: `${IAU_2015}, periodic terms left out`, albedo: `${FACT_SHEET}, Bond albedo; ${NO_RANGE}`,
      olrWm2: `sigma*T_eff^4, T_eff 124.4 K (Voyager IRIS, Hanel et al. 1981, from memory); ${NO_RANGE}`,
    },
  },
  {
    id: 'saturn', name: 'Saturn', planetId: 'saturn', gmKm3S2: 37931187, radiusKm: 60268, j2: 16298e-6,
    pole: fixedPole(40.589, 83.537, -0.036, -0.004),
    albedo: flat(0.342),
    olrWm2: flat(emittedWm2(95)),
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: `${FACT_SHEET}, 1 bar level`, j2: FACT_SHEET, pole: IAU_2015,
      albedo: `${FACT_SHEET}, Bond albedo; ${NO_RANGE}`,
      olrWm2: `sigma*T_eff^4, T_eff 95.0 K (Voyager, Hanel et al. 1983, from memory); ${NO_RANGE}`,
    },
  },
  {
    id: 'uranus', name: 'Uranus', planetId: 'uranus', gmKm3S2: 5793939, radiusKm: 25559, j2: 3343.43e-6,
    pole: fixedPole(257.311, -15.175),
    albedo: flat(0.3),
    olrWm2: flat(emittedWm2(59.1)),
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: `${FACT_SHEET}, 1 bar level`, j2: FACT_SHEET, pole: IAU_2015,
      albedo: `${FACT_SHEET}, Bond albedo; ${NO_RANGE}`,
      olrWm2: `sigma*T_eff^4, T_eff 59.1 K (Pearl et al. 1990, from memory); ${NO_RANGE}`,
    },
  },
  {
    id: 'neptune', name: 'Neptune', planetId: 'neptune', gmKm3S2: 6835099.5, radiusKm: 24764, j2: 3411e-6,
    // N = 357.85 + 52.316 T (degrees, T in centuries).
    pole: fixedPole(299.36, 43.46, 0, 0, [term(0.7, -0.51, 357.85, 52.316 / CENTURY_DAYS)]),
    albedo: flat(0.29),
    olrWm2: flat(emittedWm2(59.3)),
    sources: {
      gmKm3S2: FACT_SHEET, radiusKm: `${FACT_SHEET}, 1 bar level`, j2: FACT_SHEET, pole: IAU_2015,
      albedo: `${FACT_SHEET}, Bond albedo; ${NO_RANGE}`,
      olrWm2: `sigma*T_eff^4, T_eff 59.3 K (Pearl & Conrath 1991, from memory); ${NO_RANGE}`,
    },
  },
  {
    id: 'io', name: 'Io', planetId: 'jupiter', gmKm3S2: 5959.916, radiusKm: 1821.6, j2: 1859.5e-6,
    pole: fixedPole(268.05, 64.5, -0.009, 0.003, [jTerm(0.094, 0.04, J3), jTerm(0.024, 0.011, J4)]),
    airless: icy(range(85, 90, 100), 'night about 85-100 K away from hot spots (Galileo PPR: Rathbun et al. 2004, Icarus 169; from memory)'),
    albedo: flat(0.63),
    olrWm2: flat(equilibriumOlrWm2(0.63, orbits.jupiter.a)),
    parentOrbit: moonOrbit('meeus-galilean', 421800, 0.004, 1.769138, MEEUS_GALILEAN),
    sources: {
      gmKm3S2: 'JPL SSD planetary satellite physical parameters (from memory)', radiusKm: 'JPL SSD, mean radius (from memory)',
      j2: 'Anderson et al. 2001, Galileo gravity (from memory)', pole: IAU_2015,
      albedo: `Bond albedo about 0.63 (from memory); ${NO_RANGE}`,
      olrWm2: `${ENERGY_BALANCE}; volcanic heat flow left out; ${NO_RANGE}`,
    },
  },
  {
    id: 'europa', name: 'Europa', planetId: 'jupiter', gmKm3S2: 3202.739, radiusKm: 1560.8, j2: 435.5e-6,
    pole: fixedPole(268.08, 64.51, -0.009, 0.003, [
      jTerm(1.086, 0.468, J4), jTerm(0.06, 0.026, J5), jTerm(0.015, 0.007, J6), jTerm(0.009, 0.002, J7),
    ]),
    airless: icy(range(80, 90, 100), 'night about 80-100 K at low latitudes (Galileo PPR: Rathbun et al. 2010, Icarus 210; from memory)'),
    albedo: flat(0.68),
    olrWm2: flat(equilibriumOlrWm2(0.68, orbits.jupiter.a)),
    parentOrbit: moonOrbit('meeus-galilean', 671100, 0.009, 3.551181, MEEUS_GALILEAN),
    sources: {
      gmKm3S2: 'JPL SSD planetary satellite physical parameters (from memory)', radiusKm: 'JPL SSD, mean radius (from memory)',
      j2: 'Anderson et al. 1998, Galileo gravity (from memory)', pole: IAU_2015,
      albedo: `Bond albedo about 0.68 (from memory); ${NO_RANGE}`, olrWm2: `${ENERGY_BALANCE}; ${NO_RANGE}`,
    },
  },
  {
    id: 'ganymede', name: 'Ganymede', planetId: 'jupiter', gmKm3S2: 9887.834, radiusKm: 2631.2, j2: 127.53e-6,
    pole: fixedPole(268.2, 64.57, -0.009, 0.003, [jTerm(-0.037, -0.016, J4), jTerm(0.431, 0.186, J5), jTerm(0.091, 0.039, J6)]),
    airless: icy(range(70, 85, 100), 'night about 70-100 K (Galileo PPR: Orton et al. 1996, Science 274; from memory)'),
    albedo: flat(0.43),
    olrWm2: flat(equilibriumOlrWm2(0.43, orbits.jupiter.a)),
    parentOrbit: moonOrbit('meeus-galilean', 1070400, 0.001, 7.154553, MEEUS_GALILEAN),
    sources: {
      gmKm3S2: 'JPL SSD planetary satellite physical parameters (from memory)', radiusKm: 'JPL SSD, mean radius (from memory)',
      j2: 'Anderson et al. 1996, Galileo gravity (from memory)', pole: IAU_2015,
      albedo: `geometric albedo 0.43 used as Bond albedo (from memory); ${NO_RANGE}`, olrWm2: `${ENERGY_BALANCE}; ${NO_RANGE}`,
    },
  },
  {
    id: 'callisto', name: 'Callisto', planetId: 'jupiter', gmKm3S2: 7179.289, radiusKm: 2410.3, j2: 32.7e-6,
    pole: fixedPole(268.72, 64.83, -0.009, 0.003, [jTerm(-0.068, -0.029, J5), jTerm(0.59, 0.254, J6), jTerm(0.01, -0.004, J8)]),
    airless: icy(range(75, 85, 100), 'night about 75-100 K (Galileo PPR: Spencer 1987 / Orton et al. 1996; from memory)'),
    albedo: flat(0.13),
    olrWm2: flat(equilibriumOlrWm2(0.13, orbits.jupiter.a)),
    parentOrbit: moonOrbit('meeus-galilean', 1882700, 0.007, 16.689018, MEEUS_GALILEAN),
    sources: {
      gmKm3S2: 'JPL SSD planetary satellite physical parameters (from memory)', radiusKm: 'JPL SSD, mean radius (from memory)',
      j2: 'Anderson et al. 2001, Galileo gravity (from memory)', pole: IAU_2015,
      albedo: `Bond albedo about 0.13 (from memory); ${NO_RANGE}`, olrWm2: `${ENERGY_BALANCE}; ${NO_RANGE}`,
    },
  },
  {
    id: 'titan', name: 'Titan', planetId: 'saturn', gmKm3S2: 8978.14, radiusKm: 2574.7, j2: 33.599e-6,
    pole: fixedPole(39.4827, 83.4279),
    albedo: flat(0.265),
    olrWm2: flat(equilibriumOlrWm2(0.265, orbits.saturn.a)),
    parentOrbit: moonOrbit('meeus-saturnian', 1221870, 0.0288, 15.945421, MEEUS_SATURNIAN),
    sources: {
      gmKm3S2: 'JPL SSD planetary satellite physical parameters (from memory)', radiusKm: 'JPL SSD, mean radius (from memory)',
      j2: 'Iess et al. 2012, Cassini gravity (from memory)', pole: IAU_2015,
      albedo: `Bond albedo 0.265 (Li et al. 2011, from memory); ${NO_RANGE}`, olrWm2: `${ENERGY_BALANCE}; ${NO_RANGE}`,
    },
  },
  {
    id: 'enceladus', name: 'Enceladus', planetId: 'saturn', gmKm3S2: 7.211, radiusKm: 252.1, j2: 5435.2e-6,
    pole: fixedPole(40.66, 83.52, -0.036, -0.004),
    airless: icy(range(50, 60, 70), 'night about 50-70 K away from the south-polar vents (Cassini CIRS: Howett et al. 2010, Icarus 206; from memory)'),
    albedo: flat(0.81),
    olrWm2: flat(equilibriumOlrWm2(0.81, orbits.saturn.a)),
    parentOrbit: moonOrbit('meeus-saturnian', 238040, 0.0047, 1.370218, MEEUS_SATURNIAN),
    sources: {
      gmKm3S2: 'JPL SSD planetary satellite physical parameters (from memory)', radiusKm: 'JPL SSD, mean radius (from memory)',
      j2: 'Iess et al. 2014, Cassini gravity (from memory)', pole: IAU_2015,
      albedo: `Bond albedo 0.81 (Howett et al. 2010, from memory); ${NO_RANGE}`,
      olrWm2: `${ENERGY_BALANCE}; south-polar heat flow left out; ${NO_RANGE}`,
    },
  },
];

const bodies: ReadonlyMap<BodyId, Body> = new Map(
  data.map((d): [BodyId, Body] => {
    const orbit = orbits[d.planetId];
    const body: Body = {
      ...d,
      kind: d.id === d.planetId ? 'planet' : 'moon',
      parentId: d.id === d.planetId ? null : d.planetId,
      parentOrbit: d.parentOrbit ?? null,
      semiMajorAxisAu: orbit.a,
      eccentricity: orbit.e,
      solarYearDays: orbit.yearDays,
      provisional: d.provisional ?? false,
      airless: d.airless ?? null,
      heliocentric: null,
      sources: {
        ...d.sources,
        solarDistanceAu: d.id === d.planetId ? ORBIT_SOURCE : `${ORBIT_SOURCE}, of ${d.planetId}, plus the moon's own offset (${d.parentOrbit?.source ?? 'no theory'})`,
      },
    };
    return [d.id, body];
  }),
);

export const isBodyId = (id: string): id is BodyId => (bodyIds as readonly string[]).includes(id);

/** Where getBody finds a workspace's own bodies: the server sets it (its database); unset, there are none. */
let customBodyLookup: ((id: string) => Body | undefined) | null = null;
export const setCustomBodyLookup = (lookup: ((id: string) => Body | undefined) | null): void => {
  customBodyLookup = lookup;
};

export function getBody(id: string): Body {
  const body = isBodyId(id) ? bodies.get(id) : id.startsWith('custom-') ? customBodyLookup?.(id) : undefined;
  if (!body) {
    throw new PhysicsError('unknown_body', `"${id}" is not a body Eclipta knows; choose one of ${bodyIds.join(', ')} or one of the workspace's own bodies`, [
      { path: 'bodyId', message: `unknown body "${id}"` },
    ]);
  }
  return body;
}

export const allBodies = (): Body[] => bodyIds.map((id) => getBody(id));

/**
 * Perihelion and aphelion distances a(1 - e), a(1 + e), in AU; a moon adds its own apoapsis about
 * its planet on either side (it can sit on the Sun's side or beyond the planet).
 */
export const solarDistanceRangeAu = (body: Body) => {
  if (body.heliocentric) return { mean: body.heliocentric.meanAu, min: body.heliocentric.minAu, max: body.heliocentric.maxAu };
  const moonAu = body.parentOrbit ? (body.parentOrbit.semiMajorAxisKm * (1 + body.parentOrbit.eccentricity)) / AU_KM : 0;
  return {
    mean: body.semiMajorAxisAu,
    min: body.semiMajorAxisAu * (1 - body.eccentricity) - moonAu,
    max: body.semiMajorAxisAu * (1 + body.eccentricity) + moonAu,
  };
};

/** One body as GET /api/v1/bodies answers it (API.md "Other fixed routes"). */
export interface BodySummary {
  id: AnyBodyId;
  name: string;
  kind: 'planet' | 'moon';
  planetId: PlanetId;
  gmKm3S2: number;
  radiusKm: number;
  j2: number;
  poleRaDeg: number;
  poleDecDeg: number;
  solarDistanceAu: { mean: number; min: number; max: number };
  albedo: Range;
  olrWm2: Range;
  provisional: boolean;
  /** True for a body without a thick atmosphere, whose IR comes from a surface temperature field. */
  airless: boolean;
  /** That field's parameters and their published ranges; null for a body with an atmosphere. */
  surfaceField: AirlessSurface | null;
  sources: Record<string, string>;
}

/** The catalogue in the shape of GET /api/v1/bodies; the pole is its J2000 value. */
export const bodySummaries = (): BodySummary[] => allBodies().map(bodySummary);

/** One body, the catalogue's or a workspace's own, in that shape. */
export const bodySummary = (b: Body): BodySummary => ({
  id: b.id, name: b.name, kind: b.kind, planetId: b.planetId, gmKm3S2: b.gmKm3S2, radiusKm: b.radiusKm, j2: b.j2,
  poleRaDeg: b.pole.alpha0Deg, poleDecDeg: b.pole.delta0Deg,
  solarDistanceAu: solarDistanceRangeAu(b), albedo: { ...b.albedo }, olrWm2: { ...b.olrWm2 },
  provisional: b.provisional, airless: b.airless !== null, surfaceField: b.airless, sources: { ...b.sources },
});
