/**
 * Text and bytes as one run of UTF-8 bytes with a memory of its own, which a thread can hand to
 * another without a copy (a Buffer may be a slice of Node's shared pool, which cannot be handed over).
 */
export function utf8Of(parts: (string | Uint8Array)[]): Uint8Array {
  const encoder = new TextEncoder();
  const bytes = parts.map((part) => (typeof part === 'string' ? encoder.encode(part) : part));
  const whole = new Uint8Array(bytes.reduce((n, b) => n + b.byteLength, 0));
  let at = 0;
  for (const b of bytes) {
    whole.set(b, at);
    at += b.byteLength;
  }
  return whole;
}
