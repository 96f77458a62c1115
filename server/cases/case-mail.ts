// The mail a subscriber gets when a new revision of a case they follow is released: what changed
// in the per-surface orbit-average loads, and where to see it.
import type { CaseComparison } from '../../shared/api/cases';
import type { LoadCaseRow } from '../db/schema';
import type { OutgoingMail } from '../mail/mailer';

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
  const lines = [
    `Revision ${row.revision} of the ${row.kind} load case "${row.name}" (mission "${row.inputs.mission.name}") was released at ${row.releasedAt ?? ''}.`,
    `Checksum (sha256): ${row.checksum ?? ''}`,
    '',
  ];
  if (previous && differences) {
    lines.push(`Orbit-average absorbed loads, revision ${previous.revision} -> ${row.revision}:`);
    for (const d of differences) {
      if (!d.absorbedW) {
        lines.push(`  ${d.name}: ${d.absorbedW === null ? 'surface added or removed' : ''}`);
        continue;
      }
      lines.push(`  ${d.name}: ${w(d.absorbedW.a)} -> ${w(d.absorbedW.b)} (${signed(d.absorbedW.difference)})`);
    }
    const a = previous.results.total.orbitAverageAbsorbedW;
    const b = row.results.total.orbitAverageAbsorbedW;
    lines.push(`  spacecraft total: ${w(a)} -> ${w(b)} (${signed(b - a)})`);
    lines.push(`  beta: ${previous.results.betaDeg.toFixed(1)} deg -> ${row.results.betaDeg.toFixed(1)} deg`);
    lines.push('', `Revision ${previous.revision} is now superseded.`);
  } else {
    lines.push('This is the first released revision of the case.');
  }
  lines.push('', `See the case: ${opts.link}`, '', 'You get this mail because you subscribed to this case in Eclipta.');
  return { to: opts.to, subject: `Load case "${row.name}" revision ${row.revision} released`, text: lines.join('\n') };
}
