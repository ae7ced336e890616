import { describe, expect, it } from "vitest";
import { fallbackWidth, IMAGE_WIDTHS, imageKeyPrefix, imageSrcSet, imageUrl, variantKey } from "@/lib/storage/image-urls";

const ID = "3f1e2f4c-9d10-4c59-9a57-0b8f3a526b0c";

describe("image URLs", () => {
  it("builds a srcset of width descriptors, narrowest first (HTML Standard §4.8.4.2: `url Nw`, comma-separated)", () => {
    const srcset = imageSrcSet(ID, [640, 160, 320, 160]);
    expect(srcset).toBe(`/api/images/${ID}/160.webp 160w, /api/images/${ID}/320.webp 320w, /api/images/${ID}/640.webp 640w`);
    // Each candidate parses back per the spec's grammar: a URL, whitespace, a valid non-negative integer, "w".
    for (const candidate of srcset.split(", ")) expect(candidate).toMatch(/^\S+ [1-9]\d*w$/);
  });

  it("addresses the serving route and the stored keys the same way", () => {
    expect(imageUrl(ID, 320)).toBe(`/api/images/${ID}/320.webp`);
    expect(variantKey(ID, 320)).toBe(`images/${ID}/320.webp`);
    expect(variantKey(ID, 320).startsWith(`${imageKeyPrefix(ID)}/`)).toBe(true);
    // The route accepts /^(\d+)\.webp$/ for widths in IMAGE_WIDTHS (app/api/images/[id]/[file]/route.ts).
    for (const w of IMAGE_WIDTHS) expect(imageUrl(ID, w).split("/").at(-1)).toMatch(/^(\d+)\.webp$/);
  });

  it("picks the fallback src as the narrowest width that covers the target, else the widest", () => {
    expect(fallbackWidth([160, 320, 640, 1280])).toBe(640);
    expect(fallbackWidth([160, 320])).toBe(320);
    expect(fallbackWidth([160, 320, 640, 1280], 700)).toBe(1280);
    expect(fallbackWidth([])).toBeUndefined();
  });
});
