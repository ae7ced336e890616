import "server-only";
import { S3Client } from "@aws-sdk/client-s3";
import { env } from "@/lib/env";
import { s3 } from "@/lib/storage/s3";
import type { Storage } from "@/lib/storage/uploads";

let presignClient: S3Client | undefined;

/**
 * The app's storage for uploads. Presigned URLs are signed for the endpoint the browser can reach
 * (S3_PUBLIC_ENDPOINT, e.g. MinIO published on the host while the app talks to it inside docker-compose);
 * without one, the browser uses the same endpoint as the server.
 */
export function appStorage(): Storage {
  if (!env.S3_PUBLIC_ENDPOINT) return { s3: s3(), bucket: env.S3_BUCKET };
  presignClient ??= new S3Client({
    endpoint: env.S3_PUBLIC_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return { s3: s3(), bucket: env.S3_BUCKET, presignS3: presignClient };
}
