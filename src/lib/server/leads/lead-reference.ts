import { customAlphabet } from 'nanoid';

// No 0/O or 1/I/L: a reference is read out over the phone.
const code = customAlphabet('23456789ABCDEFGHJKMNPQRSTUVWXYZ', 8);

/** A short code for a lead, like `K7MX-42QD`. 31^8 ≈ 8.5e11 codes; collisions are retried by the caller. */
export function newLeadReference(): string {
  const raw = code();
  return `${raw.slice(0, 4)}-${raw.slice(4)}`;
}
