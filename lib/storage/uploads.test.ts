// Upload hardening against a real S3-compatible server (s3rver, started here on a free port in a temp
// directory). Fixtures are generated from their published formats (see hardening-fixtures.ts); what
// is stored is read back and checked with sharp and file-type (reference libraries) and with the
// WebP container rules of RFC 9649.
import { createHash, createHmac } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Forbidden, Invalid, NotFound } from "@/lib/errors";
import { startS3Server } from "@/scripts/fakes/s3-server";
import {
  elfExecutable,
  jpegWithGpsExif,
  jpegWithOrientation6,
  noisyJpeg,
  peExecutable,
  pngChunk,
  readJpegGps,
  storedZip,
  SVG_WITH_SCRIPT,
  webpChunks,
  withJpegComment,
  withPngChunk,
  withPngDimensions,
} from "@/lib/storage/hardening-fixtures";
import { variantKey } from "@/lib/storage/image-urls";
import { UploadRefused, type UploadRefusal } from "@/lib/storage/upload-errors";
import { UPLOAD_KINDS, type UploadKind } from "@/lib/storage/upload-kinds";
import { presignUpload, processUpload, sweepStaleUploads, uploadKey, type PresignInput, type Storage } from "@/lib/storage/uploads";

const BUCKET = "shoal-test-images";
const ORIGIN = "http://127.0.0.1:3000";
const FARMER = "farmer_01";
const BUILDER = "builder_01";
const ACCESS_KEY = "S3RVER"; // s3rver's built-in account
let dir: string;
let server: { url: string; close(): Promise<void> };
let storage: Storage;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "shoal-uploads-"));
  server = await startS3Server({ port: 0, directory: dir, bucket: BUCKET, allowedOrigins: [ORIGIN] });
  const s3 = new S3Client({
    endpoint: server.url,
    region: "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: ACCESS_KEY, secretAccessKey: ACCESS_KEY },
    // STACK-NOTES: with the default checksum settings s3rver stores aws-chunked bytes.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  storage = { s3, bucket: BUCKET };
});

afterAll(async () => {
  await server.close();
  rmSync(dir, { recursive: true, force: true });
});

type Owner = { id: string; roles: ("farmer" | "builder")[] };
const farmer: Owner = { id: FARMER, roles: ["farmer"] };

/**
 * Uploads the way the browser does: presign, then fetch PUT with the returned headers. `declared` is
 * the browser's word (type and size); s3rver does not check V4 signatures, so a lying browser's
 * bytes get stored, which is what the server-side checks are for.
 */
async function stage(bytes: Uint8Array, kind: UploadKind = "site-photo", declared: { type?: string; length?: number } = {}, owner: Owner = farmer) {
  const presigned = await presignUpload(storage, {
    kind,
    ownerId: owner.id,
    roles: owner.roles,
    contentType: declared.type ?? "image/jpeg",
    contentLength: declared.length ?? bytes.length,
    existingCount: 0,
  });
  const put = await fetch(presigned.url, { method: "PUT", headers: presigned.headers, body: new Uint8Array(bytes) });
  expect(put.status).toBe(200);
  return presigned.key;
}

async function exists(key: string): Promise<boolean> {
  try {
    await storage.s3.send(new HeadObjectCommand({ Bucket: BUCKET, Key: key }));
    return true;
  } catch (error) {
    if (error instanceof Error && (error.name === "NotFound" || error.name === "NoSuchKey")) return false;
    throw error;
  }
}

async function storedImageKeys(): Promise<string[]> {
  const page = await storage.s3.send(new ListObjectsV2Command({ Bucket: BUCKET, Prefix: "images/" }));
  return (page.Contents ?? []).map((c) => c.Key ?? "");
}

async function readObject(key: string): Promise<Buffer> {
  const out = await storage.s3.send(new GetObjectCommand({ Bucket: BUCKET, Key: key }));
  return Buffer.from((await out.Body?.transformToByteArray()) ?? []);
}

/** Refused with the given reason and message, original deleted, nothing stored under images/. */
async function expectRefused(key: string, reason: UploadRefusal, message: string, kind: UploadKind = "site-photo") {
  const before = await storedImageKeys();
  const error = await processUpload(storage, { kind, key, ownerId: FARMER, existingCount: 0 }).then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(UploadRefused);
  expect((error as UploadRefused).reason).toBe(reason);
  expect((error as UploadRefused).message).toBe(message);
  expect((error as UploadRefused).status).toBe(422);
  expect(await exists(key)).toBe(false);
  expect(await storedImageKeys()).toEqual(before);
}

