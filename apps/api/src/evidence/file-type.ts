/** The kinds of evidence Busbar keeps, by what their bytes say. */
export const EVIDENCE_TYPES = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/heic': 'heic',
  'application/pdf': 'pdf',
} as const;
export type EvidenceType = keyof typeof EVIDENCE_TYPES;

const startsWith = (bytes: Buffer, signature: number[], at = 0) => signature.every((byte, i) => bytes[at + i] === byte);
const ascii = (bytes: Buffer, from: number, to: number) => bytes.subarray(from, to).toString('latin1');
// ISO base media brands of HEIF still images (ISO/IEC 23008-12).
const HEIF_BRANDS = ['heic', 'heix', 'heim', 'heis', 'hevc', 'hevx', 'mif1', 'msf1'];

/**
 * The file's type from its leading bytes (JPEG SOI marker, PNG signature, RIFF WEBP, an ISO BMFF
 * `ftyp` box of a HEIF brand, `%PDF-`), or null for anything else: a renamed executable stays null.
 */
export function detectEvidenceType(bytes: Buffer): EvidenceType | null {
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return 'image/jpeg';
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  if (ascii(bytes, 0, 4) === 'RIFF' && ascii(bytes, 8, 12) === 'WEBP') return 'image/webp';
  if (ascii(bytes, 4, 8) === 'ftyp' && HEIF_BRANDS.includes(ascii(bytes, 8, 12))) return 'image/heic';
  if (ascii(bytes, 0, 5) === '%PDF-') return 'application/pdf';
  return null;
}

/** A name safe to show and to put in a download header: the last path part, letters, digits and a few marks only. */
export function cleanFileName(name: string, type: EvidenceType): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const cleaned = base.normalize('NFKC').replace(/[^\p{L}\p{N}._ -]/gu, '_').replace(/^[.\s]+/, '').slice(0, 100).trim();
  return cleaned || `evidence.${EVIDENCE_TYPES[type]}`;
}
