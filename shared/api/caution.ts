// The preliminary-design caution (DOMAIN.md "Where it can hurt"): every result page, export and
// mail carries it, in these words, with the crewed sentence for crewed vehicles.
export const cautionText =
  'Preliminary-design estimate from simplified models. Verify with detailed analysis, a correlated model and thermal test under the project\'s standards and qualified practitioners.';
export const crewedCaution = 'Habitability and touch-temperature limits are not checked.';
export const cautionFor = (crewed: boolean): string => (crewed ? `${cautionText} ${crewedCaution}` : cautionText);