/** Accepted: every variant read back is WebP with no EXIF, GPS, XMP, IPTC or ICC, and the original is gone. */
async function expectStoredClean(key: string, kind: UploadKind = "site-photo") {
  const result = await processUpload(storage, { kind, key, ownerId: FARMER, existingCount: 0 });
  expect(await exists(key)).toBe(false);
  const variants = [];
  for (const width of result.widths) {
    const data = await readObject(variantKey(result.imageId, width));
    expect(await fileTypeFromBuffer(data)).toEqual({ ext: "webp", mime: "image/webp" });
    const meta = await sharp(data).metadata();
    expect(meta.format).toBe("webp");
    expect(meta.width).toBe(width);
    // sharp exposes each metadata block it finds; none may be present.
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(meta.iptc).toBeUndefined();
    expect(meta.icc).toBeUndefined();
    expect(meta.hasProfile).toBe(false);
    // RFC 9649 §2.7: metadata lives in ICCP, EXIF and XMP chunks, announced by VP8X flag bits 0x20, 0x08, 0x04.
    const { chunks, vp8xFlags } = webpChunks(data);
    expect(chunks.filter((c) => !["VP8 ", "VP8L", "VP8X", "ALPH"].includes(c))).toEqual([]);
    expect((vp8xFlags ?? 0) & (0x20 | 0x08 | 0x04)).toBe(0);
    variants.push({ width, height: meta.height, data });
  }
  return { result, variants };
}

describe("presignUpload", () => {
  it("signs Content-Type, Content-Length and the owner metadata into the URL", async () => {
    const p = await presignUpload(storage, { kind: "site-photo", ownerId: FARMER, roles: ["farmer"], contentType: "image/png", contentLength: 12345, existingCount: 0 });
    const url = new URL(p.url);
    expect(p.key).toMatch(/^uploads\/tmp\/[0-9a-f-]{36}$/);
    expect(p.key).toBe(uploadKey(p.uploadId));
    expect(url.pathname).toBe(`/${BUCKET}/${p.key}`); // forcePathStyle
    expect(url.searchParams.get("X-Amz-SignedHeaders")).toBe("content-length;content-type;host;x-amz-meta-kind;x-amz-meta-owner");
    expect(url.searchParams.get("X-Amz-Expires")).toBe("600");
    expect(p.headers).toEqual({ "Content-Type": "image/png", "x-amz-meta-owner": FARMER, "x-amz-meta-kind": "site-photo" });
    expect(Date.parse(p.expiresAt) - Date.now()).toBeGreaterThan(590_000);
  });

  it("produces the SigV4 signature that a verifying server (S3, MinIO) computes for exactly the declared headers", async () => {
    const p = await presignUpload(storage, { kind: "avatar", ownerId: FARMER, roles: ["farmer"], contentType: "image/webp", contentLength: 4321, existingCount: 0 });
    const url = new URL(p.url);
    const headersSent = { ...lowerKeys(p.headers), "content-length": "4321", host: url.host };
    expect(sigV4PresignSignature(url, headersSent)).toBe(url.searchParams.get("X-Amz-Signature"));
    // A different body length or type gives a different signature, so the server refuses it.
    expect(sigV4PresignSignature(url, { ...headersSent, "content-length": "4322" })).not.toBe(url.searchParams.get("X-Amz-Signature"));
    expect(sigV4PresignSignature(url, { ...headersSent, "content-type": "text/html" })).not.toBe(url.searchParams.get("X-Amz-Signature"));
  });

  it("refuses up front by role, declared type, declared size and count, with the upload wording", async () => {
    const base: PresignInput = { kind: "site-photo", ownerId: FARMER, roles: ["farmer"], contentType: "image/jpeg", contentLength: 1000, existingCount: 0 };
    const refusal = (input: Partial<PresignInput>) =>
      presignUpload(storage, { ...base, ...input }).then(
        () => null,
        (e: unknown) => e,
      );
    expect(await refusal({ kind: "portfolio" })).toBeInstanceOf(Forbidden);
    expect(await refusal({ roles: ["hatchery"] })).toBeInstanceOf(Forbidden);
    for (const type of ["image/svg+xml", "image/gif", "text/html", "application/x-msdownload", "image/heic", ""]) {
      const e = await refusal({ contentType: type });
      expect(e).toBeInstanceOf(UploadRefused);
      expect((e as UploadRefused).message).toBe("This file is not a JPEG, PNG or WebP image"); // wording from the issue
    }
    expect(((await refusal({ contentLength: 0 })) as UploadRefused).reason).toBe("empty");
    const tooBig = (await refusal({ contentLength: 8 * 1024 * 1024 + 1 })) as UploadRefused;
    expect(tooBig.message).toBe("This photo is larger than 8 MB"); // wording from the issue
    expect(await refusal({ contentLength: 8 * 1024 * 1024 })).toBeNull(); // the limit itself is allowed
    expect(((await refusal({ existingCount: 6 })) as UploadRefused).message).toBe("A tank request can have at most 6 site photos.");
    expect(await refusal({ contentLength: 1.5 })).toBeInstanceOf(Invalid);
  });
});

