import { describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/lib/catalog";
import { IMAGE_WIDTHS } from "@/lib/storage/image-urls";
import { refusalMessage, UPLOAD_REFUSALS, UploadRefused } from "@/lib/storage/upload-errors";
import { acceptAttribute, canUseUploadKind, formatBytes, isAllowedImageType, UPLOAD_KIND_NAMES, UPLOAD_KINDS } from "@/lib/storage/upload-kinds";

describe("upload kinds", () => {
  it("declares every kind with only the three registered image types", () => {
    // IANA media types registry: image/jpeg (RFC 2046), image/png, image/webp (RFC 9649 §6.1)
    for (const kind of UPLOAD_KIND_NAMES) {
      const spec = UPLOAD_KINDS[kind];
      expect(spec.kind).toBe(kind);
      expect([...spec.allowedTypes].sort()).toEqual(["image/jpeg", "image/png", "image/webp"]);
      expect(isAllowedImageType(spec, "image/svg+xml")).toBe(false);
      expect(isAllowedImageType(spec, "image/jpg")).toBe(false); // not a registered name
    }
  });

  it("re-encodes only at widths the image route serves, and never refuses an image that has a served width", () => {
    for (const spec of Object.values(UPLOAD_KINDS)) {
      for (const w of spec.widths) expect(IMAGE_WIDTHS as readonly number[]).toContain(w);
      expect(spec.minWidth).toBeGreaterThanOrEqual(IMAGE_WIDTHS[0]);
      expect(spec.widths[0]).toBe(IMAGE_WIDTHS[0]); // an image at the minimum width still gets one variant
      expect(spec.maxPixels).toBeGreaterThanOrEqual(spec.minWidth * spec.minHeight);
      expect(spec.maxCount).toBeGreaterThanOrEqual(1);
    }
  });

  it("gives each kind to the roles the design's role table names", () => {
    // /work/shared/DESIGN.md "People and roles": builders keep a portfolio and record completion with
    // photos; only farmers review and post tank requests (with the site); every account has a profile.
    const expected: Record<string, Role[]> = {
      avatar: [...ROLES],
      "site-photo": ["farmer"],
      portfolio: ["builder"],
      "completion-photo": ["builder"],
      "review-photo": ["farmer"],
    };
    for (const kind of UPLOAD_KIND_NAMES) {
      for (const role of ROLES) expect(canUseUploadKind([role], kind), `${role} → ${kind}`).toBe(expected[kind]?.includes(role));
    }
  });

  it("lets an account with several roles use what any of them allows", () => {
    // DESIGN.md: "many hatcheries also build tanks, and every provider can also farm"
    expect(canUseUploadKind(["hatchery", "builder"], "portfolio")).toBe(true);
    expect(canUseUploadKind(["hatchery"], "portfolio")).toBe(false);
    expect(canUseUploadKind([], "avatar")).toBe(false);
  });

  it("formats limits in binary units the way phones show file sizes", () => {
    // 1 MB here is 2^20 bytes (IEC 80000-13 calls it MiB; phones label it MB: common practice)
    expect(formatBytes(8 * 1048576)).toBe("8 MB");
    expect(formatBytes(1.5 * 1048576)).toBe("1.5 MB");
    expect(formatBytes(900 * 1024)).toBe("900 KB");
  });

  it("builds an accept attribute of MIME types and extensions (HTML Standard, input accept)", () => {
    expect(acceptAttribute(UPLOAD_KINDS.portfolio).split(",")).toEqual(["image/jpeg", ".jpg", ".jpeg", "image/png", ".png", "image/webp", ".webp"]);
  });
});

describe("refusal messages", () => {
  it("uses the issue's wording for type and size, and states each kind's own limits", () => {
    expect(refusalMessage("not-an-image", UPLOAD_KINDS["site-photo"])).toBe("This file is not a JPEG, PNG or WebP image");
    expect(refusalMessage("too-large", UPLOAD_KINDS["site-photo"])).toBe("This photo is larger than 8 MB");
    expect(refusalMessage("too-large", UPLOAD_KINDS.avatar)).toBe("This photo is larger than 5 MB");
    expect(refusalMessage("too-many-files", UPLOAD_KINDS.avatar)).toBe("A profile can have at most 1 profile photo.");
    expect(refusalMessage("too-many-files", UPLOAD_KINDS["completion-photo"])).toBe("A job can have at most 10 completion photos.");
  });

  it("maps every refusal to 422 with a distinct code and a sentence for the user", () => {
    const codes = new Set<string>();
    for (const reason of UPLOAD_REFUSALS) {
      const error = new UploadRefused(reason, UPLOAD_KINDS.portfolio, "detail for logs");
      expect(error.status).toBe(422);
      expect(error.message).not.toContain("detail for logs");
      expect(error.message).toMatch(/^(This|A) /); // a whole sentence addressed to the user, not a code
      codes.add(error.code);
    }
    expect(codes.size).toBe(UPLOAD_REFUSALS.length); // type-not-allowed and not-an-image share a message, not a code
  });
});
