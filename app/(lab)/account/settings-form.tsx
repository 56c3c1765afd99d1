"use client";
import { useState } from "react";
import { sendJson } from "@/lib/client/api";

export function SettingsForm({ notifyByEmail }: { notifyByEmail: boolean }) {
  const [on, setOn] = useState(notifyByEmail);
  const [saved, setSaved] = useState(false);
  return (
    <label className="flex items-center gap-3 text-sm">
      <input
        type="checkbox"
        checked={on}
        data-testid="notify-toggle"
        onChange={async (e) => {
          setOn(e.target.checked);
          setSaved(false);
          await sendJson("PATCH", "/api/v1/me", { notifyByEmail: e.target.checked });
          setSaved(true);
        }}
      />
      E-mail me about comments and finished jobs
      {saved && <span className="text-xs text-moss">saved</span>}
    </label>
  );
}