describe("a presigned PUT with fetch, as the browser sends it", () => {
  it("stores the original with the signed type and owner metadata, and completes into served variants", async () => {
    const jpeg = await noisyJpeg(1400, 900);
    const key = await stage(jpeg);
    const head = await storage.s3.send(new HeadObjectCommand({ Bucket: BUCKET, Key: key }));
    expect(head.ContentLength).toBe(jpeg.length);
    expect(head.ContentType).toBe("image/jpeg");
    expect(head.Metadata).toEqual({ owner: FARMER, kind: "site-photo" });
    expect(await readObject(key)).toEqual(jpeg); // plain bytes, not aws-chunked (STACK-NOTES)

    const { result, variants } = await expectStoredClean(key);
    expect(result.widths).toEqual([160, 320, 640, 1280]); // IMAGE_WIDTHS no wider than 1400
    expect(result.keyPrefix).toBe(`images/${result.imageId}`);
    expect([result.width, result.height]).toEqual([1280, Math.round((1280 * 900) / 1400)]);
    for (const v of variants) expect(v.height).toBe(Math.round((v.width * 900) / 1400)); // aspect ratio kept
  });

  it("answers the browser's CORS preflight for the signed headers from the app's origin only", async () => {
    const p = await presignUpload(storage, { kind: "site-photo", ownerId: FARMER, roles: ["farmer"], contentType: "image/jpeg", contentLength: 10, existingCount: 0 });
    const preflight = (origin: string) =>
      fetch(p.url, {
        method: "OPTIONS",
        headers: { Origin: origin, "Access-Control-Request-Method": "PUT", "Access-Control-Request-Headers": "content-type,x-amz-meta-kind,x-amz-meta-owner" },
      });
    const ours = await preflight(ORIGIN);
    expect(ours.status).toBe(200);
    expect(ours.headers.get("access-control-allow-methods")).toContain("PUT");
    expect(ours.headers.get("access-control-allow-headers")).toBe("content-type, x-amz-meta-kind, x-amz-meta-owner");
    expect((await preflight("http://evil.example")).status).toBe(403);
  });
});

