"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ImageUploader } from "@/components/upload/image-uploader";
import type { UploadKind } from "@/lib/storage/upload-kinds";

/** The uploader for an object a server page shows: each stored photo refreshes the page so it appears there. */
export function RefreshingUploader({ kind, subjectId, existingCount, label }: { kind: UploadKind; subjectId: string; existingCount: number; label?: string }) {
  const router = useRouter();
  // The count when the uploader appeared: the uploader adds its own uploads to it, so later refreshes must not.
  const [initialCount] = useState(existingCount);
  return (
    <ImageUploader
      kind={kind}
      presignUrl="/api/v1/uploads/presign"
      completeUrl="/api/v1/uploads/complete"
      context={{ subjectId }}
      existingCount={initialCount}
      label={label}
      onUploaded={() => router.refresh()}
    />
  );
}
