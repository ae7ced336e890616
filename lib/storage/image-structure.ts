/**
 * Walks an image container from its first byte to find where the image ends and which parts are not
 * pixel data. Used to refuse truncated files and files that are an image and something else at once.
 * Pure: works on bytes only.
 */

export type ImageFormat = "jpeg" | "png" | "webp";
export type ByteRange = { start: number; end: number };

export type ImageStructure =
  | { complete: true; /** index just past the image's own end marker */ end: number; /** non-pixel parts: metadata, comments, text */ sideData: ByteRange[] }
  | { complete: false; problem: string };

export function inspectStructure(bytes: Uint8Array, format: ImageFormat): ImageStructure {
  switch (format) {
    case "jpeg":
      return walkJpeg(bytes);
    case "png":
      return walkPng(bytes);
    case "webp":
      return walkWebp(bytes);
  }
}

const incomplete = (problem: string): ImageStructure => ({ complete: false, problem });

/**
 * JPEG (ITU-T T.81 Annex B): SOI, then marker segments each with a 2-byte big-endian length; after
 * each SOS header comes entropy-coded data in which 0xFF is followed by 0x00 (stuffing) or RST0–7;
 * EOI (0xFFD9) ends the image.
 */
function walkJpeg(b: Uint8Array): ImageStructure {
  if (b.length < 4 || b[0] !== 0xff || b[1] !== 0xd8) return incomplete("no SOI marker");
  const sideData: ByteRange[] = [];
  let pos = 2;
  let sawScan = false;
  while (pos < b.length) {
    if (b[pos] !== 0xff) {
      // libjpeg skips stray bytes before a marker (with a warning); do the same rather than refuse.
      pos++;
      continue;
    }
    while (pos < b.length && b[pos] === 0xff) pos++; // fill bytes
    const marker = b[pos];
    if (marker === undefined) break;
    pos++;
    if (marker === 0xd9) return sawScan ? { complete: true, end: pos, sideData } : incomplete("EOI before any scan");
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) continue; // TEM, RSTn: no length
    const len = readU16BE(b, pos);
    if (len === undefined || len < 2 || pos + len > b.length) return incomplete("segment runs past the end of the file");
    const segEnd = pos + len;
    if ((marker >= 0xe0 && marker <= 0xef) || marker === 0xfe) sideData.push({ start: pos + 2, end: segEnd }); // APPn, COM
    pos = segEnd;
    if (marker === 0xda) {
      sawScan = true;
      // Entropy-coded data runs to the next marker that is not stuffing or a restart.
      while (pos < b.length) {
        if (b[pos] === 0xff) {
          const next = b[pos + 1];
          if (next === undefined) return incomplete("scan data cut off");
          if (next !== 0x00 && !(next >= 0xd0 && next <= 0xd7) && next !== 0xff) break;
          pos += next === 0xff ? 1 : 2;
        } else {
          pos++;
        }
      }
    }
  }
  return incomplete("no EOI marker");
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
// Chunks that carry pixels or their description; everything else is side data (PNG spec, W3C, §5.6 and §11).
const PNG_PIXEL_CHUNKS = new Set(["IHDR", "PLTE", "IDAT", "IEND", "tRNS", "acTL", "fcTL", "fdAT"]);

/** PNG (W3C PNG Specification §5): signature, then chunks of length, type, data and CRC until IEND. */
function walkPng(b: Uint8Array): ImageStructure {
  if (b.length < 8 || PNG_SIGNATURE.some((v, i) => b[i] !== v)) return incomplete("no PNG signature");
  const sideData: ByteRange[] = [];
  let pos = 8;
  let sawData = false;
  while (pos + 8 <= b.length) {
    const len = readU32BE(b, pos);
    if (len === undefined) break;
    const type = ascii(b, pos + 4, 4);
    const dataStart = pos + 8;
    const chunkEnd = dataStart + len + 4;
    if (chunkEnd > b.length) return incomplete(`${type} chunk runs past the end of the file`);
    if (type === "IDAT") sawData = true;
    if (type === "IEND") return sawData ? { complete: true, end: chunkEnd, sideData } : incomplete("IEND before any IDAT");
    if (!PNG_PIXEL_CHUNKS.has(type)) sideData.push({ start: dataStart, end: dataStart + len });
    pos = chunkEnd;
  }
  return incomplete("no IEND chunk");
}

