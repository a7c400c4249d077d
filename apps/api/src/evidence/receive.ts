import type { Request, Response } from 'express';
import multer from 'multer';
import { HttpError } from '../errors.ts';

/** The largest evidence file, bytes: a phone photo at full size fits. */
export const MAX_EVIDENCE_BYTES = 15 * 2 ** 20;

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_EVIDENCE_BYTES, files: 1, fields: 0 } }).single('file');

const refused = (message: string) => new HttpError(400, 'invalid', message, { file: message });

/** The one file of a multipart request (field `file`), held in memory, never written under its own name. */
export function receiveFile(req: Request, res: Response): Promise<Express.Multer.File> {
  return new Promise((resolve, reject) => {
    upload(req, res, (error: unknown) => {
      if (error instanceof multer.MulterError) {
        reject(refused(error.code === 'LIMIT_FILE_SIZE' ? `The file is larger than ${MAX_EVIDENCE_BYTES / 2 ** 20} MB` : 'Send one file, in the field named file'));
      } else if (error) reject(refused('The upload could not be read'));
      else if (!req.file) reject(refused('Choose a file to upload'));
      else resolve(req.file);
    });
  });
}