describe("upload hardening (issue list)", () => {
  it("a JPEG with GPS EXIF is stored with no metadata at all", async () => {
    const jpeg = await jpegWithGpsExif(800, 600);
    // The fixture really carries GPS (read per Exif 2.32), XMP and an ICC profile (sharp).
    const gps = readJpegGps(jpeg);
    expect(gps?.latitude).toBeCloseTo(-(15 + 25 / 60), 6);
    expect(gps?.longitude).toBeCloseTo(28 + 17 / 60, 6);
    const inMeta = await sharp(jpeg).metadata();
    expect(inMeta.exif).toBeDefined();
    expect(inMeta.xmp).toBeDefined();
    expect(inMeta.icc).toBeDefined();

    const { result, variants } = await expectStoredClean(await stage(jpeg));
    expect(result.widths).toEqual([160, 320, 640]);
    for (const v of variants) {
      // expectStoredClean has checked the container holds no EXIF, XMP or ICCP chunk (RFC 9649 §2.7). Here only
      // the fixture's long marker strings are searched for: a short one such as "GPS" now and then matches
      // compressed image bytes by chance (it failed a CI run that way).
      const text = v.data.toString("latin1");
      for (const trace of ["ShoalTestCam", "xmpmeta"]) expect(text).not.toContain(trace);
    }
  });

  it("applies the EXIF orientation before stripping it, so a sideways photo is stored upright", async () => {
    const { result, variants } = await expectStoredClean(await stage(await jpegWithOrientation6(600, 300)));
    expect(result.widths).toEqual([160]); // upright it is 300 wide
    expect(variants[0]?.height).toBe(320); // 160 × 600 / 300
  });

  it("a renamed ELF executable is refused", async () => {
    const elf = elfExecutable();
    expect((await fileTypeFromBuffer(elf))?.ext).toBe("elf");
    await expectRefused(await stage(elf), "not-an-image", "This file is not a JPEG, PNG or WebP image");
  });

  it("a renamed Windows PE executable is refused", async () => {
    const exe = peExecutable();
    expect((await fileTypeFromBuffer(exe))?.ext).toBe("exe");
    await expectRefused(await stage(exe), "not-an-image", "This file is not a JPEG, PNG or WebP image");
  });

  it("an SVG with a script is refused, even when the browser calls it a PNG", async () => {
    await expectRefused(await stage(SVG_WITH_SCRIPT, "site-photo", { type: "image/png" }), "not-an-image", "This file is not a JPEG, PNG or WebP image");
  });

  const POLYGLOT = "This file holds something besides the image (such as an archive, a web page or a script), so it cannot be used.";

  it("a JPEG+ZIP polyglot is refused (it decodes as a JPEG and opens as a ZIP)", async () => {
    const jpeg = await noisyJpeg(400, 300);
    const zip = storedZip("shell.php", Buffer.from("<?php system($_GET['c']); ?>"));
    const polyglot = Buffer.concat([jpeg, zip]);
    expect((await fileTypeFromBuffer(polyglot))?.ext).toBe("jpg");
    expect((await fileTypeFromBuffer(zip))?.ext).toBe("zip");
    await expect(sharp(polyglot, { failOn: "error" }).toBuffer()).resolves.toBeInstanceOf(Buffer); // a decoder alone lets it through
    await expectRefused(await stage(polyglot), "polyglot", POLYGLOT);
  });

  it("a JPEG+HTML polyglot (markup in a comment segment) is refused", async () => {
    const polyglot = withJpegComment(await noisyJpeg(400, 300), "<html><body><script>alert(document.cookie)</script></body></html>");
    await expect(sharp(polyglot, { failOn: "error" }).toBuffer()).resolves.toBeInstanceOf(Buffer);
    await expectRefused(await stage(polyglot), "polyglot", POLYGLOT);
  });

  it("a JPEG with PHP after its end marker is refused", async () => {
    const polyglot = Buffer.concat([await noisyJpeg(400, 300), Buffer.from("<?php echo shell_exec($_GET['x']); ?>")]);
    await expectRefused(await stage(polyglot), "polyglot", POLYGLOT);
  });

  it("a PNG with a script in a text chunk is refused", async () => {
    const png = await sharp({ create: { width: 300, height: 200, channels: 4, background: "#3a7" } }).png().toBuffer();
    const polyglot = withPngChunk(png, pngChunk("tEXt", Buffer.from("Comment\0<svg onload=alert(1)><script>alert(1)</script>", "latin1")));
    await expectRefused(await stage(polyglot, "site-photo", { type: "image/png" }), "polyglot", POLYGLOT);
  });

  it("tolerates camera trailers (a second JPEG, vendor bytes) and drops them", async () => {
    const trailer = Buffer.concat([await noisyJpeg(160, 160), Buffer.from("SEFH\x01\x00\x00\x00vendor data", "latin1")]);
    const withTrailer = Buffer.concat([await noisyJpeg(500, 400), trailer]);
    const { result } = await expectStoredClean(await stage(withTrailer));
    expect(result.widths).toEqual([160, 320]);
  });

  it("an oversized file is refused even when the browser declared a small one", async () => {
    const jpeg = await noisyJpeg(200, 200);
    const oversized = Buffer.concat([jpeg, Buffer.alloc(8 * 1024 * 1024 + 1 - jpeg.length)]);
    await expectRefused(await stage(oversized, "site-photo", { length: 1000 }), "too-large", "This photo is larger than 8 MB");
  });

  it("a zero-byte file is refused", async () => {
    await expectRefused(await stage(new Uint8Array(0), "site-photo", { length: 100 }), "empty", "This file is empty (0 bytes). Choose the photo again.");
  });

  it("a truncated JPEG is refused", async () => {
    const jpeg = await noisyJpeg(600, 400);
    const truncated = jpeg.subarray(0, Math.floor(jpeg.length * 0.6));
    expect((await fileTypeFromBuffer(truncated))?.ext).toBe("jpg"); // its magic bytes still say JPEG
    await expect(sharp(truncated, { failOn: "truncated" }).toBuffer()).rejects.toThrow(); // libvips agrees it is cut off
    await expectRefused(await stage(truncated), "damaged", "This image is incomplete or damaged. Save or export it again, or choose another photo.");
  });

  it("truncated PNG and WebP files are refused", async () => {
    const png = await sharp(await noisyJpeg(400, 300)).png().toBuffer();
    const webp = await sharp(await noisyJpeg(400, 300)).webp().toBuffer();
    await expectRefused(await stage(png.subarray(0, png.length - 100), "site-photo", { type: "image/png" }), "damaged", "This image is incomplete or damaged. Save or export it again, or choose another photo.");
    await expectRefused(await stage(webp.subarray(0, webp.length - 100), "site-photo", { type: "image/webp" }), "damaged", "This image is incomplete or damaged. Save or export it again, or choose another photo.");
  });

  it("a decompression bomb (a small PNG claiming 10000 × 10000) is refused before decoding", async () => {
    const png = await sharp({ create: { width: 200, height: 200, channels: 3, background: "#000" } }).png().toBuffer();
    // 100 MP is under sharp's own default limit (0x3FFF² ≈ 268 MP), so only the kind's limit stops it.
    const bomb = withPngDimensions(png, 10_000, 10_000);
    expect(bomb.length).toBeLessThan(10_000);
    const declared = await sharp(bomb).metadata();
    expect([declared.width, declared.height]).toEqual([10_000, 10_000]);
    await expectRefused(await stage(bomb, "site-photo", { type: "image/png" }), "too-many-pixels", "This image has too many pixels: at most 50 megapixels.");
  });

  it("an image smaller than the smallest served width is refused", async () => {
    await expectRefused(await stage(await noisyJpeg(120, 400)), "too-small", "This image is too small: it must be at least 160 × 160 pixels.");
  });

  it("accepts PNG with transparency and WebP, stored as metadata-free WebP", async () => {
    const png = await sharp({ create: { width: 700, height: 500, channels: 4, background: { r: 10, g: 90, b: 200, alpha: 0.5 } } }).png().toBuffer();
    const webp = await sharp(await noisyJpeg(700, 500)).webp().toBuffer();
    const fromPng = await expectStoredClean(await stage(png, "site-photo", { type: "image/png" }));
    expect((await sharp(fromPng.variants[0]?.data).metadata()).hasAlpha).toBe(true);
    const fromWebp = await expectStoredClean(await stage(webp, "site-photo", { type: "image/webp" }));
    expect(fromWebp.result.widths).toEqual([160, 320, 640]);
  });
});

