export interface SessionsTable {
  sid: string;
  /** The signed-in person, so ending someone's access can end their open sessions. */
  userId: number | null;
  data: string;
  expiresAt: string;
}
