import { readFile } from "node:fs/promises";
import { join } from "node:path";
import sharp from "sharp";

const SIZES = new Set([192, 512]);

/** Home-screen icons, drawn from the app's own SVG mark (app/icon.svg) and cached for a year. */
export async function GET(_request: Request, { params }: { params: Promise<{ size: string }> }) {
  const size = Number((await params).size);
  if (!SIZES.has(size)) return new Response("Not found", { status: 404 });
  const svg = await readFile(join(process.cwd(), "app", "icon.svg"));
  const png = await sharp(svg, { density: 72 * (size / 32) }).resize(size, size).png().toBuffer();
  return new Response(new Uint8Array(png), { headers: { "Content-Type": "image/png", "Cache-Control": "public, max-age=31536000, immutable" } });
}
