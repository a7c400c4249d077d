import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { EVIDENCE_TYPES, type EvidenceType } from './file-type.ts';

const THUMBNAIL_PX = 320;
const folder = (dataDir: string) => join(dataDir, 'evidence');
const thumbnailName = (storedName: string) => `${storedName}.thumb.jpg`;

/**
 * Writes an upload under the data folder with a generated name (nothing of the person's file name
 * reaches the disk) and, for photos the image library reads, a JPEG thumbnail. HEIC photos from
 * phones are kept without one. The image library is loaded on the first photo (about 8 MB).
 */
export async function storeEvidence(dataDir: string, bytes: Buffer, type: EvidenceType): Promise<{ storedName: string; hasThumbnail: boolean }> {
  await mkdir(folder(dataDir), { recursive: true });
  const storedName = `${randomUUID()}.${EVIDENCE_TYPES[type]}`;
  await writeFile(join(folder(dataDir), storedName), bytes, { flag: 'wx' });
  if (!['image/jpeg', 'image/png', 'image/webp'].includes(type)) return { storedName, hasThumbnail: false };
  try {
    const { default: sharp } = await import('sharp');
    const thumbnail = await sharp(bytes).rotate().resize(THUMBNAIL_PX, THUMBNAIL_PX, { fit: 'inside' }).jpeg({ quality: 80 }).toBuffer();
    await writeFile(join(folder(dataDir), thumbnailName(storedName)), thumbnail);
    return { storedName, hasThumbnail: true };
  } catch {
    // A photo the library cannot read is still evidence; it is shown as a file.
    return { storedName, hasThumbnail: false };
  }
}

/** Removes what storeEvidence wrote, when the record of it could not be saved. */
export async function discardEvidence(dataDir: string, storedName: string): Promise<void> {
  await rm(join(folder(dataDir), storedName), { force: true });
  await rm(join(folder(dataDir), thumbnailName(storedName)), { force: true });
}

export function readEvidence(dataDir: string, storedName: string, thumbnail = false): Promise<Buffer> {
  return readFile(join(folder(dataDir), thumbnail ? thumbnailName(storedName) : storedName));
}
