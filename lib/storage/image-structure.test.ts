// Container walking checked on files made by sharp (libjpeg-turbo/mozjpeg, libspng, libwebp: reference
// encoders), against the end-of-image rules of ITU-T T.81, the W3C PNG spec and RFC 9649.
import fc from "fast-check";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { jpegWithGpsExif, noisyJpeg, storedZip, withJpegComment } from "@/lib/storage/hardening-fixtures";
import { containsActiveContent, endsWithZipDirectory, inspectStructure, isPadding, type ImageFormat } from "@/lib/storage/image-structure";

let samples: { name: string; format: ImageFormat; bytes: Buffer }[];

beforeAll(async () => {
  const photo = await noisyJpeg(320, 240);
  samples = [
    { name: "baseline JPEG", format: "jpeg", bytes: photo },
    { name: "progressive JPEG (several scans)", format: "jpeg", bytes: await noisyJpeg(320, 240, { progressive: true }) },
    { name: "JPEG with EXIF, XMP and ICC segments", format: "jpeg", bytes: await jpegWithGpsExif(320, 240) },
    { name: "PNG", format: "png", bytes: await sharp(photo).png().toBuffer() },
    { name: "interlaced PNG (Adam7)", format: "png", bytes: await sharp(photo).png({ progressive: true }).toBuffer() },
    { name: "lossy WebP", format: "webp", bytes: await sharp(photo).webp().toBuffer() },
    { name: "lossless WebP", format: "webp", bytes: await sharp(photo).webp({ lossless: true }).toBuffer() },
    { name: "WebP with alpha (VP8X + ALPH)", format: "webp", bytes: await sharp(photo).ensureAlpha(0.5).webp().toBuffer() },
    { name: "WebP with EXIF chunk", format: "webp", bytes: await sharp(photo).withExif({ IFD0: { Make: "ShoalTestCam" } }).webp().toBuffer() },
  ];
});

describe("inspectStructure", () => {
  it("finds the end of each valid file exactly at its last byte", () => {
    for (const s of samples) {
      const result = inspectStructure(s.bytes, s.format);
      expect(result, s.name).toMatchObject({ complete: true, end: s.bytes.length });
    }
  });

  it("reports metadata segments and chunks as side data", () => {
    const withMeta = samples.find((s) => s.name.startsWith("JPEG with EXIF"));
    const result = withMeta && inspectStructure(withMeta.bytes, "jpeg");
    // APP1 (EXIF), APP1 (XMP) and APP2 (ICC) segments: T.81 Annex B / Exif 2.32 §4.5.4
    expect(result?.complete && result.sideData.length).toBeGreaterThanOrEqual(3);
    const webpExif = samples.find((s) => s.name === "WebP with EXIF chunk");
    const webp = webpExif && inspectStructure(webpExif.bytes, "webp");
    expect(webp?.complete && webp.sideData.length).toBe(1);
  });

  it("calls every strict prefix of a valid file incomplete", () => {
    for (const s of samples) {
      fc.assert(
        fc.property(fc.integer({ min: 0, max: s.bytes.length - 1 }), (cut) => !inspectStructure(s.bytes.subarray(0, cut), s.format).complete),
        { numRuns: 150 },
      );
    }
  });

  it("keeps the image's end where it was whatever is appended", () => {
    for (const s of samples) {
      fc.assert(
        fc.property(fc.uint8Array({ minLength: 1, maxLength: 300 }), (tail) => {
          const result = inspectStructure(Buffer.concat([s.bytes, tail]), s.format);
          return result.complete && result.end === s.bytes.length;
        }),
        { numRuns: 60 },
      );
    }
  });

  it("does not take a JPEG thumbnail's end marker inside EXIF for the end of the image", async () => {
    // An EXIF thumbnail is a whole JPEG (with its own EOI) inside APP1; here a JPEG inside a COM segment.
    const inner = await noisyJpeg(16, 16);
    const outer = withJpegComment(await noisyJpeg(200, 200), inner.toString("latin1"));
    expect(inspectStructure(outer, "jpeg")).toMatchObject({ complete: true, end: outer.length });
  });

  it("refuses files whose first bytes are not the format's signature", () => {
    expect(inspectStructure(Buffer.from("GIF89a...."), "jpeg").complete).toBe(false);
    expect(inspectStructure(Buffer.from("\x89PNX\r\n\x1a\n", "latin1"), "png").complete).toBe(false);
    expect(inspectStructure(Buffer.from("RIFF\x04\x00\x00\x00WAVE", "latin1"), "webp").complete).toBe(false);
  });
});

describe("polyglot signals", () => {
  it("sees a ZIP directory at the end of an archive and of an image with an archive appended", async () => {
    const zip = storedZip("a.txt", Buffer.from("hello"));
    expect((await fileTypeFromBuffer(zip))?.ext).toBe("zip"); // reference: file-type agrees it is a ZIP
    expect(endsWithZipDirectory(zip)).toBe(true);
    expect(endsWithZipDirectory(Buffer.concat([await noisyJpeg(100, 100), zip]))).toBe(true);
  });

  it("sees no ZIP directory in ordinary images or random bytes", () => {
    for (const s of samples) expect(endsWithZipDirectory(s.bytes), s.name).toBe(false);
    fc.assert(fc.property(fc.uint8Array({ minLength: 0, maxLength: 2000 }), (bytes) => !endsWithZipDirectory(bytes)));
  });

  it("finds markup and script, not the XMP and EXIF of an ordinary photo", async () => {
    for (const text of ["<script>x</script>", "<HTML>", "<?php echo 1;", "<svg onload=x>", "<!DOCTYPE html>", "<iframe src=x>", "javascript:alert(1)"]) {
      expect(containsActiveContent(Buffer.from(`\x00\x01${text}\x02`, "latin1")), text).toBe(true);
    }
    const photo = await jpegWithGpsExif(320, 240);
    const result = inspectStructure(photo, "jpeg");
    expect(result.complete).toBe(true);
    if (result.complete) for (const r of result.sideData) expect(containsActiveContent(photo.subarray(r.start, r.end))).toBe(false);
  });

  it("treats runs of 0x00 or 0xFF as padding and anything else as data", () => {
    expect(isPadding(Buffer.alloc(64))).toBe(true);
    expect(isPadding(Buffer.alloc(64, 0xff))).toBe(true);
    expect(isPadding(Buffer.from([0, 0, 1]))).toBe(false);
    expect(isPadding(Buffer.from("PK"))).toBe(false);
  });
});
