import { isUtf8 } from 'node:buffer';
import { gunzipSync } from 'node:zlib';
import { UPLOAD_MAX_UNPACKED_BYTES } from '../../shared/upload-columns';
import { UploadRejected } from './uploads-issues';

const SAVE_AS = 'save it from your spreadsheet as “CSV UTF-8 (comma delimited)”';

/**
 * The uploaded bytes, checked to be UTF-8 text (with or without a BOM) and unpacked when gzip-compressed.
 * Anything else is refused with a message that says how to fix it, before any row is read. The bytes stay
 * a Buffer (the CSV parser reads bytes): no second copy of the file as a string.
 */
export function decodeUpload(raw: Buffer): Buffer {
  let buf = raw;
  if (buf.length >= 2 && buf[0] === 0x1f && buf[1] === 0x8b) {
    try {
      buf = gunzipSync(buf, { maxOutputLength: UPLOAD_MAX_UNPACKED_BYTES, chunkSize: outputChunk(buf) });
    } catch (e) {
      if (e instanceof RangeError || (e as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE') {
        throw new UploadRejected(413, `The unpacked file is larger than ${UPLOAD_MAX_UNPACKED_BYTES / 1024 / 1024} MiB; split it into smaller files`);
      }
      throw new UploadRejected(422, 'The file looks gzip-compressed but cannot be unpacked; upload the plain CSV file');
    }
  }
  if (buf.length === 0) {
    throw new UploadRejected(422, 'The file is empty; it needs a header row and at least one data row');
  }
  if ((buf[0] === 0xff && buf[1] === 0xfe) || (buf[0] === 0xfe && buf[1] === 0xff)) {
    throw new UploadRejected(422, `The file is UTF-16 text, not UTF-8; ${SAVE_AS}`);
  }
  const nul = buf.indexOf(0);
  if (nul !== -1) {
    throw new UploadRejected(422, `The file contains NUL bytes (at byte ${nul}), so it is not UTF-8 text (UTF-16, or not a CSV at all); ${SAVE_AS}`);
  }
  if (!isUtf8(buf)) {
    const at = firstInvalidUtf8(buf);
    throw new UploadRejected(
      422,
      `The file is not UTF-8 text: byte 0x${buf[at]?.toString(16).padStart(2, '0')} at position ${at} is not valid UTF-8 (probably Latin-1 or Windows-1252, e.g. an accented letter); ${SAVE_AS}`,
    );
  }
  return buf;
}

/**
 * gzip's trailer states the unpacked size (modulo 4 GiB). Unpacking into one piece of that size (plus one byte,
 * so the end is seen without another piece) spares the second full copy made when pieces are joined. The figure
 * is only a hint: a wrong one costs that copy, never a wrong result, and the limit above still holds.
 */
function outputChunk(gz: Buffer): number {
  const stated = gz.length >= 18 ? gz.readUInt32LE(gz.length - 4) : 0;
  return Math.min(Math.max(stated + 1, 64 * 1024), UPLOAD_MAX_UNPACKED_BYTES);
}

/** The offset of the first byte that breaks UTF-8 (only computed for the error message). */
function firstInvalidUtf8(buf: Buffer): number {
  let i = 0;
  while (i < buf.length) {
    const b = buf[i]!;
    const n = b < 0x80 ? 1 : b >= 0xc2 && b < 0xe0 ? 2 : b >= 0xe0 && b < 0xf0 ? 3 : b >= 0xf0 && b < 0xf5 ? 4 : 0;
    if (n === 0) return i;
    for (let k = 1; k < n; k++) if (((buf[i + k] ?? 0) & 0xc0) !== 0x80) return i;
    i += n;
  }
  return Math.max(0, buf.length - 1);
}
