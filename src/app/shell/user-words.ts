// What the user reads instead of our internals: API field paths ("orbit.periodS",
// "margins.heatLoadPercent"), code names ("eclipseFraction", "tS") and our notes' shorthand in
// source texts ("from memory", "DOMAIN.md", "[M]"). Messages from the server name fields by their
// API path (the contract, API.md); the screen names them as the form labels do.

const FIELD_WORDS: Readonly<Record<string, string>> = {
  periodS: 'period', periapsisAltitudeKm: 'periapsis altitude', apoapsisAltitudeKm: 'apoapsis altitude',
  semiMajorAxisKm: 'semi-major axis', inclinationDeg: 'inclination', raanDeg: 'RAAN', argPeriapsisDeg: 'argument of periapsis',
  areaM2: 'area', materialId: 'material', missionId: 'mission', orbitId: 'orbit', bodyId: 'body', caseId: 'load case',
  heatLoadPercent: 'heat-load margin', temperatureMarginC: 'temperature margin', eclipseFraction: 'eclipse fraction',
  eclipseDurationS: 'eclipse duration', betaDeg: 'beta angle', tS: 'time', maxOrbits: 'orbits to run',
  absorptivityBol: 'absorptivity at beginning of life', emissivityBol: 'emissivity at beginning of life',
  absorptivityEol: 'absorptivity at end of life', emissivityEol: 'emissivity at end of life',
  startDate: 'start date', endDate: 'end date', stepS: 'time step', solarDistanceAu: 'distance from the Sun',
  gmKm3S2: 'gravitational parameter', radiusKm: 'radius', olrWm2: 'OLR', j2: 'J2', pole: 'pole orientation',
  capacitanceJK: 'heat capacity', conductanceWK: 'conductance', powerW: 'power', initialTempC: 'initial temperature',
};

// Unit endings of API names ("periodS", "areaM2"): the screen shows the unit beside the value.
const UNIT_SUFFIX = /(Km3S2|Km|M2|Wm2|Deg|Percent|Au|JK|WK|W|C|K|S|Ms|Id)$/;

/** One API name in words: the table's, or the camelCase split ("sunPointing" → "sun pointing"). */
export function fieldWords(name: string): string {
  const known = FIELD_WORDS[name];
  if (known !== undefined) return known;
  const stem = name.length > 3 ? name.replace(UNIT_SUFFIX, '') : name;
  return stem.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
}

/** An API path ("orbit.periodS", "nodes.2.capacitanceJK") in words ("period", "node 3 heat capacity"). */
export function pathWords(path: string): string {
  const parts = path.split('.');
  const words: string[] = [];
  parts.forEach((part, i) => {
    if (/^\d+$/.test(part)) {
      const owner = parts[i - 1] ?? 'item';
      words.pop();
      words.push(`${fieldWords(owner.replace(/s$/, ''))} ${Number(part) + 1}`);
    } else if (i === parts.length - 1 || /^\d+$/.test(parts[i + 1] ?? '')) {
      words.push(fieldWords(part));
    }
  });
  return words.join(' ');
}

// A dotted path with at least one camelCase or numeric part, or a lone camelCase word; never part
// of an e-mail address or a host ("owner@kestrel.test"), nor a file name.
const IDENTIFIER = /(?<![\w@.\-/])([a-z][a-z0-9]*(?:\.(?:\d+|[a-z][a-zA-Z0-9]*))*\.[a-z]*[A-Z0-9][a-zA-Z0-9]*|[a-z]+[A-Z][a-zA-Z0-9]*)(?![\w@/]|\.[a-z])/g;

/** A server message with its API names said in words. */
export function withoutIdentifiers(message: string): string {
  return message.replace(IDENTIFIER, (match) => pathWords(match));
}

/** A source text as users read it: our notes' shorthand and file names said in words. */
export function sourceWords(text: string): string {
  return withoutIdentifiers(
    text
      .replace(/from memory, not yet confirmed against a published source/g, 'value not yet checked against its published source')
      .replace(/\(([^()]+?)[,;]\s*from memory\)/g, '($1; value not yet checked against its published source)')
      .replace(/\(from memory\)/g, '(value not yet checked against its published source)')
      .replace(/\s*\[M\]/g, ' (value not yet checked against its published source)')
      .replace(/\s*\[S:[^\]]*\]/g, '')
      .replace(/\bDOMAIN\.md's\s+/g, "Eclipta's reference ")
      .replace(/\bDOMAIN\.md\b/g, "Eclipta's reference notes")
      .replace(/\bPROVISIONAL\b/g, 'provisional')
      .replace(/sigma\*T_eff\^4/g, 'σT⁴ at the effective temperature')
      .replace(/sigma\*T\^4/g, 'σT⁴'),
  );
}
