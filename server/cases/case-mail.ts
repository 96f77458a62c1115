// The mail a subscriber gets when a new revision of a case they follow is released: what changed
// in the per-surface orbit-average loads, and where to see it.
import type { CaseComparison } from '../../shared/api/cases';
import { withoutControls } from '../../shared/api/text';
import type { LoadCaseRow } from '../db/schema';
import type { OutgoingMail } from '../mail/mailer';
import { cautionFor } from './case-views';

const w = (x: number) => `${x.toFixed(1)} W`;
const signed = (x: number) => `${x >= 0 ? '+' : '-'}${Math.abs(x).toFixed(1)} W`;

export function caseReleasedMail(opts: {
  to: string;
  row: LoadCaseRow;
  previous: LoadCaseRow | null;
  differences: CaseComparison['surfaces'] | null;
  link: string;
}): OutgoingMail {
  const { row, previous, differences } = opts;
  // Names are refused with control characters on the way in (shared/api/text.ts); a row stored
  // before that rule still cannot start a line or a header of its own here.
  const name = withoutControls(row.name);
  const lines = [
    `Revision ${row.revision} of the ${row.kind} load case "${name}" (mission "${withoutControls(row.inputs.mission.name)}") was released at ${row.releasedAt ?? ''}.`,
    `Checksum (sha256): ${row.checksum ?? ''}`,
    ...(row.inputs.revisionReason ? [`Reason for this revision: ${withoutControls(row.inputs.revisionReason)}`] : []),
    '',
  ];
  if (previous && differences) {
    // Only what changed as the mail writes it (0.1 W, 0.1 deg): a difference that rounds to zero is no change.
    const changed = (a: number, b: number) => a.toFixed(1) !== b.toFixed(1);
    const a = previous.results.total.orbitAverageAbsorbedW;
    const b = row.results.total.orbitAverageAbsorbedW;
    const changes: string[] = [];
    for (const d of differences) {
      if (!d.absorbedW) changes.push(`  ${withoutControls(d.name)}: surface added or removed`);
      else if (changed(d.absorbedW.a, d.absorbedW.b)) changes.push(`  ${withoutControls(d.name)}: ${w(d.absorbedW.a)} -> ${w(d.absorbedW.b)} (${signed(d.absorbedW.difference)})`);
    }
    if (changed(a, b)) changes.push(`  spacecraft total: ${w(a)} -> ${w(b)} (${signed(b - a)})`);
    const before = previous.inputs.margins.heatLoadPercent;
    const now = row.inputs.margins.heatLoadPercent;
    if (before !== now) changes.push(`  heat-load margin: ${before} % -> ${now} % (${now - before >= 0 ? '+' : '-'}${Math.abs(now - before)} percentage points)`);
    if (changed(previous.results.betaDeg, row.results.betaDeg)) changes.push(`  beta: ${previous.results.betaDeg.toFixed(1)} deg -> ${row.results.betaDeg.toFixed(1)} deg`);
    if (changes.length > 0) lines.push(`Changes from revision ${previous.revision} to ${row.revision} (orbit-average absorbed loads, new - old):`, ...changes);
    else lines.push(`No orbit-average absorbed load, margin or beta changed from revision ${previous.revision} (to 0.1).`);
    lines.push('', `Revision ${previous.revision} is now superseded.`);
  } else {
    lines.push('This is the first released revision of the case.');
  }
  lines.push('', `See the case: ${opts.link}`, '', cautionFor(row.inputs.mission.crewed), '', 'You get this mail because you subscribed to this case in Eclipta.');
  return { to: opts.to, subject: `Load case "${name}" revision ${row.revision} released`, text: lines.join('\n') };
}
