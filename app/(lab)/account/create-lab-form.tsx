"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";
import { labCreateSchema } from "@/lib/contracts/lab";

export function CreateLabForm() {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const form = useForm<z.input<typeof labCreateSchema>>({ resolver: zodResolver(labCreateSchema) });
  return (
    <form
      noValidate
      className="flex items-end gap-2"
      onSubmit={form.handleSubmit(async (v) => {
        setError(null);
        try {
          const lab = await sendJson<{ id: string }>("POST", "/api/v1/labs", v);
          router.push(`/labs/${lab.id}`);
          router.refresh();
        } catch (err) {
          setError(err instanceof ApiError ? err.message : "Could not create the lab.");
        }
      })}
    >
      <div className="flex-1">
        <TextField
          label="Start another lab"
          placeholder="Lab name"
          {...form.register("name")}
          error={form.formState.errors.name?.message ?? error ?? undefined}
        />
      </div>
      <Button type="submit" variant="secondary" data-testid="create-lab">
        Create lab
      </Button>
      {error && (
        <span className="sr-only">
          <Notice tone="error">{error}</Notice>
        </span>
      )}
    </form>
  );
}
