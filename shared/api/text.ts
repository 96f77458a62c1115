// What a name or a free text may hold, in one place for every schema that takes one: printable
// text. Control characters (C0 with NUL, BEL, ESC, CR and LF; DEL; C1), the Unicode line and
// paragraph separators and lone surrogate halves are refused with a 400 naming the field, so a
// name cannot forge a line in a mail, a log or a CSV, nor break a terminal. Multi-line free text
// (descriptions) may keep line feeds and tabs.
import { z } from 'zod';

/** Anything that is not one line of printable text (with `u`, \p{Cs} matches only unpaired surrogates). */
// eslint-disable-next-line no-control-regex
export const lineControls = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]|\p{Cs}/gu;
/** The same for multi-line text, where LF and tab are allowed. */
// eslint-disable-next-line no-control-regex
const textControls = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]|\p{Cs}/u;

const codePoint = (char: string): string => `U+${(char.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`;

function refuseControls(pattern: RegExp, what: string) {
  return (text: string, ctx: z.core.$RefinementCtx<string>): void => {
    const match = new RegExp(pattern.source, 'u').exec(text);
    if (!match) return;
    const kind = /\p{Cs}/u.test(match[0]) ? 'half of a Unicode character' : 'a control character';
    ctx.addIssue({
      code: 'custom',
      input: text,
      message: `holds ${kind} (${codePoint(match[0])}, character ${[...text.slice(0, match.index)].length + 1}); ${what}`,
    });
  };
}

/**
 * One line of text: a name, a label, a unit, a source note. Trimmed; at most `max` characters
 * (`tooLong` says so in the field's words); control characters refused. Add `.min(1, …)` where
 * an empty text is not allowed.
 */
export const lineText = (max: number, tooLong = `has at most ${max} characters`) =>
  z.string().trim().max(max, tooLong).superRefine(refuseControls(lineControls, 'a name is one line of plain text'));

/** Free text over several lines (a description): like lineText, but line feeds and tabs are kept. */
export const multilineText = (max: number, tooLong = `has at most ${max} characters`) =>
  z.string().trim().max(max, tooLong).superRefine(refuseControls(textControls, 'only line breaks (LF) and tabs may be in this text'));

/** The text with every control character removed, for names we show but did not ask for (an uploaded file's name). */
export const withoutControls = (text: string): string => text.replace(lineControls, '');
