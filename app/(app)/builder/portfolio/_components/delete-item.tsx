"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { deleteJson } from "@/lib/api/client";

export function DeleteItem({ itemId }: { itemId: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  return (
    <div>
      <Button
        type="button"
        variant="ghost"
        onClick={async () => {
          const result = await deleteJson(`/api/v1/portfolio/${itemId}`);
          if (!result.ok) return setError(result.message);
          router.refresh();
        }}
      >
        Remove from portfolio
      </Button>
      {error ? <p role="alert" className="text-sm text-clay-600">{error}</p> : null}
    </div>
  );
}