const WEBP_PIXEL_CHUNKS = new Set(["VP8 ", "VP8L", "VP8X", "ALPH", "ANIM", "ANMF"]);

/** WebP (RFC 9649 §2): "RIFF", a little-endian size counting from byte 8, "WEBP", then padded chunks. */
function walkWebp(b: Uint8Array): ImageStructure {
  if (b.length < 12 || ascii(b, 0, 4) !== "RIFF" || ascii(b, 8, 4) !== "WEBP") return incomplete("no RIFF/WEBP header");
  const riffSize = readU32LE(b, 4);
  if (riffSize === undefined || riffSize < 4) return incomplete("bad RIFF size");
  const end = 8 + riffSize;
  if (end > b.length) return incomplete("RIFF data cut off");
  const sideData: ByteRange[] = [];
  let pos = 12;
  let sawImage = false;
  while (pos + 8 <= end) {
    const type = ascii(b, pos, 4);
    const len = readU32LE(b, pos + 4);
    if (len === undefined) break;
    const dataStart = pos + 8;
    if (dataStart + len > end) return incomplete(`${type} chunk runs past the RIFF end`);
    if (type === "VP8 " || type === "VP8L" || type === "ANMF") sawImage = true;
    if (!WEBP_PIXEL_CHUNKS.has(type)) sideData.push({ start: dataStart, end: dataStart + len });
    pos = dataStart + len + (len % 2); // chunks are padded to an even size
  }
  if (pos !== end) return incomplete("chunks do not fill the RIFF size");
  return sawImage ? { complete: true, end, sideData } : incomplete("no image chunk");
}

/** Web markup or script that a browser or server would run if it read these bytes as text. */
const ACTIVE_CONTENT = /<script|<html|<\?php|<svg[\s>/]|<!doctype|<iframe|<body|<object|<embed|javascript:/i;

export function containsActiveContent(bytes: Uint8Array): boolean {
  // latin1 maps every byte to one character, so offsets and ASCII matches are exact.
  return ACTIVE_CONTENT.test(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("latin1"));
}

/**
 * A ZIP end-of-central-directory record where a ZIP reader looks for it (PKWARE APPNOTE §4.3.16: the
 * record is the last thing in the file, after an optional comment whose length it states). A JPEG
 * or PNG with this at its end opens as an archive, whatever its first bytes say.
 */
export function endsWithZipDirectory(b: Uint8Array): boolean {
  const minimum = 22;
  const earliest = Math.max(0, b.length - minimum - 0xffff);
  for (let pos = b.length - minimum; pos >= earliest; pos--) {
    if (b[pos] === 0x50 && b[pos + 1] === 0x4b && b[pos + 2] === 0x05 && b[pos + 3] === 0x06) {
      const commentLength = readU16LE(b, pos + 20);
      if (commentLength !== undefined && pos + minimum + commentLength === b.length) return true;
    }
  }
  return false;
}

/** True when every byte is the same padding value (0x00 or 0xFF): such a tail cannot carry anything. */
export function isPadding(b: Uint8Array): boolean {
  const first = b[0];
  if (first === undefined) return true;
  return (first === 0x00 || first === 0xff) && b.every((v) => v === first);
}

function readU16BE(b: Uint8Array, pos: number): number | undefined {
  const hi = b[pos];
  const lo = b[pos + 1];
  return hi === undefined || lo === undefined ? undefined : (hi << 8) | lo;
}

function readU16LE(b: Uint8Array, pos: number): number | undefined {
  const lo = b[pos];
  const hi = b[pos + 1];
  return hi === undefined || lo === undefined ? undefined : (hi << 8) | lo;
}

function readU32BE(b: Uint8Array, pos: number): number | undefined {
  if (pos + 4 > b.length) return undefined;
  return new DataView(b.buffer, b.byteOffset, b.byteLength).getUint32(pos, false);
}

function readU32LE(b: Uint8Array, pos: number): number | undefined {
  if (pos + 4 > b.length) return undefined;
  return new DataView(b.buffer, b.byteOffset, b.byteLength).getUint32(pos, true);
}

function ascii(b: Uint8Array, pos: number, length: number): string {
  return String.fromCharCode(...b.subarray(pos, pos + length));
}
