// SHA-256 of a string's UTF-8 bytes, as lowercase hex, through @noble/hashes (audited,
// synchronous and browser-safe: the study parser stays synchronous and runs unchanged in
// the browser, where node:crypto is absent and Web Crypto is asynchronous).
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils';

export function sha256Hex(text: string): string {
  return bytesToHex(sha256(utf8ToBytes(text)));
}
