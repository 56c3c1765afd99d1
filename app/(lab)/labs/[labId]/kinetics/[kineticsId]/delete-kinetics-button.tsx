"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError, sendJson } from "@/lib/client/api";

export function DeleteKineticsButton({ labId, kineticsId, name }: { labId: string; kineticsId: string; name: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  async function remove() {
    if (!confirm(`Delete “${name}” and all its versions?`)) return;
    try {
      await sendJson("DELETE", `/api/v1/labs/${labId}/kinetics/${kineticsId}`);
      router.push(`/labs/${labId}/kinetics`);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not delete the kinetics.");
    }
  }
  return (
    <>
      <Button variant="danger" onClick={remove} data-testid="delete-kinetics">
        Delete
      </Button>
      {error && <span className="text-xs text-brick">{error}</span>}
    </>
  );
}
