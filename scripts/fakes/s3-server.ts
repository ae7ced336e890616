import { mkdirSync } from "node:fs";
import { resolve } from "node:path";
import { fileURLToPath } from "node:url";
import S3rver from "s3rver";

export type S3ServerOptions = { port: number; host?: string; directory: string; bucket: string; allowedOrigins: string[] };

function corsXml(origins: string[]): string {
  // Browsers upload straight to storage with presigned PUTs, so the bucket must allow our origin.
  const rules = origins
    .map(
      (o) => `<CORSRule><AllowedOrigin>${o}</AllowedOrigin><AllowedMethod>PUT</AllowedMethod><AllowedMethod>GET</AllowedMethod>` +
        `<AllowedMethod>HEAD</AllowedMethod><AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds></CORSRule>`,
    )
    .join("");
  return `<CORSConfiguration>${rules}</CORSConfiguration>`;
}

/** s3rver, the embedded S3-compatible server, with our bucket created. */
export async function startS3Server(options: S3ServerOptions): Promise<{ url: string; close(): Promise<void> }> {
  mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({
    port: options.port,
    address: options.host ?? "127.0.0.1",
    directory: options.directory,
    silent: true,
    configureBuckets: [{ name: options.bucket, configs: [corsXml(options.allowedOrigins)] }],
  });
  const address = (await server.run()) as { address: string; port: number };
  return {
    url: `http://${address.address}:${address.port}`,
    close: async () => {
      await server.close();
    },
  };
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const appUrl = process.env.APP_URL ?? "http://localhost:3000";
  const twin = appUrl.includes("localhost") ? appUrl.replace("localhost", "127.0.0.1") : appUrl.replace("127.0.0.1", "localhost");
  startS3Server({
    port: Number(process.env.S3_FAKE_PORT ?? 4569),
    directory: resolve(process.env.S3_FAKE_DATA ?? "./data/s3"),
    bucket: process.env.S3_BUCKET ?? "shoal-images",
    allowedOrigins: [appUrl, twin],
  })
    .then((s) => console.log(`[s3] s3rver listening on ${s.url}`))
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
