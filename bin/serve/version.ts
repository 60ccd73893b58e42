import { createHash } from 'node:crypto';

/**
 * The version of a document: a hash of its exact bytes. The page sends back
 * the version it loaded, so a write can tell whether the file changed since.
 * @example versionOf(Buffer.from('L = 1 m')) // '3c0e…' (24 hex digits)
 */
export function versionOf(bytes: Buffer | string): string {
  return createHash('sha256').update(bytes).digest('hex').slice(0, 24);
}
