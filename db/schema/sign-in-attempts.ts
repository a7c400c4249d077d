import type { Generated } from 'kysely';

/** A failed sign-in (`sign_in`) or a password-reset request (`reset`), counted over a recent window. */
export interface SignInAttemptsTable {
  id: Generated<number>;
  kind: 'sign_in' | 'reset';
  /** The e-mail as typed (trimmed, lower case), whether or not an account has it. */
  email: string;
  /** The client's address; an IPv6 address as its /56 network, which one client usually holds whole. */
  address: string;
  at: string;
}
