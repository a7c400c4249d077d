import { describe, expect, it } from 'vitest';
import { cleanFileName, detectEvidenceType } from '../../apps/api/src/evidence/file-type.ts';

const bytes = (...parts: (number[] | string)[]) => Buffer.concat(parts.map((p) => (typeof p === 'string' ? Buffer.from(p, 'latin1') : Buffer.from(p))));

// Signatures as the formats define them: JPEG's SOI marker (ITU T.81), the PNG signature (PNG
// specification §5.2), a RIFF container of form WEBP, an ISO BMFF ftyp box with a HEIF brand
// (ISO/IEC 23008-12), and PDF's header (ISO 32000).
describe('evidence type from the bytes', () => {
  it.each([
    ['image/jpeg', bytes([0xff, 0xd8, 0xff, 0xe0], 'JFIF')],
    ['image/png', bytes([0x89], 'PNG', [0x0d, 0x0a, 0x1a, 0x0a])],
    ['image/webp', bytes('RIFF', [0x24, 0, 0, 0], 'WEBPVP8 ')],
    ['image/heic', bytes([0, 0, 0, 0x18], 'ftypheic', [0, 0, 0, 0], 'mif1')],
    ['image/heic', bytes([0, 0, 0, 0x1c], 'ftypmif1')],
    ['application/pdf', bytes('%PDF-1.4\n')],
  ])('knows %s', (type, file) => {
    expect(detectEvidenceType(file)).toBe(type);
  });

  it.each([
    ['an ELF executable', bytes([0x7f], 'ELF')],
    ['a Windows executable', bytes('MZ', [0x90, 0])],
    ['an MP4 video', bytes([0, 0, 0, 0x18], 'ftypisom')],
    ['a RIFF sound', bytes('RIFF', [0, 0, 0, 0], 'WAVE')],
    ['HTML', bytes('<!doctype html>')],
    ['nothing', bytes([])],
  ])('refuses %s', (_name, file) => {
    expect(detectEvidenceType(file)).toBeNull();
  });
});

describe('file names kept for showing', () => {
  it('keeps the last part of a path and plain characters only', () => {
    expect(cleanFileName('../../etc/passwd.png', 'image/png')).toBe('passwd.png');
    expect(cleanFileName('C:\\Users\\me\\Zoë photo (1).jpg', 'image/jpeg')).toBe('Zoë photo _1_.jpg');
    expect(cleanFileName('a"b;c\r\n.pdf', 'application/pdf')).toBe('a_b_c__.pdf');
    expect(cleanFileName('...hidden', 'image/png')).toBe('hidden');
    expect(cleanFileName('///', 'image/webp')).toBe('evidence.webp');
  });
});