describe("processUpload: whose upload, which kind, how many", () => {
  it("refuses someone else's upload and leaves it in place", async () => {
    const key = await stage(await noisyJpeg(300, 300));
    const e = await processUpload(storage, { kind: "site-photo", key, ownerId: "farmer_02", existingCount: 0 }).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(Forbidden);
    expect(await exists(key)).toBe(true);
    const wrongKind = await processUpload(storage, { kind: "review-photo", key, ownerId: FARMER, existingCount: 0 }).catch((x: unknown) => x);
    expect(wrongKind).toBeInstanceOf(Forbidden);
  });

  it("refuses an original stored without the signed owner metadata", async () => {
    const key = uploadKey("0b8f3a52-6b0c-4c59-9a57-3f1e2f4c9d10");
    await storage.s3.send(new PutObjectCommand({ Bucket: BUCKET, Key: key, Body: await noisyJpeg(300, 300), ContentType: "image/jpeg" }));
    expect(await processUpload(storage, { kind: "site-photo", key, ownerId: FARMER, existingCount: 0 }).catch((x: unknown) => x)).toBeInstanceOf(Forbidden);
  });

  it("checks the count again at completion and deletes the original", async () => {
    const key = await stage(await noisyJpeg(300, 300));
    await expect(processUpload(storage, { kind: "site-photo", key, ownerId: FARMER, existingCount: 6 })).rejects.toThrow("A tank request can have at most 6 site photos.");
    expect(await exists(key)).toBe(false);
  });

  it("answers NotFound for an expired or unknown upload and Invalid for a key outside uploads/tmp/", async () => {
    const missing = uploadKey("7d5c2a10-1111-4222-8333-944445555666");
    expect(await processUpload(storage, { kind: "site-photo", key: missing, ownerId: FARMER, existingCount: 0 }).catch((x: unknown) => x)).toBeInstanceOf(NotFound);
    for (const key of ["images/7d5c2a10-1111-4222-8333-944445555666/160.webp", "uploads/tmp/../images/x", "uploads/tmp/"]) {
      expect(await processUpload(storage, { kind: "site-photo", key, ownerId: FARMER, existingCount: 0 }).catch((x: unknown) => x)).toBeInstanceOf(Invalid);
    }
  });

  it("lets a builder complete a portfolio photo with the kind's widths", async () => {
    const builder: Owner = { id: BUILDER, roles: ["builder"] };
    const key = await stage(await noisyJpeg(2000, 1500), "portfolio", {}, builder);
    const result = await processUpload(storage, { kind: "portfolio", key, ownerId: BUILDER, existingCount: UPLOAD_KINDS.portfolio.maxCount - 1 });
    expect(result.widths).toEqual([...UPLOAD_KINDS.portfolio.widths]);
    expect(await exists(key)).toBe(false);
  });
});

