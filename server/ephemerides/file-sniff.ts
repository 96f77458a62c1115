// A first look at the uploaded bytes, before any parsing: empty, compressed or binary files are
// refused with a sentence that says what they look like; text is told apart as CCSDS OEM (its
// first non-empty line is CCSDS_OEM_VERS) or CSV by content, never by the file's extension.
export type Sniffed = { format: 'csv' | 'oem' } | { refused: string };

const SAMPLE_BYTES = 8192;
const signatures: { bytes: number[]; what: string }[] = [
  { bytes: [0x1f, 0x8b], what: 'gzip' },
  { bytes: [0x50, 0x4b, 0x03, 0x04], what: 'zip' },
  { bytes: [0x42, 0x5a, 0x68], what: 'bzip2' },
  { bytes: [0xfd, 0x37, 0x7a, 0x58, 0x5a, 0x00], what: 'xz' },
  { bytes: [0x28, 0xb5, 0x2f, 0xfd], what: 'zstd' },
  { bytes: [0x37, 0x7a, 0xbc, 0xaf, 0x27, 0x1c], what: '7-zip' },
];

/** How many leading bytes `sniffBytes` wants to see (fewer only when the file is shorter). */
export const SNIFF_BYTES = SAMPLE_BYTES;

/** The verdict on a file from its first SNIFF_BYTES bytes (all of them for a shorter file). */
export function sniffBytes(head: Uint8Array): Sniffed {
  const bytes = head.subarray(0, SAMPLE_BYTES);
  const length = bytes.length;
  if (length === 0) return { refused: 'the file is empty' };
  for (const s of signatures) {
    if (s.bytes.every((b, i) => bytes[i] === b)) return { refused: `looks like a compressed file (${s.what}); upload the uncompressed text` };
  }
  if (bytes.includes(0)) return { refused: 'not a text file: it holds binary data; upload CSV or a CCSDS OEM text file' };
  let text: string;
  try {
    // stream: true lets a character cut at the end of the sample pass; a real encoding error throws.
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes, { stream: true });
  } catch {
    return { refused: 'not UTF-8 text: save the file as UTF-8 (CSV or CCSDS OEM)' };
  }
  const firstLine = text.replace(/^\uFEFF/, '').split(/\r?\n/).find((l) => l.trim() !== '');
  if (firstLine === undefined) return { refused: 'the file is empty: it holds only blank lines' };
  return { format: /^\s*CCSDS_OEM_VERS\b/.test(firstLine) ? 'oem' : 'csv' };
}
