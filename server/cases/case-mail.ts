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
    '',
  ];
  if (previous && differences) {
    lines.push(`Orbit-average absorbed loads, revision ${previous.revision} -> ${row.revision}:`);
    for (const d of differences) {
      if (!d.absorbedW) {
        lines.push(`  ${withoutControls(d.name)}: ${d.absorbedW === null ? 'surface added or removed' : ''}`);
        continue;
      }
      lines.push(`  ${withoutControls(d.name)}: ${w(d.absorbedW.a)} -> ${w(d.absorbedW.b)} (${signed(d.absorbedW.difference)})`);
    }
    const a = previous.results.total.orbitAverageAbsorbedW;
    const b = row.results.total.orbitAverageAbsorbedW;
    lines.push(`  spacecraft total: ${w(a)} -> ${w(b)} (${signed(b - a)})`);
    lines.push(`  beta: ${previous.results.betaDeg.toFixed(1)} deg -> ${row.results.betaDeg.toFixed(1)} deg`);
    lines.push('', `Revision ${previous.revision} is now superseded.`);
  } else {
    lines.push('This is the first released revision of the case.');
  }
  lines.push('', `See the case: ${opts.link}`, '', cautionFor(row.inputs.mission.crewed), '', 'You get this mail because you subscribed to this case in Eclipta.');
  return { to: opts.to, subject: `Load case "${name}" revision ${row.revision} released`, text: lines.join('\n') };
}