describe("sweepStaleUploads", () => {
  it("deletes abandoned originals and nothing under images/", async () => {
    const keep = await storedImageKeys();
    expect(keep.length).toBeGreaterThan(0);
    const abandoned = [await stage(await noisyJpeg(200, 200)), await stage(await noisyJpeg(200, 200))];
    expect(await sweepStaleUploads(storage, { olderThanMs: 20 * 60_000 })).toBe(0); // just uploaded: not stale yet
    const swept = await sweepStaleUploads(storage, { olderThanMs: 20 * 60_000, now: new Date(Date.now() + 60 * 60_000) });
    expect(swept).toBeGreaterThanOrEqual(abandoned.length); // the refused-owner originals above are stale too
    for (const key of abandoned) expect(await exists(key)).toBe(false);
    expect(await storedImageKeys()).toEqual(keep);
  });
});

function lowerKeys(headers: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(headers).map(([k, v]) => [k.toLowerCase(), v]));
}

/**
 * The signature of a presigned request, computed from AWS's published algorithm ("Authenticating
 * Requests: Using Query Parameters (AWS Signature Version 4)", S3 API reference): canonical request
 * with UNSIGNED-PAYLOAD, string to sign, and the HMAC-SHA256 key chain date → region → service → aws4_request.
 */
function sigV4PresignSignature(url: URL, headers: Record<string, string>): string {
  const q = url.searchParams;
  const signed = (q.get("X-Amz-SignedHeaders") ?? "").split(";");
  const rfc3986 = (s: string) => encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  const query = [...q.entries()]
    .filter(([k]) => k !== "X-Amz-Signature")
    .map(([k, v]) => `${rfc3986(k)}=${rfc3986(v)}`)
    .sort()
    .join("&");
  const canonicalHeaders = signed.map((h) => `${h}:${(headers[h] ?? "").trim()}\n`).join("");
  const canonicalRequest = ["PUT", url.pathname, query, canonicalHeaders, signed.join(";"), "UNSIGNED-PAYLOAD"].join("\n");
  const amzDate = q.get("X-Amz-Date") ?? "";
  const [, date = "", region = "", service = ""] = (q.get("X-Amz-Credential") ?? "").split("/");
  const scope = `${date}/${region}/${service}/aws4_request`;
  const stringToSign = ["AWS4-HMAC-SHA256", amzDate, scope, createHash("sha256").update(canonicalRequest).digest("hex")].join("\n");
  const hmac = (key: Buffer | string, data: string) => createHmac("sha256", key).update(data).digest();
  const key = hmac(hmac(hmac(hmac(`AWS4${ACCESS_KEY}`, date), region), service), "aws4_request");
  return createHmac("sha256", key).update(stringToSign).digest("hex");
}
