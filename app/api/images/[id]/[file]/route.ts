import { IMAGE_WIDTHS, variantKey } from "@/lib/storage/variants";
import { getObject } from "@/lib/storage/s3";

const ID = /^[0-9a-f-]{36}$/;

/** Serves processed image variants only; originals are never stored under this prefix. */
export async function GET(_request: Request, { params }: { params: Promise<{ id: string; file: string }> }) {
  const { id, file } = await params;
  const width = Number(/^(\d+)\.webp$/.exec(file)?.[1]);
  if (!ID.test(id) || !(IMAGE_WIDTHS as readonly number[]).includes(width)) {
    return new Response("Not found", { status: 404 });
  }
  const object = await getObject(variantKey(id, width)).catch((error: unknown) => {
    console.error("[images] storage error", error);
    return undefined;
  });
  if (object === undefined) return new Response("Image storage is unavailable", { status: 503, headers: { "Retry-After": "5" } });
  if (!object) return new Response("Not found", { status: 404 });
  return new Response(object.body, {
    headers: {
      "Content-Type": "image/webp",
      "Cache-Control": "public, max-age=31536000, immutable",
      ...(object.contentLength ? { "Content-Length": String(object.contentLength) } : {}),
    },
  });
}
