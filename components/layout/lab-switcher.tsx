"use client";
import { useRouter } from "next/navigation";

export function LabSwitcher({
  labs,
  currentId,
}: {
  labs: { id: string; name: string; role: string }[];
  currentId?: string;
}) {
  const router = useRouter();
  if (labs.length === 0) return null;
  return (
    <select
      aria-label="Switch lab"
      data-testid="lab-switcher"
      value={currentId ?? ""}
      onChange={(e) => router.push(`/labs/${e.target.value}`)}
      className="max-w-56 rounded-md border border-rule bg-card px-2 py-1 text-sm"
    >
      {!currentId && <option value="">Choose a lab…</option>}
      {labs.map((l) => (
        <option key={l.id} value={l.id}>
          {l.name}
        </option>
      ))}
    </select>
  );
}
