import type { Generated } from 'kysely';

/** A photo or document proving a failure, stored under the data folder with a generated name. */
export interface ClaimEvidenceTable {
  id: Generated<number>;
  claimId: number;
  /** The name it was uploaded with, cleaned, for showing and downloading only. */
  fileName: string;
  storedName: string;
  /** Found from the file's bytes, never from its name or the browser's word. */
  contentType: string;
  sizeBytes: number;
  hasThumbnail: number;
  uploadedBy: number | null;
  uploadedAt: string;
  /** Deleting is recorded: the row stays, marked, with who and why. */
  deletedAt: Generated<string | null>;
  deletedBy: Generated<number | null>;
  deleteReason: Generated<string | null>;
}
